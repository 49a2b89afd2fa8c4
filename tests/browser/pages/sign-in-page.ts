import type { Page } from "playwright-core";

/** Page object for /sign-in. */
export class SignInPage {
  constructor(private readonly page: Page) {}

  async open() {
    await this.page.goto("/sign-in");
    // The form is a client component: wait until React has hydrated it.
    await this.page.waitForLoadState("networkidle");
  }

  async signIn(email: string, password: string) {
    await this.page.getByLabel("E-mail").fill(email);
    await this.page.getByLabel("Password").fill(password);
    await this.page.getByRole("button", { name: "Sign in" }).click();
  }

  alert() {
    return this.page.locator("#sign-in-message");
  }
}

import type { Page } from "playwright-core";

/** Page object for /sign-in. */
export class SignInPage {
  constructor(private readonly page: Page) {}

  /** Opens /sign-in, with `from` (the page to return to) exactly as given when there is one. */
  async open(from?: string) {
    await this.page.goto(from === undefined ? "/sign-in" : `/sign-in?from=${encodeURIComponent(from)}`);
    // The form is a client component: wait until React has hydrated it.
    await this.page.waitForLoadState("networkidle");
  }

  async signIn(email: string, password: string) {
    await this.page.getByLabel("E-mail").fill(email);
    await this.page.getByLabel("Password").fill(password);
    await this.page.getByRole("button", { name: "Sign in" }).click();
  }

  /** Signs in with details that will be refused, and returns the message shown once the server has answered. */
  async refusedMessage(email: string, password: string): Promise<string> {
    // The form is a server action: a POST to this page. The old message is cleared when the form is sent.
    const answered = this.page.waitForResponse((r) => r.request().method() === "POST" && new URL(r.url()).pathname === "/sign-in");
    await this.signIn(email, password);
    await answered;
    return (await this.alert().textContent()) ?? "";
  }

  alert() {
    return this.page.locator("#sign-in-message");
  }
}

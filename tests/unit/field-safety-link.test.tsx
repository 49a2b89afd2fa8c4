import { render, screen, within } from "@testing-library/react";
import { describe, expect, it, vi } from "vitest";

// Only the frame is under test: the session check, the providers and the sign-out control are stand-ins.
vi.mock("@/lib/auth/guard", () => ({ requirePageActor: async () => ({ id: "v1", name: "Ada Lovelace", role: "volunteer" }) }));
vi.mock("@/components/field/field-providers", () => ({ FieldProviders: ({ children }: { children: React.ReactNode }) => children }));
vi.mock("@/components/shell/sign-out-button", () => ({ SignOutButton: () => null }));

const { default: FieldLayout } = await import("@/app/(field)/layout");

describe("the safety notice from every field screen", () => {
  it("is one tap away in the field area's own menu, whatever screen is open", async () => {
    render(await FieldLayout({ children: <p>any field screen</p> }));
    const menu = screen.getByRole("navigation", { name: "Main" });
    expect(within(menu).getByRole("link", { name: "Safety" })).toHaveAttribute("href", "/safety");
    expect(screen.getByText("any field screen")).toBeInTheDocument();
  });
});

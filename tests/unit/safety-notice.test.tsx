import { render, screen, within } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { SafetyNotice, safetyPoints } from "@/components/safety/safety-notice";

// The cautions themselves are common practice for volunteer fieldwork (lone working, heat, tides,
// ticks, access, protected species); the notice must defer to local law and licensed practice.

describe("fieldwork safety notice", () => {
  it("names lone working: route, expected return time and what happens if there is no check-in", () => {
    render(<SafetyNotice />);
    const lone = screen.getByText("Working alone.").closest("li")!;
    expect(lone).toHaveTextContent(/alone/);
    expect(lone).toHaveTextContent(/tell someone your route and the time you expect to be back/i);
    expect(lone).toHaveTextContent(/if you have not checked in by then/i);
    expect(lone).toHaveTextContent(/emergency services/i);
  });

  it("keeps lone working and heat in the compact version on the field home", () => {
    render(<SafetyNotice compact />);
    const notice = screen.getByTestId("safety-notice");
    expect(within(notice).getByText("Working alone.").closest("li")).toHaveTextContent(/route.*back.*check in/i);
    expect(within(notice).getByText("Weather and heat.").closest("li")).toHaveTextContent(/\bheat\b/i);
    expect(within(notice).getByRole("link", { name: "Read the full safety notice" })).toHaveAttribute("href", "/safety");
  });

  it("never renders a sentence ending in two full stops, in either version", () => {
    for (const compact of [false, true]) {
      const { unmount } = render(<SafetyNotice compact={compact} />);
      for (const item of screen.getAllByRole("listitem")) expect(item.textContent).not.toMatch(/\.\.(?!\.)/);
      unmount();
    }
    for (const p of safetyPoints) for (const text of [p.short, p.text]) expect(text).toMatch(/[^.]\.$/);
  });

  it("defers to local law and licensed practice in both versions", () => {
    for (const compact of [false, true]) {
      const { unmount } = render(<SafetyNotice compact={compact} />);
      const notice = screen.getByTestId("safety-notice");
      expect(notice).toHaveTextContent(/local law/i);
      expect(notice).toHaveTextContent(/licensed practice/i);
      expect(notice).toHaveTextContent(/not legal advice/i);
      unmount();
    }
  });

  it("tells the volunteer not to handle protected species without a licence", () => {
    render(<SafetyNotice compact />);
    expect(screen.getByText("Protected species.").closest("li")).toHaveTextContent(/without a licence\.$/);
  });
});

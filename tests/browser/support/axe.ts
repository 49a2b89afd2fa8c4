import AxeBuilder from "@axe-core/playwright";
import type { Page } from "playwright-core";

/** Serious and critical axe-core violations on the page (WCAG 2.x A/AA rules). */
export async function seriousViolations(page: Page) {
  // @axe-core/playwright types its Page against @playwright/test; playwright-core's is the same object.
  const results = await new AxeBuilder({ page: page as never }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]).analyze();
  return results.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(" ")).join("; ")})`);
}

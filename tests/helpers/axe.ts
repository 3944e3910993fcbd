// Accessibility check of the page as it stands once it has settled: axe-core's serious and
// critical violations, as short strings a failing test prints.
//
// It waits for the network to go quiet and the document to carry its <title> first: after a
// server action the page refreshes itself (router.refresh), and axe run in the middle of that
// swap can see the head between two renders (a missing <title> was reported once that way).
import AxeBuilder from "@axe-core/playwright";
import type { Page } from "playwright-core";

export async function seriousViolations(page: Page, label = ""): Promise<string[]> {
  await page.waitForLoadState("networkidle");
  await page.waitForFunction(() => document.title.trim() !== "");
  const result = await new AxeBuilder({ page }).analyze();
  return result.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map((v) => `${label ? `${label}: ` : ""}${v.id}: ${v.help} (${v.nodes.length})`);
}

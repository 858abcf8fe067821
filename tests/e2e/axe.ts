import AxeBuilder from "@axe-core/playwright";
import { expect, type Page } from "@playwright/test";

// Accessibility checks with axe-core (@axe-core/playwright): WCAG 2.x A and AA rules.
const TAGS = ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22aa"];

/** One line per failing rule: what, how many nodes, and the first few selectors to find them. */
function describe(violations: Awaited<ReturnType<AxeBuilder["analyze"]>>["violations"]) {
  return violations.map(
    (v) =>
      `${v.impact} ${v.id}: ${v.help} (${v.nodes.length}×: ${v.nodes
        .slice(0, 3)
        .map((n) => n.target.join(" "))
        .join(" | ")})`,
  );
}

/**
 * Runs axe on the page as it stands and fails (softly, so every page of a journey is still checked)
 * on any serious or critical violation. `where` names the page and viewport in the failure.
 */
export async function expectAccessible(page: Page, where: string) {
  const results = await new AxeBuilder({ page }).withTags(TAGS).analyze();
  const serious = results.violations.filter((v) => v.impact === "serious" || v.impact === "critical");
  expect.soft(describe(serious), `axe: serious or critical violations on ${where}`).toEqual([]);
}

/** The page fits the viewport: nothing scrolls sideways except boxes that scroll on their own. */
export async function expectNoSideScroll(page: Page, width: number, where: string) {
  const scrollWidth = await page.evaluate(() => document.documentElement.scrollWidth);
  expect.soft(scrollWidth, `page width at ${width} px on ${where}`).toBeLessThanOrEqual(width);
}

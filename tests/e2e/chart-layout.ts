import { expect, type Locator, type Page } from "@playwright/test";

type Box = { x: number; y: number; width: number; height: number };
const apart = (a: Box, b: Box) => a.x + a.width <= b.x + 0.5 || b.x + b.width <= a.x + 0.5 || a.y + a.height <= b.y + 0.5 || b.y + b.height <= a.y + 0.5;

/**
 * Every bound chart in `scope`: the axis titles, the labels of the marker lines and the key cover
 * none of each other, and no label runs out of its chart (issue 12: they overlapped before).
 */
export async function expectChartsApart(page: Page, scope: Locator) {
  const figures = scope.locator('figure:has([data-chart-part="legend"])');
  const count = await figures.count();
  expect(count).toBeGreaterThan(0);
  for (let f = 0; f < count; f++) {
    const fig = figures.nth(f);
    await expect(fig.locator("svg.recharts-surface").first()).toBeVisible();
    const frame = (await fig.boundingBox())!;
    const parts: { name: string; box: Box }[] = [];
    for (const part of ["y-title", "x-title", "legend", "line-label"]) {
      const items = fig.locator(`[data-chart-part="${part}"]`);
      for (let i = 0; i < (await items.count()); i++) {
        const box = await items.nth(i).boundingBox();
        if (box) parts.push({ name: `${part} ${i} (${(await items.nth(i).textContent())?.slice(0, 40)})`, box });
      }
    }
    for (let i = 0; i < parts.length; i++) {
      const p = parts[i].box;
      expect(p.x >= frame.x - 1 && p.x + p.width <= frame.x + frame.width + 1, `${parts[i].name} inside its chart`).toBe(true);
      for (let j = i + 1; j < parts.length; j++) expect(apart(p, parts[j].box), `${parts[i].name} clear of ${parts[j].name}`).toBe(true);
    }
  }
  void page;
}

/** Waits until every chart in `scope` has redrawn at its container's width, as it does after the viewport changes. */
export async function chartsFollowTheirWidth(scope: Locator) {
  await expect
    .poll(() =>
      scope.locator(".recharts-responsive-container").evaluateAll((boxes) =>
        boxes.every((box) => {
          const svg = box.querySelector("svg.recharts-surface");
          return svg !== null && Math.abs(svg.getBoundingClientRect().width - box.getBoundingClientRect().width) <= 1;
        }),
      ),
    )
    .toBe(true);
}

/** The two widths the house style is checked at: a desktop and a phone. */
export const WIDTHS = [
  { name: "1440", width: 1440, height: 900 },
  { name: "390", width: 390, height: 844 },
] as const;

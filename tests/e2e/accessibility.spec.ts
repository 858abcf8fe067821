import { expect, test, type Page } from "@playwright/test";
import { expectAccessible, expectNoSideScroll } from "./axe";
import { ACCOUNTS, signIn } from "./helpers";
import { JOURNEY_TENDERS } from "./journey-tenders";

// Every page, as the role that sees it, passes axe with no serious or critical violation at a
// desktop width (1,440 px) and a phone width (390 px), and never scrolls sideways at 390 px.
// Read-only: it reads the demo's own tenders (the journeys' tenders, which change while it runs,
// are left out) on the fresh demo database beside the other journeys.

const WIDE = { width: 1440, height: 900 };
const PHONE = { width: 390, height: 844 };

/** Checks one page at both widths; waits for the grids and charts that draw after hydration. */
async function check(page: Page, path: string, who: string) {
  for (const viewport of [WIDE, PHONE]) {
    await page.setViewportSize(viewport);
    await page.goto(path);
    await page.waitForLoadState("networkidle");
    await expect(page.locator("h1").first()).toBeVisible();
    const where = `${path} as ${who} at ${viewport.width} px`;
    await expectAccessible(page, where);
    if (viewport === PHONE) await expectNoSideScroll(page, PHONE.width, where);
  }
}

/** Same-site links inside a region, as paths, without query or fragment. */
async function linksIn(page: Page, selector: string, prefix = "/"): Promise<string[]> {
  const hrefs = await page.locator(selector).evaluateAll((as) => as.map((a) => (a as HTMLAnchorElement).pathname));
  return [...new Set(hrefs.filter((h) => h.startsWith(prefix)))];
}

/** The paths of the journeys' own tenders that this person can read. */
async function journeyTenderPaths(page: Page): Promise<string[]> {
  const paths: string[] = [];
  for (const { reference } of Object.values(JOURNEY_TENDERS)) {
    const response = await page.request.get(`/api/v1/tenders?q=${reference}`);
    const list = response.ok() ? ((await response.json()) as { tenders: { id: string; reference: string }[] }) : { tenders: [] };
    paths.push(...list.tenders.filter((t) => t.reference === reference).map((t) => `/tenders/${t.id}`));
  }
  return paths;
}

/** The navigation's pages, every tender's tabs and the first detail page behind each list, for one role. */
async function pagesFor(page: Page): Promise<string[]> {
  await page.setViewportSize(WIDE);
  await page.goto("/desk");
  const pages = await linksIn(page, 'nav[aria-label="Main"] a');
  await page.goto("/tenders");
  const journeys = await journeyTenderPaths(page);
  const tenders = (await linksIn(page, "main a", "/tenders/")).filter((t) => !journeys.some((j) => t === j || t.startsWith(`${j}/`)));
  for (const tender of tenders.filter((t) => /^\/tenders\/[^/]+$/.test(t) && t !== "/tenders/new")) {
    await page.goto(tender);
    pages.push(...(await linksIn(page, 'nav[aria-label="Tender sections"] a')));
    pages.push(...(await linksIn(page, "main a", `${tender}/edit`)));
  }
  pages.push(...tenders.filter((t) => t === "/tenders/new"));
  if (pages.includes("/review")) {
    await page.goto("/review");
    // The queue fills after hydration; a role with no declared tender has none to open.
    await page
      .getByRole("link", { name: /^Open claim/ })
      .first()
      .waitFor({ timeout: 15_000 })
      .catch(() => undefined);
    pages.push(...(await linksIn(page, "main a", "/review/claims/")).slice(0, 1));
  }
  if (pages.includes("/people")) {
    await page.goto("/people");
    pages.push(...(await linksIn(page, "main a", "/organisations/")).slice(0, 1));
  }
  return [...new Set(pages)];
}

// One test for every role, so each path is checked once (by the first role here that reaches it);
// the checks are soft, so one failing page does not hide the next.
test("every page is accessible and fits a phone, as the role that sees it", async ({ browser }) => {
  test.setTimeout(20 * 60_000);
  const seen = new Set<string>();
  const visitor = await (await browser.newContext()).newPage();
  for (const path of ["/sign-in", "/memo-check"]) await check(visitor, path, "a visitor");
  await visitor.context().close();
  seen.add("/sign-in").add("/memo-check");
  // The director (approver and engineer) has declared on the gauges tender in the demo data, so reaches its claim pages.
  for (const role of ["admin", "buyer", "engineer", "approver", "director", "kestrelink"] as const) {
    const page = await (await browser.newContext()).newPage();
    await signIn(page, ACCOUNTS[role]);
    const reached = await pagesFor(page);
    expect(reached, `${role} reaches at least the desk`).toContain("/desk");
    for (const path of reached.filter((p) => !seen.has(p))) {
      seen.add(path);
      await check(page, path, role);
    }
    await page.context().close();
  }
  test.info().annotations.push({ type: "pages checked at 1,440 and 390 px", description: [...seen].join(" ") });
});

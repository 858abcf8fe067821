// Shared by the journeys that act on a tender of their own (journey-tenders.ts, written by prepare.ts).
import type { APIRequestContext, Browser, Page } from "@playwright/test";
import { signIn } from "./helpers";
import { JOURNEY_TENDERS, type Journey } from "./journey-tenders";

export { JOURNEY_TENDERS } from "./journey-tenders";

/** A signed-in page of its own (own cookies), so several people can act side by side. */
export async function pageAs(browser: Browser, email: string): Promise<Page> {
  const page = await (await browser.newContext({ acceptDownloads: true })).newPage();
  await signIn(page, email);
  return page;
}

/** The app's own address (playwright.config.ts): signed-in writes through the API must name it as their Origin. */
const ORIGIN = `http://localhost:${process.env.E2E_PORT ?? 3100}`;

export async function json(api: APIRequestContext, method: "get" | "post", url: string, data?: unknown) {
  const headers: Record<string, string> = method === "get" ? {} : { origin: ORIGIN };
  const response = await api[method](url, data === undefined ? { headers } : { data, headers });
  return { status: response.status(), body: await response.json().catch(() => null) };
}

/** The id of a journey's own tender, found by its reference as the signed-in person reads the list. */
export async function journeyTenderId(api: APIRequestContext, journey: Journey): Promise<string> {
  const { reference } = JOURNEY_TENDERS[journey];
  const list = (await json(api, "get", `/api/v1/tenders?q=${reference}`)).body;
  const found = list.tenders.find((t: { reference: string }) => t.reference === reference);
  if (!found) throw new Error(`${reference} is missing: tests/e2e/prepare.ts writes it before the server starts`);
  return found.id;
}

export async function tenderState(api: APIRequestContext, tenderId: string): Promise<string> {
  return (await json(api, "get", `/api/v1/tenders/${tenderId}`)).body.state;
}

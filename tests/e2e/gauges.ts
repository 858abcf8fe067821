// Shared by the journeys on the demo gauges tender (RC-2027-001) after its comparison.
import type { APIRequestContext, Browser, Page } from "@playwright/test";
import { signIn } from "./helpers";

export const REFERENCE = "RC-2027-001";

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

export async function gaugesTenderId(api: APIRequestContext): Promise<string> {
  const list = (await json(api, "get", `/api/v1/tenders?q=${REFERENCE}`)).body;
  return list.tenders.find((t: { reference: string }) => t.reference === REFERENCE).id;
}

export async function tenderState(api: APIRequestContext, tenderId: string): Promise<string> {
  return (await json(api, "get", `/api/v1/tenders/${tenderId}`)).body.state;
}

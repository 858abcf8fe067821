import { expect, test } from "@playwright/test";
import { ACCOUNTS, signIn } from "./helpers";

// The browser tests run a production build started with DEMO=1.
test("a demo build marks every page as a demo, signed out and signed in", async ({ page }) => {
  await page.goto("/sign-in");
  await expect(page.getByTestId("demo-marker")).toHaveText("demo");
  await page.goto("/memo-check");
  await expect(page.getByTestId("demo-marker")).toBeVisible();
  await signIn(page, ACCOUNTS.engineer);
  await expect(page.getByTestId("demo-marker")).toBeVisible();
});

test("the engine's worker threads start in the production build: the API judges a claim", async ({ page }) => {
  await signIn(page, ACCOUNTS.engineer);
  const claim = { channel: { model: "bsc", p: 1e-3 }, code: { n: 2048, k: 1640 }, target: { metric: "bler", value: 1e-4 } };
  const response = await page.request.post("/api/v1/evaluate", { data: claim, headers: { origin: new URL(page.url()).origin } });
  expect(response.status()).toBe(200);
  expect(await response.json()).toMatchObject({ verdict: expect.stringMatching(/^(impossible|needs-evidence|plausible)$/), engineVersion: expect.any(String) });
});

test("documents go through the local object store, signed with the data folder's key pair", async ({ page }) => {
  await signIn(page, ACCOUNTS.oxbow);
  const headers = { origin: new URL(page.url()).origin };
  const { tenders } = (await (await page.request.get("/api/v1/tenders?q=RC-2027-003")).json()) as { tenders: { id: string; reference: string }[] };
  const weirs = tenders.find((t) => t.reference === "RC-2027-003")!;
  const offer = {
    moduleName: "Oxbow OW-Weir",
    partNumber: "OW-W1",
    code: { family: "LDPC", decision: "hard", n: 2048, k: 1536 },
    claims: [{ pointIndex: 0, metric: "bler", value: 1e-5 }],
    envelope: { unitPrice: 61, currency: "EUR", leadTimeWeeks: 9, warrantyMonths: 24, priceBreaks: [] },
  };
  const submitted = await page.request.post(`/api/v1/tenders/${weirs.id}/offers`, { data: offer, headers });
  expect(submitted.status()).toBe(201);
  const { id } = (await submitted.json()) as { id: string };
  const pdf = Buffer.from("%PDF-1.4\n1 0 obj<</Type/Catalog>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n");
  const uploaded = await page.request.post(`/api/v1/offers/${id}/documents`, {
    headers,
    multipart: { kind: "datasheet", file: { name: "datasheet.pdf", mimeType: "application/pdf", buffer: pdf } },
  });
  expect(uploaded.status()).toBe(201);
  const document = (await uploaded.json()) as { id: string };
  const downloaded = await page.request.get(`/api/v1/documents/${document.id}`);
  expect(downloaded.status()).toBe(200);
  expect(Buffer.from(await downloaded.body())).toEqual(pdf);
});

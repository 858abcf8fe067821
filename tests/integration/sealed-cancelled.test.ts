// A tender cancelled while it was still open never reached its closing time: its offers stay
// sealed to the buying side for good (API, page loaders, Comparison), and the ledger says so.
// A tender cancelled after closing keeps what closing unsealed.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { claims, ledgerEntries, tenders } from "@/db/schema";
import type { Db } from "@/db/client";
import { GET as listGet, POST as submitPost } from "@/app/api/v1/tenders/[id]/offers/route";
import { GET as offerGet } from "@/app/api/v1/offers/[id]/route";
import { GET as claimGet } from "@/app/api/v1/claims/[id]/route";
import { GET as comparisonGet } from "@/app/api/v1/tenders/[id]/comparison/route";
import { POST as declarePost } from "@/app/api/v1/tenders/[id]/declaration/route";
import { POST as cancelPost } from "@/app/api/v1/tenders/[id]/cancel/route";
import { GET as ledgerGet } from "@/app/api/v1/tenders/[id]/ledger/route";
import { ledgerSentence } from "@/lib/ledger/reading";
import { getComparison } from "@/lib/server/comparison";
import { getOffer, listOffers } from "@/lib/server/offers";
import { getClaimDetail, listClaimQueue } from "@/lib/server/review";
import { requireViewer } from "@/lib/server/session";
import { closeDueTenders } from "@/lib/server/tenders";
import { closeDb, freshDatabase, params, request, signInAs } from "../support/app";
import { weirsOffer } from "../support/offer-fixtures";

let db: Db;
let weirs = "";
let offerId = "";
let claimId = "";
const BUYING_SIDE = ["buyer@tarnwell.example", "engineer@tarnwell.example", "approver@tarnwell.example", "admin@tarnwell.example"];
const REASON = "The weir programme moved to next year's budget.";

const cancel = async (tenderId: string) =>
  cancelPost(
    request(`/api/v1/tenders/${tenderId}/cancel`, { method: "POST", headers: await signInAs("buyer@tarnwell.example"), body: { reason: REASON } }),
    params({ id: tenderId }),
  );
const cancelEntry = async (tenderId: string) =>
  (
    await db
      .select()
      .from(ledgerEntries)
      .where(and(eq(ledgerEntries.tenderId, tenderId), eq(ledgerEntries.action, "tender.cancelled")))
  )[0];
const refused = async <T>(work: Promise<T>) =>
  work.then(
    () => "read",
    (error: Error) => error.message,
  );

beforeAll(async () => {
  db = await freshDatabase();
  [{ id: weirs }] = await db.select({ id: tenders.id }).from(tenders).where(eq(tenders.reference, "RC-2027-003"));
  const vendor = await signInAs("bids@oxbow.example");
  const submitted = await submitPost(
    request(`/api/v1/tenders/${weirs}/offers`, { method: "POST", headers: vendor, body: weirsOffer("Never unsealed") }),
    params({ id: weirs }),
  );
  expect(submitted.status).toBe(201);
  offerId = (await submitted.json()).id;
  [{ id: claimId }] = await db.select({ id: claims.id }).from(claims).where(eq(claims.offerId, offerId));
  for (const email of ["engineer@tarnwell.example", "approver@tarnwell.example"]) {
    const body = { conflict: "none", conflictedOrgIds: [], statement: "No interest in any vendor of this tender." };
    expect(
      (await declarePost(request(`/api/v1/tenders/${weirs}/declaration`, { method: "POST", headers: await signInAs(email), body }), params({ id: weirs })))
        .status,
    ).toBe(201);
  }
  expect((await cancel(weirs)).status).toBe(200);
});
afterAll(closeDb);

describe("a tender cancelled while open", () => {
  it.each(BUYING_SIDE)("keeps every offer sealed to %s through the API", async (email) => {
    const h = await signInAs(email);
    const listed = await listGet(request(`/api/v1/tenders/${weirs}/offers`, { headers: h }), params({ id: weirs }));
    if (listed.status === 200) expect(await listed.json()).toEqual([]);
    else expect(listed.status).toBe(403);
    const one = await offerGet(request(`/api/v1/offers/${offerId}`, { headers: h }), params({ id: offerId }));
    expect(one.status).toBe(403);
    expect(await one.text()).not.toContain("Never unsealed");
    const claim = await claimGet(request(`/api/v1/claims/${claimId}`, { headers: h }), params({ id: claimId }));
    expect([403, 404]).toContain(claim.status);
    const comparison = await comparisonGet(request(`/api/v1/tenders/${weirs}/comparison`, { headers: h }), params({ id: weirs }));
    expect(await comparison.text()).not.toContain("Never unsealed");
  });

  it.each(BUYING_SIDE)("keeps every offer sealed to %s in the pages' loaders", async (email) => {
    const viewer = await requireViewer(await signInAs(email));
    const listedOffers = await listOffers(viewer, weirs).catch(() => []);
    expect(listedOffers).toEqual([]);
    expect(await refused(getOffer(viewer, offerId))).not.toBe("read");
    expect(await refused(getClaimDetail(viewer, claimId))).not.toBe("read");
    // The count comes from the SQL form of the claim rules (lib/server/access-sql.ts), which must read the seal as the policies do.
    const queue = await listClaimQueue(viewer, { tenderId: weirs, page: 1, size: 100 }).then(
      (q) => ({ claims: q.claims, total: q.total }),
      () => ({ claims: [], total: 0 }),
    );
    expect(queue).toEqual({ claims: [], total: 0 });
    const comparison = await getComparison(viewer, weirs).then(
      (c) => JSON.stringify(c),
      () => "",
    );
    expect(comparison).not.toContain("Never unsealed");
  });

  it("tells the buyer why, and still shows the vendor its own offer", async () => {
    const h = await signInAs("buyer@tarnwell.example");
    const one = await offerGet(request(`/api/v1/offers/${offerId}`, { headers: h }), params({ id: offerId }));
    expect((await one.json()).error).toMatch(/sealed to the buying side/);
    const own = await offerGet(request(`/api/v1/offers/${offerId}`, { headers: await signInAs("bids@oxbow.example") }), params({ id: offerId }));
    expect(own.status).toBe(200);
    expect(await own.json()).toMatchObject({ moduleName: "Never unsealed" });
  });

  it("does not unseal when the closing time passes later", async () => {
    await db
      .update(tenders)
      .set({ closesAt: new Date(Date.now() - 1000) })
      .where(eq(tenders.id, weirs));
    await closeDueTenders(db);
    const offer = await offerGet(request(`/api/v1/offers/${offerId}`, { headers: await signInAs("buyer@tarnwell.example") }), params({ id: offerId }));
    expect(offer.status).toBe(403);
  });

  it("says in the ledger that the offers stay sealed", async () => {
    const entry = await cancelEntry(weirs);
    expect(entry.data).toMatchObject({ from: "open", offersSealed: true });
    expect(ledgerSentence(entry, "RC-2027-003")).toMatch(/offers stay sealed/);
    const page = await ledgerGet(request(`/api/v1/tenders/${weirs}/ledger`, { headers: await signInAs("admin@tarnwell.example") }), params({ id: weirs }));
    expect(await page.text()).toMatch(/offers stay sealed/);
  });
});

describe("a tender cancelled after closing", () => {
  it("keeps its technical offers readable to the buyer, and the ledger says they were unsealed", async () => {
    const [{ id: gauges }] = await db.select({ id: tenders.id }).from(tenders).where(eq(tenders.reference, "RC-2027-001"));
    expect((await cancel(gauges)).status).toBe(200);
    const listed = await listGet(request(`/api/v1/tenders/${gauges}/offers`, { headers: await signInAs("buyer@tarnwell.example") }), params({ id: gauges }));
    expect(listed.status).toBe(200);
    expect((await listed.json()).length).toBeGreaterThan(0);
    const entry = await cancelEntry(gauges);
    expect(entry.data).toMatchObject({ from: "technical", offersSealed: false });
    expect(ledgerSentence(entry, "RC-2027-001")).toMatch(/unsealed at closing/);
  });
});

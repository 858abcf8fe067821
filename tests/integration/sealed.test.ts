import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { claims, ledgerEntries, tenders } from "@/db/schema";
import type { Db } from "@/db/client";
import { GET as listGet, POST as submitPost } from "@/app/api/v1/tenders/[id]/offers/route";
import { GET as offerGet } from "@/app/api/v1/offers/[id]/route";
import { GET as claimGet } from "@/app/api/v1/claims/[id]/route";
import { POST as declarePost } from "@/app/api/v1/tenders/[id]/declaration/route";
import { closeDueTenders } from "@/lib/server/tenders";
import { closeDb, freshDatabase, params, request, signInAs } from "../support/app";
import { weirsOffer } from "../support/offer-fixtures";

let db: Db;
let weirs = "";
let offerId = "";
let claimId = "";

const offer = weirsOffer("Sealed module");
const list = (h: Headers) => listGet(request(`/api/v1/tenders/${weirs}/offers`, { headers: h }), params({ id: weirs }));
const getOffer = (h: Headers) => offerGet(request(`/api/v1/offers/${offerId}`, { headers: h }), params({ id: offerId }));
const getClaim = (h: Headers) => claimGet(request(`/api/v1/claims/${claimId}`, { headers: h }), params({ id: claimId }));

beforeAll(async () => {
  db = await freshDatabase();
  [{ id: weirs }] = await db.select({ id: tenders.id }).from(tenders).where(eq(tenders.reference, "RC-2027-003"));
  const vendor = await signInAs("bids@oxbow.example");
  const submitted = await submitPost(request(`/api/v1/tenders/${weirs}/offers`, { method: "POST", headers: vendor, body: offer }), params({ id: weirs }));
  expect(submitted.status).toBe(201);
  offerId = (await submitted.json()).id;
  [{ id: claimId }] = await db.select({ id: claims.id }).from(claims).where(eq(claims.offerId, offerId));
  // An engineer and an approver who declared while the tender was open.
  for (const email of ["engineer@tarnwell.example", "approver@tarnwell.example"]) {
    const h = await signInAs(email);
    const body = { conflict: "none", conflictedOrgIds: [], statement: "No interest in any vendor of this tender." };
    expect((await declarePost(request(`/api/v1/tenders/${weirs}/declaration`, { method: "POST", headers: h, body }), params({ id: weirs }))).status).toBe(201);
  }
});
afterAll(closeDb);

describe("while the tender is open", () => {
  it.each(["buyer@tarnwell.example", "engineer@tarnwell.example", "approver@tarnwell.example", "admin@tarnwell.example"])(
    "%s reads no offer and no claim of it",
    async (email) => {
      const h = await signInAs(email);
      const listed = await list(h);
      if (listed.status === 200) expect(await listed.json()).toEqual([]);
      else expect(listed.status).toBe(403);
      const one = await getOffer(h);
      expect(one.status).toBe(403);
      expect(await one.text()).not.toContain("Sealed module");
      const claim = await getClaim(h);
      expect([403, 404]).toContain(claim.status);
      expect(await claim.text()).not.toContain("Sealed module");
    },
  );

  it("says why to the buyer, and the vendor still reads its own offer", async () => {
    const refused = await (await getOffer(await signInAs("buyer@tarnwell.example"))).json();
    expect(refused.error).toMatch(/sealed to the buying side until the tender closes/);
    const own = await getOffer(await signInAs("bids@oxbow.example"));
    expect(own.status).toBe(200);
    expect(await own.json()).toMatchObject({ moduleName: "Sealed module", unitPrice: 52.5 });
  });
});

describe("at closing", () => {
  it("unseals the technical offers to the buying side, with a ledger entry, and keeps prices shut", async () => {
    await db
      .update(tenders)
      .set({ closesAt: new Date(Date.now() - 1000) })
      .where(eq(tenders.id, weirs));
    expect(await closeDueTenders(db)).toBe(1);
    const [entry] = await db
      .select()
      .from(ledgerEntries)
      .where(and(eq(ledgerEntries.tenderId, weirs), eq(ledgerEntries.action, "offers.unsealed")));
    expect(entry.actorLabel).toBe("system");
    expect(entry.data).toMatchObject({ offers: 1 });

    const buyer = await signInAs("buyer@tarnwell.example");
    const body = await (await list(buyer)).json();
    expect(body.map((o: { moduleName: string }) => o.moduleName)).toEqual(["Sealed module"]);
    expect(body[0]).not.toHaveProperty("unitPrice");
    expect((await getClaim(await signInAs("engineer@tarnwell.example"))).status).toBe(200);
  });
});

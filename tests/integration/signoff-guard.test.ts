import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { claims, ledgerEntries, marks, technicalSignoffs, tenders } from "@/db/schema";
import { POST as markPost } from "@/app/api/v1/claims/[id]/marks/route";
import { POST as threadPost } from "@/app/api/v1/claims/[id]/threads/route";
import { POST as evidencePost } from "@/app/api/v1/claims/[id]/evidence/route";
import { POST as closePost } from "@/app/api/v1/threads/[id]/close/route";
import { POST as declarePost } from "@/app/api/v1/tenders/[id]/declaration/route";
import { POST as signPost } from "@/app/api/v1/tenders/[id]/signoff/route";
import { GET as comparisonGet } from "@/app/api/v1/tenders/[id]/comparison/route";
import type { Comparison } from "@/lib/server/comparison";
import { closeDb, freshDatabase, params, request, signInAll } from "../support/app";
import { createCommercialTender, honest, impossible } from "../support/comparison-fixtures";

let db: Db;
const as: Record<string, Headers> = {};
const statement = { statement: "Every claim reviewed against the bounds and the lab runs." };

beforeAll(async () => {
  db = await freshDatabase();
  Object.assign(as, await signInAll("engineer", "director", "buyer"));
});
afterAll(closeDb);

const post = <T>(handler: (r: Request, c: { params: Promise<{ id: string }> }) => Promise<Response>, url: string, who: string, id: string, body: T) =>
  handler(request(url, { method: "POST", headers: as[who], body }), params({ id }));
const declare = (who: string, tenderId: string) =>
  post(declarePost, `/api/v1/tenders/${tenderId}/declaration`, who, tenderId, { conflict: "none", statement: "No ties to any invited vendor." });
const sign = (who: string, tenderId: string) => post(signPost, `/api/v1/tenders/${tenderId}/signoff`, who, tenderId, statement);
const mark = (who: string, claimId: string, body: unknown) => post(markPost, `/api/v1/claims/${claimId}/marks`, who, claimId, body);
const stateOf = async (id: string) => (await db.select().from(tenders).where(eq(tenders.id, id)))[0].state;
const ledgerFor = async (tenderId: string, action: string) =>
  (
    await db
      .select()
      .from(ledgerEntries)
      .where(and(eq(ledgerEntries.tenderId, tenderId), eq(ledgerEntries.action, action)))
  ).length;

async function technicalTender(offers: Parameters<typeof createCommercialTender>[1]["offers"], safetyRelevant = false) {
  const fixture = await createCommercialTender(db, { offers, signed: false });
  if (safetyRelevant) await db.update(tenders).set({ safetyRelevant: true }).where(eq(tenders.id, fixture.tenderId));
  for (const who of ["engineer", "director"]) expect((await declare(who, fixture.tenderId)).status).toBe(201);
  return fixture;
}

describe("accepting a claim the engine proved impossible", () => {
  it("needs a written justification, and is then flagged on the Comparison", async () => {
    const fx = await technicalTender([impossible("Wren", 30, 8, 24), honest("Yew", 40, 8, 24)]);
    const claimId = fx.claimIds[0][1];
    expect((await db.select().from(claims).where(eq(claims.id, claimId)))[0].verdict).toBe("impossible");
    const before = (await db.select().from(marks).where(eq(marks.claimId, claimId))).length;
    const bare = await mark("engineer", claimId, { mark: "accepted" });
    expect(bare.status).toBe(400);
    expect((await bare.json()).error).toMatch(/write a justification of at least 40 characters/);
    expect((await db.select().from(marks).where(eq(marks.claimId, claimId))).length).toBe(before);
    const justified = await mark("engineer", claimId, {
      mark: "accepted",
      comment: "The vendor's lab report shows the stated frame length was a typo; the real one is longer.",
    });
    expect(justified.status).toBe(201);
    const comparison: Comparison = await (
      await comparisonGet(request(`/api/v1/tenders/${fx.tenderId}/comparison`, { headers: as.buyer }), params({ id: fx.tenderId }))
    ).json();
    const wren = comparison.sheet.offers.find((o) => o.vendorName.startsWith("Wren"))!;
    expect(wren.flags.join(" ")).toMatch(/Accepted although the engine found it impossible \(Storm fade\)/);
  });
});

describe("the technical sign-off guard", () => {
  it("is refused while a question waits, and allowed once it is closed with a reason", async () => {
    const fx = await technicalTender([honest("Ash", 40, 8, 24)]);
    const claimId = fx.claimIds[0][0];
    const asked = await post(threadPost, `/api/v1/claims/${claimId}/threads`, "engineer", claimId, {
      subject: "Interleaver depth",
      body: "Which interleaver depth was used?",
    });
    expect(asked.status).toBe(201);
    const threadId = (await asked.json()).id;
    const refused = await sign("engineer", fx.tenderId);
    expect(refused.status).toBe(409);
    expect((await refused.json()).error).toMatch(/1 question to a vendor is neither answered nor closed/);
    expect(await db.select().from(technicalSignoffs).where(eq(technicalSignoffs.tenderId, fx.tenderId))).toHaveLength(0);
    expect(await stateOf(fx.tenderId)).toBe("technical");

    const short = await post(closePost, `/api/v1/threads/${threadId}/close`, "engineer", threadId, { reason: "no" });
    expect(short.status).toBe(400);
    const closed = await post(closePost, `/api/v1/threads/${threadId}/close`, "engineer", threadId, { reason: "Answered in the datasheet, section 4." });
    expect(closed.status).toBe(200);
    expect((await closed.json()).closeReason).toBe("Answered in the datasheet, section 4.");
    expect(await ledgerFor(fx.tenderId, "thread.closed")).toBe(1);
    expect((await post(closePost, `/api/v1/threads/${threadId}/close`, "engineer", threadId, { reason: "Answered in the datasheet, section 4." })).status).toBe(
      409,
    );
    expect((await sign("engineer", fx.tenderId)).status).toBe(201);
    expect(await stateOf(fx.tenderId)).toBe("commercial");
  });

  it("is refused while a claim's current mark only requests evidence", async () => {
    const fx = await technicalTender([honest("Elm", 40, 8, 24)]);
    expect((await mark("engineer", fx.claimIds[0][0], { mark: "evidence-requested", comment: "Send the bench report." })).status).toBe(201);
    const refused = await sign("engineer", fx.tenderId);
    expect(refused.status).toBe(409);
    expect((await refused.json()).error).toMatch(/1 claim has no final mark yet/);
  });
});

describe("a safety-relevant tender", () => {
  it("needs a verifying lab run for every accepted claim and two distinct engineers", async () => {
    const fx = await technicalTender([honest("Oak", 40, 8, 24, { claims: [{ value: 1e-5, evidence: "verified" }, { value: 1e-5 }] })], true);
    const refused = await sign("engineer", fx.tenderId);
    expect(refused.status).toBe(409);
    expect((await refused.json()).error).toMatch(/safety-relevant: 1 accepted claim has no lab run that verifies it/);
    const claimId = fx.claimIds[0][1];
    const run = await post(evidencePost, `/api/v1/claims/${claimId}/evidence`, "engineer", claimId, {
      channelValue: 5e-3,
      unit: "frames",
      trials: 2_000_000,
      errors: 0,
      confidence: 0.95,
    });
    expect((await run.json()).status).toBe("verified");

    expect((await sign("engineer", fx.tenderId)).status).toBe(201);
    expect(await stateOf(fx.tenderId)).toBe("technical");
    expect(await ledgerFor(fx.tenderId, "tender.technical-signature")).toBe(1);
    const again = await sign("engineer", fx.tenderId);
    expect(again.status).toBe(409);
    expect((await again.json()).error).toMatch(/needs a second engineer's signature/);
    expect((await sign("director", fx.tenderId)).status).toBe(201);
    expect(await stateOf(fx.tenderId)).toBe("commercial");
    expect(await ledgerFor(fx.tenderId, "tender.technical-signed")).toBe(1);
    expect(await db.select().from(technicalSignoffs).where(eq(technicalSignoffs.tenderId, fx.tenderId))).toHaveLength(2);
  });
});

// Past the engine's deadline every entry point answers clearly: the API names the claim, an offer
// keeps the claim with the reason, a lab file stores nothing. ENGINE_TEST_DELAY_MS stands in for a
// claim that never ends (the engine's own loops are fixed elsewhere).
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { POST as evaluatePost } from "@/app/api/v1/evaluate/route";
import { POST as submitPost } from "@/app/api/v1/tenders/[id]/offers/route";
import { POST as importPost } from "@/app/api/v1/claims/[id]/evidence/import/route";
import { GET as meGet } from "@/app/api/v1/me/route";
import type { Db } from "@/db/client";
import { claims, evidenceRuns, ledgerEntries, offers, tenders } from "@/db/schema";
import { closeEnginePool, warmEnginePool } from "@/lib/runtime/engine-pool";
import { closeDb, params, request } from "../support/app";
import { setEnv } from "../support/env";
import { declaredReviewBench, type ReviewFixtures } from "../support/review-fixtures";

let db: Db;
let fx: ReviewFixtures;
let as: Record<string, Headers>;

beforeAll(async () => {
  ({ db, fx, as } = await declaredReviewBench("oxbow"));
});
afterAll(async () => {
  await closeEnginePool();
  await closeDb();
});

let restore = () => {};
afterEach(async () => {
  restore();
  await closeEnginePool();
});

/** Starts the workers (their start-up is not what these tests time), then makes every job spin past the deadline. */
async function slowEngine(workers = 2) {
  const warming = setEnv({ ENGINE_WORKERS: String(workers), ENGINE_DEADLINE_MS: "120000" });
  await warmEnginePool();
  warming();
  restore = setEnv({ ENGINE_WORKERS: String(workers), ENGINE_DEADLINE_MS: "1500", ENGINE_TEST_DELAY_MS: "600000" });
}

const stuck = { channel: { model: "biawgn", ncgDb: -20 }, code: { n: 2048, rate: 0.5 }, target: { metric: "bler", value: 1e-10 } };
const honest = { channel: { model: "bsc", p: 1e-3 }, code: { n: 2048, k: 1640 }, target: { metric: "bler", value: 1e-4 } };
const evaluate = (body: unknown) => evaluatePost(request("/api/v1/evaluate", { method: "POST", headers: as.engineer, body }), undefined);

describe("POST /api/v1/evaluate past the deadline", () => {
  it("answers 422 naming the claim, in time, while other requests are served", async () => {
    await slowEngine();
    let answered = false;
    const slow = evaluate(stuck).finally(() => (answered = true));
    // Another request is served while the claim still spins: the engine does not hold the thread.
    const me = await meGet(request("/api/v1/me", { headers: as.engineer }), undefined);
    expect(me.status).toBe(200);
    expect(answered).toBe(false);
    // The deadline ends it: without one the claim would spin for ENGINE_TEST_DELAY_MS (ten minutes).
    const response = await slow;
    expect(response.status).toBe(422);
    const { error } = await response.json();
    expect(error).toMatch(/did not finish this claim \(BI-AWGN, net coding gain -20 dB; n = 2048, rate 0.5; BLER 1e-10\) within 1.5 s/);
    expect(error).toMatch(/check its values/);
  });

  it("names the position of the claim in a batch", async () => {
    await slowEngine();
    const response = await evaluate([stuck, honest]);
    expect(response.status).toBe(422);
    expect((await response.json()).error).toMatch(/did not finish claim \[0\] \(BI-AWGN.*no verdicts are returned/i);
  });

  it("answers 503 to a request that waited for busy workers", async () => {
    await slowEngine(1);
    // Whichever reaches the one worker first runs past the deadline (422); the other only waited (503).
    const answers = await Promise.all([evaluate(honest), evaluate(honest)]);
    expect(answers.map((a) => a.status).sort()).toEqual([422, 503]);
    const waited = answers.find((a) => a.status === 503)!;
    expect((await waited.json()).error).toMatch(/busy with other evaluations.*Try again in a moment/);
  });
});

describe("an offer whose claim the engine does not finish", () => {
  it("is stored, with the claim needing evidence and the reason beside it, not lost and not a 500", async () => {
    const [weirs] = await db.select().from(tenders).where(eq(tenders.reference, "RC-2027-003"));
    await slowEngine();
    const body = {
      moduleName: "Slow module",
      partNumber: "SM-1",
      code: { family: "LDPC", decision: "hard", n: 2048, k: 1536 },
      claims: [{ pointIndex: 0, metric: "bler", value: 1e-5 }],
      envelope: { unitPrice: 50, currency: "EUR", leadTimeWeeks: 8, warrantyMonths: 24, priceBreaks: [] },
    };
    const response = await submitPost(request(`/api/v1/tenders/${weirs.id}/offers`, { method: "POST", headers: as.oxbow, body }), params({ id: weirs.id }));
    expect(response.status).toBe(201);
    const offer = await response.json();
    expect(offer.claims[0]).toMatchObject({ verdict: "needs-evidence" });
    expect(offer.claims[0].keyFinding.message).toMatch(/did not finish the claim at .* within 1.5 s.*stored without a verdict of its own/);
    const [stored] = await db.select().from(claims).where(eq(claims.offerId, offer.id));
    expect(stored.verdict).toBe("needs-evidence");
    expect(stored.result).toMatchObject({ engineError: expect.stringMatching(/did not finish/) });
    const [row] = await db.select().from(offers).where(eq(offers.id, offer.id));
    expect(row.status).toBe("submitted");
    const [entry] = await db
      .select()
      .from(ledgerEntries)
      .where(and(eq(ledgerEntries.action, "offer.submitted"), eq(ledgerEntries.subjectId, offer.id)));
    expect(entry.data).toMatchObject({ summary: { "needs-evidence": 1 } });
  });
});

describe("a sensitivity claim with a curve that the engine does not finish", () => {
  it("is stored needing evidence, line and curve points alike without numbers, with the reason naming the curve", async () => {
    const [gateways] = await db.select().from(tenders).where(eq(tenders.reference, "RC-2027-004"));
    await slowEngine();
    const body = {
      moduleName: "Slow gateway",
      partNumber: "SG-1",
      code: { family: "LDPC", decision: "soft", rate: 0.5 },
      claims: [
        {
          pointIndex: 0,
          metric: "bler",
          value: 1e-2,
          sensitivity: {
            dbm: -133,
            curve: [
              { x: -135, unit: "dBm", metric: "per", value: 1e-1 },
              { x: 2, unit: "ebn0Db", metric: "bler", value: 1e-3 },
            ],
          },
        },
      ],
      envelope: { unitPrice: 150, currency: "EUR", leadTimeWeeks: 8, warrantyMonths: 24, priceBreaks: [] },
    };
    const response = await submitPost(
      request(`/api/v1/tenders/${gateways.id}/offers`, { method: "POST", headers: as.oxbow, body }),
      params({ id: gateways.id }),
    );
    expect(response.status).toBe(201);
    const offer = await response.json();
    const [stored] = await db.select().from(claims).where(eq(claims.offerId, offer.id));
    expect(stored.verdict).toBe("needs-evidence");
    expect(stored.result).toMatchObject({ engineError: expect.stringMatching(/did not finish the claim at Valley gateway and its 2 curve points/) });
    expect(stored.radio!.curve.map((p) => [p.verdict, p.marginDb])).toEqual([
      ["needs-evidence", null],
      ["needs-evidence", null],
    ]);
    expect(stored.radio!.worst).toMatchObject({ verdict: "needs-evidence", marginDb: null });
  });
});

describe("a lab file the engine does not finish checking", () => {
  it("answers 422 and stores nothing", async () => {
    const [target] = await db.select().from(claims).where(eq(claims.id, fx.evidenceClaimId));
    const unit = target.metric === "bler" ? "frames" : "bits";
    const before = await db.select().from(evidenceRuns);
    await slowEngine();
    const response = await importPost(
      request(`/api/v1/claims/${fx.evidenceClaimId}/evidence/import`, {
        method: "POST",
        headers: as.engineer,
        body: { csv: `unit,trials,errors,confidence\n${unit},400000,0,0.95\n` },
      }),
      params({ id: fx.evidenceClaimId }),
    );
    expect(response.status).toBe(422);
    expect((await response.json()).error).toMatch(/did not finish checking this lab file within 1.5 s.*Nothing was stored/);
    expect(await db.select().from(evidenceRuns)).toHaveLength(before.length);
  });
});

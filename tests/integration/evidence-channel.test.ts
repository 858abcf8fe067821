import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { claims, evidenceRuns } from "@/db/schema";
import { POST as evidencePost } from "@/app/api/v1/claims/[id]/evidence/route";
import { POST as importPost } from "@/app/api/v1/claims/[id]/evidence/import/route";
import { GET as comparisonGet } from "@/app/api/v1/tenders/[id]/comparison/route";
import type { Comparison } from "@/lib/server/comparison";
import { closeDb, params, request } from "../support/app";
import { declaredReviewBench, type ReviewFixtures } from "../support/review-fixtures";
import { createCommercialTender, honest } from "../support/comparison-fixtures";

let db: Db;
let fx: ReviewFixtures;
let as: Record<string, Headers>;

beforeAll(async () => {
  ({ db, fx, as } = await declaredReviewBench("buyer"));
});
afterAll(closeDb);

const claimRow = async (id: string) => (await db.select().from(claims).where(eq(claims.id, id)))[0];
const runsOf = async (id: string) => db.select().from(evidenceRuns).where(eq(evidenceRuns.claimId, id));
const record = (id: string, body: unknown) =>
  evidencePost(request(`/api/v1/claims/${id}/evidence`, { method: "POST", headers: as.engineer, body }), params({ id }));
const importCsv = (id: string, body: unknown) =>
  importPost(request(`/api/v1/claims/${id}/evidence/import`, { method: "POST", headers: as.engineer, body }), params({ id }));
const unitOf = (metric: string) => (metric === "bler" ? "frames" : "bits");

describe("a lab run counts only at the claim's channel or the right side of it", () => {
  it("stores a clean run a hundred times milder than the claim as inconclusive, and says why", async () => {
    const claim = await claimRow(fx.claimIds.quillfield[0]);
    const trials = Math.ceil(10 / claim.value);
    const response = await record(claim.id, { channelValue: claim.channelValue / 100, unit: unitOf(claim.metric), trials, errors: 0, confidence: 0.95 });
    expect(response.status).toBe(201);
    const run = await response.json();
    expect(run.status).toBe("inconclusive");
    expect(run.finding).toMatch(/milder than the claim's/);
    const atClaim = await (
      await record(claim.id, { channelValue: claim.channelValue, unit: unitOf(claim.metric), trials, errors: 0, confidence: 0.95 })
    ).json();
    expect(atClaim.status).toBe("verified");
  });

  it("refuses a channel outside the model's range and stores nothing", async () => {
    const claim = await claimRow(fx.claimIds.quillfield[1]);
    const before = (await runsOf(claim.id)).length;
    const response = await record(claim.id, { channelValue: 0.7, unit: unitOf(claim.metric), trials: 1000, errors: 0, confidence: 0.95 });
    expect(response.status).toBe(400);
    expect((await response.json()).error).toMatch(/out of range: raw BER p must be above 0 and at most 0.5/);
    expect((await runsOf(claim.id)).length).toBe(before);
  });

  it("previews a CSV file row by row without writing, then stores it when asked", async () => {
    const claim = await claimRow(fx.claimIds.oxbow[1]);
    const unit = unitOf(claim.metric);
    const trials = Math.ceil(10 / claim.value);
    const csv = `channel,unit,trials,errors\n${claim.channelValue},${unit},${trials},0\n${claim.channelValue / 100},${unit},${trials},0\n0.7,${unit},${trials},0\n`;
    const before = (await runsOf(claim.id)).length;
    const preview = await importCsv(claim.id, { csv, preview: true });
    expect(preview.status).toBe(200);
    const report = await preview.json();
    expect(report.preview).toBe(true);
    expect(report.stored.map((r: { status: string }) => r.status)).toEqual(["verified", "inconclusive"]);
    expect(report.stored[1].finding).toMatch(/milder/);
    expect(report.rejected[0].reasons[0]).toMatch(/out of range/);
    expect((await runsOf(claim.id)).length).toBe(before);
    const stored = await importCsv(claim.id, { csv });
    expect(stored.status).toBe(201);
    expect((await runsOf(claim.id)).length).toBe(before + 2);
  });
});

describe("the comparison's evidence score", () => {
  it("counts only runs that count: a verified run stored at a milder channel does not verify", async () => {
    const fixture = await createCommercialTender(db, {
      offers: [honest("Alder", 41, 10, 24, { claims: [{ value: 1e-5, evidence: "verified" }, { value: 1e-5 }] })],
      opened: true,
    });
    const read = async () => {
      const response = await comparisonGet(request(`/api/v1/tenders/${fixture.tenderId}/comparison`, { headers: as.buyer }), params({ id: fixture.tenderId }));
      expect(response.status).toBe(200);
      const comparison: Comparison = await response.json();
      return comparison.sheet.offers[0].lines.find((l) => l.criterion === "evidence")!;
    };
    expect((await read()).rawText).toMatch(/^1 verified/);
    // A run stored before the channel rule, at p = 1e-5 against the claim's 1e-3.
    await db.update(evidenceRuns).set({ channelValue: 1e-5 }).where(eq(evidenceRuns.claimId, fixture.claimIds[0][0]));
    const { appendLedger } = await import("@/lib/server/ledger");
    await db.transaction((tx) =>
      appendLedger(tx, {
        tenderId: fixture.tenderId,
        actor: { id: "test", label: "test" },
        action: "test.touched",
        subjectType: "Tender",
        subjectId: fixture.tenderId,
        data: {},
      }),
    );
    const line = await read();
    expect(line.rawText).toMatch(/^0 verified/);
    expect(line.normalised).toBe(50);
  });
});

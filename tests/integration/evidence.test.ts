import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { claims, evidenceRuns, ledgerEntries } from "@/db/schema";
import { GET as queueGet } from "@/app/api/v1/claims/route";
import { GET as evidenceGet, POST as evidencePost } from "@/app/api/v1/claims/[id]/evidence/route";
import { POST as importPost } from "@/app/api/v1/claims/[id]/evidence/import/route";
import { BASE, closeDb, freshDatabase, params, request, signInAs } from "../support/app";
import { declareNoTies, reviewFixtures, type ReviewFixtures } from "../support/review-fixtures";

let db: Db;
let fx: ReviewFixtures;
let unit: "bits" | "frames";
let claimedValue: number;
const as: Record<string, Headers> = {};

beforeAll(async () => {
  db = await freshDatabase();
  fx = await reviewFixtures(db);
  const [target] = await db.select().from(claims).where(eq(claims.id, fx.evidenceClaimId));
  unit = target.metric === "bler" ? "frames" : "bits";
  claimedValue = target.value;
  as.engineer = await signInAs("engineer@tarnwell.example");
  as.marram = await signInAs("offers@marram.example");
  as.buyer = await signInAs("buyer@tarnwell.example");
});
afterAll(closeDb);

const runs = async () => db.select().from(evidenceRuns).where(eq(evidenceRuns.tenderId, fx.tenderId));
const ledger = async (action: string) => (await db.select().from(ledgerEntries).where(eq(ledgerEntries.action, action))).length;
const record = (who: string, id: string, body: unknown) =>
  evidencePost(request(`/api/v1/claims/${id}/evidence`, { method: "POST", headers: as[who], body }), params({ id }));
const importCsv = (who: string, id: string, csv: string) =>
  importPost(request(`/api/v1/claims/${id}/evidence/import`, { method: "POST", headers: as[who], body: { csv } }), params({ id }));

describe("lab evidence", () => {
  it("refuses an engineer who has not declared, and stores nothing", async () => {
    const before = (await runs()).length;
    expect((await record("engineer", fx.evidenceClaimId, { channelValue: 5e-3, unit, trials: 1000, errors: 0, confidence: 0.95 })).status).toBe(403);
    expect((await runs()).length).toBe(before);
  });

  it("computes the Clopper-Pearson status: no errors in about 3/q trials verifies q at 95 % (rule of three)", async () => {
    await declareNoTies(db, fx.tenderId, as.engineer);
    const before = await ledger("evidence.recorded");
    const trials = Math.ceil(3 / claimedValue);
    const response = await record("engineer", fx.evidenceClaimId, { channelValue: 5e-3, unit, trials, errors: 0, confidence: 0.95 });
    expect(response.status).toBe(201);
    const run = await response.json();
    // Hanley and Lippman-Hand 1983: the 95 % upper bound for 0 of N is about 3/N (exactly -ln(0.05)/N).
    expect(run.upper).toBeGreaterThan(0.99 * (2.9957 / trials));
    expect(run.upper).toBeLessThan(1.01 * (2.9957 / trials));
    expect(run.status).toBe("verified");
    expect(run.lower).toBe(0);
    expect(await ledger("evidence.recorded")).toBe(before + 1);
    const rows: { id: string; evidence: string }[] = (
      await (await queueGet(request(`/api/v1/claims?tenderId=${fx.tenderId}`, { headers: as.engineer }), undefined)).json()
    ).claims;
    expect(rows.find((r) => r.id === fx.evidenceClaimId)?.evidence).toBe("verified");
  });

  it("calls a run with far too many errors contradicted, and a short clean one inconclusive with the length still needed", async () => {
    const bad = await (await record("engineer", fx.evidenceClaimId, { channelValue: 5e-3, unit, trials: 10_000, errors: 500, confidence: 0.99 })).json();
    expect(bad.status).toBe("contradicted");
    expect(bad.lower).toBeGreaterThan(claimedValue);
    const short = await (await record("engineer", fx.evidenceClaimId, { channelValue: 5e-3, unit, trials: 10, errors: 0, confidence: 0.9 })).json();
    expect(short.status).toBe("inconclusive");
    expect(short.errorFreeTrialsNeeded).toBe(Math.ceil(Math.log(0.1) / Math.log1p(-claimedValue)));
  });

  it("refuses a run counted in the wrong unit for the claim, with a message", async () => {
    const wrong = unit === "frames" ? "bits" : "frames";
    const before = (await runs()).length;
    const response = await record("engineer", fx.evidenceClaimId, { channelValue: 5e-3, unit: wrong, trials: 1000, errors: 0, confidence: 0.95 });
    expect(response.status).toBe(400);
    expect((await response.json()).error).toMatch(new RegExp(`count ${unit}`));
    expect((await runs()).length).toBe(before);
    expect((await record("engineer", fx.evidenceClaimId, { channelValue: 5e-3, unit, trials: 10, errors: 11, confidence: 0.95 })).status).toBe(400);
    expect((await record("engineer", fx.evidenceClaimId, { channelValue: 5e-3, unit, trials: 10, errors: 1, confidence: 0.5 })).status).toBe(400);
  });

  it("keeps lab runs from the vendor", async () => {
    expect(
      (await evidenceGet(request(`/api/v1/claims/${fx.evidenceClaimId}/evidence`, { headers: as.marram }), params({ id: fx.evidenceClaimId }))).status,
    ).toBe(403);
    const mine = await evidenceGet(request(`/api/v1/claims/${fx.evidenceClaimId}/evidence`, { headers: as.engineer }), params({ id: fx.evidenceClaimId }));
    expect((await mine.json()).runs.length).toBeGreaterThanOrEqual(3);
  });
});

describe("CSV import", () => {
  const oxbow = () => fx.claimIds.oxbow[0];

  it("stores the valid rows in one go and reports every rejected row with its reason", async () => {
    const [oxClaim] = await db.select().from(claims).where(eq(claims.id, oxbow()));
    const oxUnit = oxClaim.metric === "bler" ? "frames" : "bits";
    const csv = [
      "claim_id,vendor,point,channel,unit,trials,errors,confidence,note",
      `,,,0.005,${unit},"2,000,000",1,0.95,bench A`,
      `,Oxbow Wireless,${oxClaim.pointLabel},${oxClaim.channelValue},${oxUnit},500000,0,0.99,bench B`,
      `,,,0.005,packets,1000,0,0.95,`,
      `,,,0.005,${unit},100,101,0.95,`,
      `no-such-claim,,,0.005,${unit},1000,0,0.95,`,
      `,,,0.005,${unit === "frames" ? "bits" : "frames"},1000,0,0.95,`,
      `,,,0.005,${unit},1000,0,0.8,`,
    ].join("\n");
    const before = (await runs()).length;
    const ledgerBefore = await ledger("evidence.imported");
    const response = await importCsv("engineer", fx.evidenceClaimId, csv);
    expect(response.status).toBe(201);
    const report = await response.json();
    expect(report.stored.map((r: { line: number }) => r.line)).toEqual([2, 3]);
    expect(report.stored[1].claimId).toBe(oxbow());
    expect(report.rejected.map((r: { line: number }) => r.line)).toEqual([4, 5, 6, 7, 8]);
    const reasons = report.rejected.map((r: { reasons: string[] }) => r.reasons.join(" "));
    expect(reasons[0]).toMatch(/Unit must be "bits" or "frames"/);
    expect(reasons[1]).toMatch(/More errors/);
    expect(reasons[2]).toMatch(/No claim no-such-claim/);
    expect(reasons[3]).toMatch(new RegExp(`count ${unit}`));
    expect(reasons[4]).toMatch(/Confidence/);
    expect((await runs()).length).toBe(before + 2);
    expect(await ledger("evidence.imported")).toBe(ledgerBefore + 1);
    const stored = await db.select().from(evidenceRuns).where(eq(evidenceRuns.id, report.stored[0].id));
    expect(stored[0].source).toBe("csv");
    expect(stored[0].trials).toBe(2_000_000);
  });

  it("answers 422 and stores nothing when no row is valid, 400 for an unusable file", async () => {
    const before = (await runs()).length;
    const none = await importCsv("engineer", fx.evidenceClaimId, `unit,trials,errors\nfurlongs,10,0\n`);
    expect(none.status).toBe(422);
    expect((await none.json()).rejected).toHaveLength(1);
    const header = await importCsv("engineer", fx.evidenceClaimId, `colour,trials\nred,1\n`);
    expect(header.status).toBe(400);
    expect((await header.json()).error).toMatch(/Unknown columns: colour/);
    expect((await runs()).length).toBe(before);
    expect(await ledger("evidence.imported")).toBe(1);
  });

  it("takes the file as multipart form data too", async () => {
    const form = new FormData();
    form.set("file", new Blob([`unit,trials,errors,confidence\n${unit},400000,0,0.95\n`], { type: "text/csv" }), "lab.csv");
    const headers = new Headers(as.engineer);
    const response = await importPost(
      new Request(`${BASE}/api/v1/claims/${fx.evidenceClaimId}/evidence/import`, { method: "POST", headers, body: form }),
      params({ id: fx.evidenceClaimId }),
    );
    expect(response.status).toBe(201);
    expect((await response.json()).stored).toHaveLength(1);
  });
});

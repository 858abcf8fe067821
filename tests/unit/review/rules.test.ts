import { describe, expect, it } from "vitest";
import { checkSignoff } from "@/lib/review/signoff";
import { commentRequired, latestMarks } from "@/lib/review/marks";
import { assessRun, summariseEvidence, unitForMetric } from "@/lib/review/evidence";
import { validateEvidenceRows, type CsvClaim } from "@/lib/review/csv";

describe("sign-off rule", () => {
  const base = { tenderState: "technical" as const, alreadySigned: false, claimIds: ["a", "b", "c"] };
  it("allows signing once every claim has a mark", () => {
    expect(checkSignoff({ ...base, markedClaimIds: new Set(["a", "b", "c"]) })).toMatchObject({ ok: true, unmarked: 0, total: 3 });
  });
  it("names how many claims are unmarked", () => {
    const check = checkSignoff({ ...base, markedClaimIds: new Set(["a"]) });
    expect(check).toMatchObject({ ok: false, unmarked: 2, status: 409 });
    expect(check.reason).toMatch(/^2 of 3 claims are not marked/);
  });
  it("refuses a tender outside technical evaluation, or one already signed", () => {
    expect(checkSignoff({ ...base, tenderState: "commercial", markedClaimIds: new Set(["a", "b", "c"]) }).ok).toBe(false);
    expect(checkSignoff({ ...base, alreadySigned: true, markedClaimIds: new Set(["a", "b", "c"]) }).reason).toMatch(/already signed/);
  });
});

describe("marks", () => {
  it("needs a comment for every mark but accepted", () => {
    expect(commentRequired("accepted")).toBe(false);
    expect(commentRequired("rejected-impossible")).toBe(true);
    expect(commentRequired("evidence-requested")).toBe(true);
    expect(commentRequired("clarification-requested")).toBe(true);
  });
  it("takes the latest mark of each claim as current", () => {
    const latest = latestMarks([
      { claimId: "a", mark: "evidence-requested", markedAt: new Date("2027-01-01T10:00:00Z") },
      { claimId: "a", mark: "accepted", markedAt: new Date("2027-01-02T10:00:00Z") },
      { claimId: "b", mark: "rejected-impossible", markedAt: "2027-01-01T09:00:00Z" },
    ]);
    expect(latest.get("a")?.mark).toBe("accepted");
    expect(latest.get("b")?.mark).toBe("rejected-impossible");
  });
});

describe("evidence", () => {
  const ber = { metric: "ber" as const, value: 1e-6, ncgOutputBer: null, channelValue: 1e-3, channelModel: "bsc" as const };
  it("counts bits for BER claims and frames for BLER claims", () => {
    expect(unitForMetric("ber")).toBe("bits");
    expect(unitForMetric("bler")).toBe("frames");
    const refused = assessRun(ber, { channelValue: 1e-3, unit: "frames", trials: 1000, errors: 0, confidence: 0.95 });
    expect(refused).toMatchObject({ ok: false, field: "unit" });
  });
  it("0 errors in 3,000,000 bits at 95 % gives an upper bound near 1e-6 (rule of three) and verifies a 1e-6 BER", () => {
    const run = assessRun(ber, { channelValue: 1e-3, unit: "bits", trials: 3_000_000, errors: 0, confidence: 0.95 });
    if (!run.ok) throw new Error(run.message);
    // -ln(0.05) / 3e6 = 9.986e-7 (Hanley and Lippman-Hand 1983).
    expect(run.result.upper).toBeCloseTo(-Math.log(0.05) / 3e6, 9);
    expect(run.result.status).toBe("verified");
  });
  it("summarises runs: a contradiction outweighs the rest, then a verification", () => {
    expect(summariseEvidence([])).toBe("none");
    expect(summariseEvidence(["inconclusive", "verified"])).toBe("verified");
    expect(summariseEvidence(["verified", "contradicted"])).toBe("contradicted");
    expect(summariseEvidence(["inconclusive"])).toBe("inconclusive");
  });
});

describe("CSV rows", () => {
  const claims: CsvClaim[] = [
    { id: "c1", vendorName: "Marram Telemetry", pointLabel: "Storm fade", pointIndex: 1, metric: "bler", value: 1e-4, ncgOutputBer: null, channelValue: 5e-3, channelModel: "bsc" },
    { id: "c2", vendorName: "Oxbow Wireless", pointLabel: "Storm fade", pointIndex: 1, metric: "ber", value: 1e-6, ncgOutputBer: null, channelValue: 5e-3, channelModel: "bsc" },
  ];
  it("resolves claims by id, by vendor and point, or falls back to the claim imported on", () => {
    const csv = "claim_id,vendor,point,unit,trials,errors\nc2,,,bits,3000000,0\n,Oxbow Wireless,2,bits,100,0\n,,,frames,40000,0\n";
    const report = validateEvidenceRows(csv, claims, "c1");
    expect(report.valid.map((r) => r.claimId)).toEqual(["c2", "c2", "c1"]);
    expect(report.valid[0].result.status).toBe("verified");
    expect(report.valid[1].result.status).toBe("inconclusive");
    expect(report.valid[2].channelValue).toBe(5e-3);
  });
  it("rejects rows with every reason and keeps line numbers of the file", () => {
    const csv = "vendor,point,unit,trials,errors\nNobody,1,frames,10,0\nOxbow Wireless,,bits,x,0\n";
    const report = validateEvidenceRows(csv, claims, "c1");
    expect(report.valid).toHaveLength(0);
    expect(report.rejected[0]).toMatchObject({ line: 2 });
    expect(report.rejected[0].reasons[0]).toMatch(/No claim of Nobody/);
    expect(report.rejected[1].line).toBe(3);
    expect(report.rejected[1].reasons.join(" ")).toMatch(/both vendor and point.*Trials must be a number/);
  });
  it("reports a file without the needed columns as a whole", () => {
    expect(validateEvidenceRows("trials,errors\n1,0\n", claims, "c1").fileErrors[0]).toMatch(/no "unit" column/);
    expect(validateEvidenceRows("unit,trials,errors\n", claims, "c1").fileErrors).toContain("The file has no data rows.");
  });
});

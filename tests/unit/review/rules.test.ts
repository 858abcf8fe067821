import { describe, expect, it } from "vitest";
import { checkSignoff } from "@/lib/review/signoff";
import { commentRequired, latestMarks, markProblem } from "@/lib/review/marks";
import { assessRun, summariseEvidence, unitForMetric } from "@/lib/review/evidence";
import { validateEvidenceRows, type CsvClaim } from "@/lib/review/csv";

describe("sign-off rule", () => {
  const done = [
    { id: "a", mark: "accepted" as const, evidence: "none" as const },
    { id: "b", mark: "rejected-impossible" as const, evidence: "none" as const },
  ];
  const base = { tenderState: "technical" as const, safetyRelevant: false, signedBy: [], claims: done, openThreads: 0 };
  it("allows signing once every claim has a final mark and no question waits", () => {
    expect(checkSignoff(base)).toMatchObject({ ok: true, final: 2, total: 2, signaturesNeeded: 1 });
  });
  it("refuses while a claim is unmarked or only at a request for evidence or clarification", () => {
    const check = checkSignoff({
      ...base,
      claims: [...done, { id: "c", mark: "clarification-requested", evidence: "none" }, { id: "d", mark: null, evidence: "none" }],
    });
    expect(check).toMatchObject({ ok: false, final: 2, status: 409 });
    expect(check.reason).toMatch(/^2 claims have no final mark yet: accept each claim or reject it as impossible/);
  });
  it("refuses while a question to a vendor is neither answered nor closed", () => {
    expect(checkSignoff({ ...base, openThreads: 1 }).reason).toMatch(/1 question to a vendor is neither answered nor closed/);
  });
  it("refuses a tender outside technical evaluation, or one already signed", () => {
    expect(checkSignoff({ ...base, tenderState: "commercial" }).ok).toBe(false);
    expect(checkSignoff({ ...base, signedBy: ["u1"] }).reason).toMatch(/already signed/);
  });
  it("on a safety-relevant tender, needs a verifying run for every accepted claim and two distinct engineers", () => {
    const safety = { ...base, safetyRelevant: true };
    expect(checkSignoff(safety).reason).toMatch(/safety-relevant: 1 accepted claim has no lab run that verifies it/);
    const verified = { ...safety, claims: [{ ...done[0], evidence: "verified" as const }, done[1]] };
    expect(checkSignoff(verified)).toMatchObject({ ok: true, signaturesNeeded: 2 });
    expect(checkSignoff({ ...verified, signedBy: ["u1"], signerId: "u1" }).reason).toMatch(/needs a second engineer/);
    expect(checkSignoff({ ...verified, signedBy: ["u1"], signerId: "u2" }).ok).toBe(true);
    expect(checkSignoff({ ...verified, signedBy: ["u1", "u2"], signerId: "u3" }).reason).toMatch(/already signed/);
  });
});

describe("marks", () => {
  it("needs a comment for every mark but accepted", () => {
    expect(commentRequired("accepted")).toBe(false);
    expect(commentRequired("rejected-impossible")).toBe(true);
    expect(commentRequired("evidence-requested")).toBe(true);
    expect(commentRequired("clarification-requested")).toBe(true);
  });
  it("needs a written justification to accept a claim the engine proved impossible", () => {
    expect(markProblem("accepted", "", "impossible")).toMatch(/write a justification of at least 40 characters/);
    expect(markProblem("accepted", "Lab report 17 shows the bound was computed for the wrong frame length.", "impossible")).toBeNull();
    expect(markProblem("accepted", "", "plausible")).toBeNull();
    expect(markProblem("rejected-impossible", "Beyond the bound.", "impossible")).toBeNull();
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
    {
      id: "c1",
      vendorName: "Marram Telemetry",
      pointLabel: "Storm fade",
      pointIndex: 1,
      metric: "bler",
      value: 1e-4,
      ncgOutputBer: null,
      channelValue: 5e-3,
      channelModel: "bsc",
    },
    {
      id: "c2",
      vendorName: "Oxbow Wireless",
      pointLabel: "Storm fade",
      pointIndex: 1,
      metric: "ber",
      value: 1e-6,
      ncgOutputBer: null,
      channelValue: 5e-3,
      channelModel: "bsc",
    },
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

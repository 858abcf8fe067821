import { describe, expect, it } from "vitest";
import { assessRun, channelSide, countedStatus, summariseRuns } from "@/lib/review/evidence";
import { evidenceCsvTemplate, validateEvidenceRows, type CsvClaim } from "@/lib/review/csv";
import { parseCount, parseDecimal } from "@/lib/numbers";

// A BER claim of 1e-6 at p = 1e-3 on the BSC; 0 errors in 3,000,000 bits verifies it at 95 %
// (rule of three: -ln(0.05) / 3e6 = 9.99e-7, Hanley and Lippman-Hand, JAMA 1983).
const claim = { metric: "ber" as const, value: 1e-6, ncgOutputBer: null, channelValue: 1e-3, channelModel: "bsc" as const };
const clean = { unit: "bits" as const, trials: 3_000_000, errors: 0, confidence: 0.95 };
const dirty = { unit: "bits" as const, trials: 1_000_000, errors: 50, confidence: 0.95 };

describe("the channel a run was measured at", () => {
  it("orders the channels: larger p or e is harsher, lower Eb/N0 is harsher", () => {
    expect(channelSide("bsc", 1e-2, 1e-3)).toBe("harsher");
    expect(channelSide("bsc", 1e-5, 1e-3)).toBe("milder");
    expect(channelSide("bec", 0.2, 0.1)).toBe("harsher");
    expect(channelSide("biawgn", 2, 3)).toBe("harsher");
    expect(channelSide("biawgn", 4, 3)).toBe("milder");
    expect(channelSide("bsc", 0.001, 1e-3)).toBe("same");
  });

  it("does not verify a claim with a clean run a hundred times milder than the claim's channel", () => {
    const run = assessRun(claim, { ...clean, channelValue: 1e-5 });
    if (!run.ok) throw new Error(run.message);
    expect(run.result.status).toBe("inconclusive");
    expect(run.finding).toMatch(/milder than the claim's p = 1e-3/);
    expect(run.finding).toMatch(/verifies a claim only at the claim's channel or a harsher one/);
  });

  it("verifies at the claim's channel and at a harsher one, and says which", () => {
    const same = assessRun(claim, { ...clean, channelValue: 1e-3 });
    const harsher = assessRun(claim, { ...clean, channelValue: 2e-3 });
    if (!same.ok || !harsher.ok) throw new Error("refused");
    expect(same.result.status).toBe("verified");
    expect(same.finding).toMatch(/at the claim's channel/);
    expect(harsher.result.status).toBe("verified");
    expect(harsher.finding).toMatch(/harsher than the claim's/);
  });

  it("contradicts only at the claim's channel or a milder one", () => {
    const harsher = assessRun(claim, { ...dirty, channelValue: 1e-2 });
    const milder = assessRun(claim, { ...dirty, channelValue: 1e-4 });
    if (!harsher.ok || !milder.ok) throw new Error("refused");
    expect(harsher.result.status).toBe("inconclusive");
    expect(harsher.finding).toMatch(/contradicts a claim only at the claim's channel or a milder one/);
    expect(milder.result.status).toBe("contradicted");
  });

  it("refuses a channel outside the model's range, naming the range", () => {
    expect(assessRun(claim, { ...clean, channelValue: 0.7 })).toMatchObject({
      ok: false,
      field: "channelValue",
      message: expect.stringMatching(/at most 0.5/),
    });
    expect(assessRun({ ...claim, channelModel: "biawgn", channelValue: 3 }, { ...clean, channelValue: 60 })).toMatchObject({
      ok: false,
      field: "channelValue",
    });
  });

  it("counts stored runs again by the rule, so a run stored before it cannot verify from a milder channel", () => {
    expect(countedStatus("bsc", 1e-5, 1e-3, "verified").status).toBe("inconclusive");
    expect(summariseRuns("bsc", 1e-3, [{ channelValue: 1e-5, status: "verified" }])).toBe("inconclusive");
    expect(summariseRuns("bsc", 1e-3, [{ channelValue: 1e-3, status: "verified" }])).toBe("verified");
  });
});

describe("CSV rows at another channel", () => {
  const claims: CsvClaim[] = [{ id: "c1", vendorName: "Oxbow Wireless", pointLabel: "Clear weather", pointIndex: 0, ...claim }];
  it("says what each row counts for, and refuses a channel out of range", () => {
    const csv = 'channel,unit,trials,errors\n0.001,bits,3000000,0\n"0,00001",bits,3000000,0\n0.7,bits,3000000,0\n';
    const report = validateEvidenceRows(csv, claims, "c1");
    expect(report.valid.map((r) => r.result.status)).toEqual(["verified", "inconclusive"]);
    expect(report.valid[1].channelValue).toBe(1e-5);
    expect(report.valid[1].finding).toMatch(/milder/);
    expect(report.rejected[0]).toMatchObject({ line: 4 });
    expect(report.rejected[0].reasons[0]).toMatch(/out of range/);
  });
  it("offers a template that reads back as one valid row for the claim", () => {
    const template = evidenceCsvTemplate({ id: "c1", metric: "ber", channelValue: 1e-3 });
    const report = validateEvidenceRows(template, claims, null);
    expect(report.fileErrors).toEqual([]);
    expect(report.valid).toHaveLength(1);
    expect(report.valid[0]).toMatchObject({ claimId: "c1", channelValue: 1e-3, unit: "bits" });
  });
});

describe("numbers as typed", () => {
  it("reads a decimal comma, a point, exponents and grouped thousands", () => {
    expect(parseDecimal("0,00001")).toBe(1e-5);
    expect(parseDecimal("1e-5")).toBe(1e-5);
    expect(parseDecimal("1,250.50")).toBe(1250.5);
    expect(parseDecimal(" 2 000 000 ")).toBe(2e6);
    expect(parseDecimal("")).toBeNull();
    expect(parseDecimal("abc")).toBeNaN();
    expect(parseCount("2,000,000")).toBe(2e6);
    expect(parseCount("200,000")).toBe(2e5);
  });
});

// Lab evidence with exact Clopper-Pearson bounds (Clopper and Pearson, Biometrika 1934) and the
// error-free run length (Hanley and Lippman-Hand, JAMA 1983); conversions of section 6.
import { describe, expect, it } from "vitest";
import {
  assessEvidence,
  ebn0ToEsn0,
  esn0ForRawBer,
  esn0ToEbn0,
  hardDecisionBer,
  netCodingGainDb,
  overheadToRate,
  qFactorDb,
  rateToOverhead,
  rawBerForNcg,
} from "@/lib/bounds";

describe("assessEvidence", () => {
  it("verified, contradicted, inconclusive", () => {
    expect(assessEvidence({ errors: 0, trials: 4e6, claimed: 1e-6 }).status).toBe("verified");
    expect(assessEvidence({ errors: 50, trials: 1e6, claimed: 1e-6 }).status).toBe("contradicted");
    const r = assessEvidence({ errors: 0, trials: 1e6, claimed: 1e-6 });
    expect(r.status).toBe("inconclusive");
    // ceil(ln 0.05 / ln(1 - 1e-6)) = 2,995,731: about 3 / q (rule of three)
    expect(r.errorFreeTrialsNeeded).toBe(Math.ceil(Math.log(0.05) / Math.log1p(-1e-6)));
    expect(r.additionalTrialsNeeded).toBe(r.errorFreeTrialsNeeded - 1e6);
  });
  it("with errors, the additional run is the shortest that brings the upper bound to the claim", () => {
    const r = assessEvidence({ errors: 2, trials: 1e6, claimed: 1e-6 });
    expect(r.status).toBe("inconclusive");
    const m = r.additionalTrialsNeeded!;
    expect(assessEvidence({ errors: 2, trials: 1e6 + m, claimed: 1e-6 }).status).toBe("verified");
    expect(assessEvidence({ errors: 2, trials: 1e6 + m - 1, claimed: 1e-6 }).status).toBe("inconclusive");
  });
  it("two-sided interval contains the one-sided bounds' complement and the estimate", () => {
    const r = assessEvidence({ errors: 7, trials: 1000, claimed: 0.01, confidence: 0.9 });
    expect(r.twoSided.lower).toBeLessThan(r.lower);
    expect(r.twoSided.upper).toBeGreaterThan(r.upper);
    expect(r.lower).toBeLessThan(0.007);
    expect(r.upper).toBeGreaterThan(0.007);
  });
  it("rejects nonsense counts", () => {
    expect(() => assessEvidence({ errors: 5, trials: 3, claimed: 0.1 })).toThrow(RangeError);
    expect(() => assessEvidence({ errors: 0, trials: 10, claimed: 0 })).toThrow(RangeError);
  });
});

describe("conversions (BOUNDS.md section 6)", () => {
  it("overhead and rate", () => {
    expect(overheadToRate(0.07)).toBeCloseTo(1 / 1.07, 15);
    expect(rateToOverhead(overheadToRate(0.25))).toBeCloseTo(0.25, 14);
  });
  it("Es/N0 and Eb/N0", () => {
    expect(ebn0ToEsn0(3, 0.5)).toBeCloseTo(3 - 10 * Math.log10(2), 12);
    expect(esn0ToEbn0(ebn0ToEsn0(1.7, 0.8), 0.8)).toBeCloseTo(1.7, 12);
  });
  it("raw BER of hard decisions and its inverse", () => {
    expect(hardDecisionBer(esn0ForRawBer(3.8e-3))).toBeCloseTo(3.8e-3, 14);
  });
  it("Q-factor: BER 1e-15 is about 18 dB, 3.8e-3 is about 8.5 dB (ITU-T G.975.1 usage)", () => {
    expect(qFactorDb(1e-15)).toBeCloseTo(20 * Math.log10(7.941), 2);
    expect(Math.abs(qFactorDb(3.8e-3) - 8.53)).toBeLessThan(0.05);
  });
  it("net coding gain and its inverse agree", () => {
    const R = 1 / 1.07;
    const ncg = netCodingGainDb(3.8e-3, 1e-15, R);
    expect(rawBerForNcg(ncg, 1e-15, R)).toBeCloseTo(3.8e-3, 14);
    // NCG = Q_dB(out) - Q_dB(in) + 10 log10 R
    expect(ncg).toBeCloseTo(qFactorDb(1e-15) - qFactorDb(3.8e-3) + 10 * Math.log10(R), 12);
  });
});

// The external checks of BOUNDS.md section 8, each next to its source. Values "from memory" are
// confirmed here by an independent computation, never copied into the engine.
import { describe, expect, it } from "vitest";
import {
  awgnCapacity,
  awgnEbn0LimitDb,
  biawgnEsn0ForCapacity,
  bscCapacity,
  bscConverseLog,
  esn0ToEbn0,
  evaluateClaim,
  assessEvidence,
  uncodedBpskBer,
  h2,
} from "@/lib/bounds";

const binomPmf = (n: number, t: number, p: number) => {
  let c = 1;
  for (let i = 0; i < t; i++) c = (c * (n - i)) / (i + 1);
  return c * p ** t * (1 - p) ** (n - t);
};

describe("perfect codes meet the BSC converse (PPV Theorem 35)", () => {
  // R. W. Hamming, Bell Syst. Tech. J. 1950: the (7,4) code corrects every single error and nothing else.
  it.each([1e-6, 1e-3, 0.01, 0.05, 0.1, 0.2, 0.3, 0.5])("Hamming (7,4) at p = %s", (p) => {
    const exact = 1 - (1 - p) ** 7 - 7 * p * (1 - p) ** 6;
    expect(Math.exp(bscConverseLog(7, 4, p))).toBeCloseTo(exact, 14);
    // The same quantity without cancellation, P[T >= 2], for a relative check at small p too.
    let atLeast2 = 0;
    for (let t = 2; t <= 7; t++) atLeast2 += binomPmf(7, t, p);
    expect(Math.abs(Math.exp(bscConverseLog(7, 4, p)) / atLeast2 - 1)).toBeLessThan(1e-10);
  });

  // M. J. E. Golay, Proc. IRE 1949: the (23,12) code corrects every pattern of up to 3 errors.
  it.each([1e-4, 0.01, 0.05, 0.1, 0.25, 0.5])("Golay (23,12) at p = %s", (p) => {
    let upTo3 = 0;
    for (let t = 0; t <= 3; t++) upTo3 += binomPmf(23, t, p);
    let above3 = 0;
    for (let t = 4; t <= 23; t++) above3 += binomPmf(23, t, p);
    expect(Math.abs(Math.exp(bscConverseLog(23, 12, p)) / above3 - 1)).toBeLessThan(1e-10);
    expect(Math.exp(bscConverseLog(23, 12, p))).toBeCloseTo(1 - upTo3, 12);
  });
});

describe("capacities and Shannon limits", () => {
  it("C(BSC, 0.11) = 0.5 to three decimals (standard textbook value, confirmed via 1 - h2)", () => {
    const direct = 1 + 0.11 * Math.log2(0.11) + 0.89 * Math.log2(0.89);
    expect(bscCapacity(0.11)).toBeCloseTo(direct, 14);
    expect(bscCapacity(0.11)).toBeCloseTo(0.5, 3);
  });

  // T. Richardson, R. Urbanke, Modern Coding Theory, 2008 (from memory): rate 1/2 at about 0.19 dB, 1/3 at about -0.50 dB.
  it("BI-AWGN Shannon limits of rates 1/2 and 1/3", () => {
    const half = esn0ToEbn0(biawgnEsn0ForCapacity(1 / 2), 1 / 2);
    const third = esn0ToEbn0(biawgnEsn0ForCapacity(1 / 3), 1 / 3);
    expect(Math.abs(half - 0.19)).toBeLessThan(0.01);
    expect(Math.abs(third - -0.5)).toBeLessThan(0.01);
  });

  // Shannon 1948/1949: the unconstrained AWGN needs 0 dB Eb/N0 at rate 1/2 and ln 2 (-1.59 dB) as R -> 0.
  it("unconstrained AWGN limits", () => {
    expect(awgnEbn0LimitDb(0.5)).toBeCloseTo(0, 12);
    expect(awgnEbn0LimitDb(1e-9)).toBeCloseTo(10 * Math.log10(Math.LN2), 6);
    expect(awgnEbn0LimitDb(1e-9)).toBeCloseTo(-1.59, 2);
    // consistency: at the limit the capacity formula gives exactly the rate (Es/N0 = R Eb/N0)
    const r = 0.7;
    expect(awgnCapacity(awgnEbn0LimitDb(r) + 10 * Math.log10(r))).toBeCloseTo(r, 12);
  });

  it("the BI-AWGN channel needs more than the unconstrained AWGN at every rate (binary input is a constraint)", () => {
    for (const r of [0.1, 0.5, 0.9]) expect(esn0ToEbn0(biawgnEsn0ForCapacity(r), r)).toBeGreaterThan(awgnEbn0LimitDb(r));
  });
});

describe("conversions and evidence", () => {
  // J. G. Proakis, Digital Communications (common practice): uncoded BPSK needs about 9.6 dB for BER 1e-5.
  it("uncoded BPSK at BER 1e-5", () => {
    expect(uncodedBpskBer(9.6)).toBeGreaterThan(0.9e-5);
    expect(uncodedBpskBer(9.6)).toBeLessThan(1.1e-5);
    expect(uncodedBpskBer(9.5)).toBeGreaterThan(1e-5);
    expect(uncodedBpskBer(9.7)).toBeLessThan(1e-5);
  });

  // J. A. Hanley, A. Lippman-Hand, JAMA 1983: zero errors in N trials gives a 95% upper bound of about 3/N.
  it.each([100, 1000, 1e6, 1e9])("rule of three at N = %s", (N) => {
    const r = assessEvidence({ errors: 0, trials: N, claimed: 1e-3, confidence: 0.95 });
    expect(r.upper).toBeCloseTo(1 - 0.05 ** (1 / N), 12); // exact: (1 - u)^N = 0.05
    expect(Math.abs((r.upper * N) / 3 - 1)).toBeLessThan(0.02);
  });
});

describe("optical hard-decision FEC thresholds (common practice; capacity check)", () => {
  // A 7% overhead code: R = 1/1.07 = 0.9346; 1 - h2(3.8e-3) = 0.964 > R but 1 - h2(1e-2) = 0.919 < R.
  const claim = (p: number) => evaluateClaim({ channel: { model: "bsc", p }, code: { overhead: 0.07 }, target: { metric: "ber", value: 1e-15 } });
  it("is possible at a pre-decoder BER of 3.8e-3", () => {
    expect(claim(3.8e-3).verdict).not.toBe("impossible");
    expect(1 - h2(3.8e-3)).toBeGreaterThan(1 / 1.07);
  });
  it("is impossible at 1e-2", () => {
    const r = claim(1e-2);
    expect(r.verdict).toBe("impossible");
    expect(r.findings.map((f) => f.code)).toContain("capacity-exceeded");
  });
  it("with a block length, the finite-length bounds agree", () => {
    const r = evaluateClaim({ channel: { model: "bsc", p: 3.8e-3 }, code: { n: 30592, k: 28592 }, target: { metric: "ber", value: 1e-15 } });
    expect(r.verdict).toBe("plausible");
  });
});

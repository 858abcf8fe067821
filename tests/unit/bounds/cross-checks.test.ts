// Cross-checks of the engine's numerics against independent computations: a general-purpose
// statistics library from the npm registry (jstat; its own documentation defines binomial.cdf
// and beta.inv), plain-sum formulas for small codes, and a second quadrature method.
import { describe, expect, it } from "vitest";
import jStat from "jstat";
import { binomial, logBinomRange } from "@/lib/bounds/sums";
import { becConverseLog, becAchievLog, becAchievableLog, biawgnCapDisp, clopperPearsonLower, clopperPearsonUpper, dbToLinear } from "@/lib/bounds";

describe("binomial tails agree with jstat (jStat.binomial.cdf, jstat documentation)", () => {
  const cases: [number, number][] = [
    [10, 0.1],
    [50, 0.02],
    [200, 0.3],
    [1000, 0.01],
    [1000, 0.45],
  ];
  it.each(cases)("Binomial(%s, %s): P[T <= t] and P[T = t] for every t", (n, p) => {
    const B = binomial(n, p);
    for (let t = 0; t <= n; t++) {
      // jstat returns the cdf rounded to about 10 decimals, so compare absolutely there ...
      const ours = Math.exp(logBinomRange(B, 0, t));
      expect(Math.abs(ours - jStat.binomial.cdf(t, n, p))).toBeLessThan(1e-9);
      // ... and its pmf relatively (jstat itself drifts by ~1e-7 below 1e-200, see the exact check below)
      const pmf = jStat.binomial.pdf(t, n, p);
      if (pmf > 1e-100) expect(Math.abs(Math.exp(B.logPmf(t)) / pmf - 1)).toBeLessThan(1e-8);
      // the upper tail is summed on its own, not as 1 - cdf; the error is a few ulps of ln n!
      const upper = Math.exp(logBinomRange(B, t + 1, n));
      expect(Math.abs(upper + ours - 1)).toBeLessThan(1e-11);
    }
  });

  it("every probability of Binomial(1000, 9/20) matches exact rational arithmetic (BigInt)", () => {
    const log10Big = (x: bigint) => {
      const d = x.toString();
      return Math.log10(Number(d.slice(0, 17))) + Math.max(0, d.length - 17);
    };
    const B = binomial(1000, 0.45);
    let c = 1n; // C(1000, t), exactly
    for (let t = 0; t <= 1000; t++) {
      const exact = (log10Big(c * 9n ** BigInt(t) * 11n ** BigInt(1000 - t)) - 1000 * Math.log10(20)) * Math.LN10;
      expect(Math.abs(B.logPmf(t) - exact)).toBeLessThan(1e-10);
      c = (c * BigInt(1000 - t)) / BigInt(t + 1);
    }
  });

  it("a far tail matches the sum of jstat's pmf terms relatively", () => {
    const B = binomial(1000, 0.45);
    let ref = 0;
    for (let t = 0; t <= 300; t++) ref += jStat.binomial.pdf(t, 1000, 0.45);
    expect(Math.abs(Math.exp(logBinomRange(B, 0, 300)) / ref - 1)).toBeLessThan(1e-8);
  });
});

describe("Clopper-Pearson bounds agree with jstat's beta quantiles (jStat.beta.inv)", () => {
  const cases: [number, number, number][] = [
    [0, 100, 0.95],
    [3, 1000, 0.95],
    [17, 2e5, 0.99],
    [50, 60, 0.9],
    [1, 1e9, 0.95],
  ];
  it.each(cases)("x = %s, N = %s, c = %s", (x, N, c) => {
    // Clopper and Pearson, Biometrika 1934: upper = Beta quantile c of (x + 1, N - x); lower = quantile 1 - c of (x, N - x + 1)
    // jstat's inverse is good to about 1e-6 relative at N = 1e9 (ours is checked exactly below)
    const up = clopperPearsonUpper(x, N, c);
    expect(Math.abs(up / jStat.beta.inv(c, x + 1, N - x) - 1)).toBeLessThan(1e-6);
    const lo = clopperPearsonLower(x, N, c);
    if (x > 0) expect(Math.abs(lo / jStat.beta.inv(1 - c, x, N - x + 1) - 1)).toBeLessThan(1e-6);
    // the defining property: at the upper bound P[T <= x] = 1 - c; at the lower bound P[T >= x] = 1 - c
    // (for N = 1e9 only the closed form for x <= 1 is used: ln N! has ulps of 4e-6 there)
    if (N <= 1e6) {
      expect(Math.exp(logBinomRange(binomial(N, up), 0, x))).toBeCloseTo(1 - c, 9);
      if (x > 0) expect(Math.exp(logBinomRange(binomial(N, lo), x, N))).toBeCloseTo(1 - c, 9);
    } else if (x === 1) {
      const head = Math.exp(N * Math.log1p(-up)) * (1 + (N * up) / (1 - up)); // P[T <= 1]
      expect(head).toBeCloseTo(1 - c, 8); // the beta quantile is good to about 1e-8 relative at N = 1e9
    }
  });
});

describe("BEC: codes meeting the Singleton bound meet the converse exactly (PPV Theorem 38)", () => {
  // ML decoding with random tie-breaking: with l erasures an MDS code (any k positions determine the
  // codeword) leaves 2^(k - (n - l)) candidates when n - l < k and exactly one otherwise, so its
  // BLER is sum_{l > n-k} P[l] (1 - 2^(n - l - k)): the converse formula itself.
  const pmf = (n: number, l: number, e: number) => {
    let c = 1;
    for (let i = 0; i < l; i++) c = (c * (n - i)) / (i + 1);
    return c * e ** l * (1 - e) ** (n - l);
  };
  it.each([
    [8, 0.1],
    [20, 0.3],
    [31, 0.05],
  ])("n = %s, e = %s: single parity check, repetition, uncoded", (n, e) => {
    let spc = 0; // fails when 2 or more erasures, then guesses among 2^(l-1) codewords
    for (let l = 2; l <= n; l++) spc += pmf(n, l, e) * (1 - 2 ** (1 - l));
    const rep = e ** n / 2; // only the all-erased word is ambiguous, between 2 codewords
    const uncoded = 1 - (1 - e / 2) ** n; // each erased bit is guessed
    expect(Math.abs(Math.exp(becConverseLog(n, n - 1, e)) / spc - 1)).toBeLessThan(1e-10);
    expect(Math.abs(Math.exp(becConverseLog(n, 1, e)) / rep - 1)).toBeLessThan(1e-10);
    expect(Math.abs(Math.exp(becConverseLog(n, n, e)) / uncoded - 1)).toBeLessThan(1e-10);
    // the engine's best-known achievability uses exactly these codes
    expect(becAchievableLog(n, n - 1, e)).toBe(becConverseLog(n, n - 1, e));
    // and the random-coding bound stays above the converse
    expect(becAchievLog(n, n - 1, e)).toBeGreaterThanOrEqual(becConverseLog(n, n - 1, e));
  });
});

describe("BI-AWGN capacity and dispersion: adaptive Gauss-Kronrod against composite Simpson", () => {
  // Independent method: composite Simpson in the channel output y ~ N(1, sigma^2), not in the
  // standardised variable, with 40,000 panels over 1 +/- 13 sigma.
  function simpson(esn0Db: number): { capacity: number; dispersion: number } {
    const sigma2 = 1 / (2 * dbToLinear(esn0Db));
    const sigma = Math.sqrt(sigma2);
    const N = 40_000;
    const a = 1 - 13 * sigma;
    const h = (26 * sigma) / N;
    const info = (y: number) => {
      const x = (-2 * y) / sigma2; // i(y) = 1 - log2(1 + exp(-2y/sigma^2))
      return 1 - (x > 0 ? x + Math.log1p(Math.exp(-x)) : Math.log1p(Math.exp(x))) / Math.LN2;
    };
    const dens = (y: number) => Math.exp(-((y - 1) ** 2) / (2 * sigma2)) / Math.sqrt(2 * Math.PI * sigma2);
    let m1 = 0;
    let m2 = 0;
    for (let i = 0; i <= N; i++) {
      const w = i === 0 || i === N ? 1 : i % 2 ? 4 : 2;
      const y = a + i * h;
      const v = info(y);
      m1 += w * v * dens(y);
      m2 += w * v * v * dens(y);
    }
    m1 *= h / 3;
    m2 *= h / 3;
    return { capacity: m1, dispersion: m2 - m1 * m1 };
  }
  it("agree within 1e-10 from -10 to 20 dB Es/N0", () => {
    for (let db = -10; db <= 20; db += 1.25) {
      const ours = biawgnCapDisp(db);
      const ref = simpson(db);
      expect(Math.abs(ours.capacity - ref.capacity)).toBeLessThan(1e-10);
      expect(Math.abs(ours.dispersion - ref.dispersion)).toBeLessThan(1e-9);
    }
  });
});

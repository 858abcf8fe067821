// Properties of the radio bounds (Shannon 1959; PPV 2010, 2011): monotone in n, k and Eb/N0, the
// 1959 converse below the normal approximation at usual rates, inverses that invert.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { biawgnCapDisp, ebn0ToEsn0, energyConverseEbn0Db, normalApproxLogBler, orthogonalEbn0Db, spherePackingEbn0Db, spherePackingLog } from "@/lib/bounds";

const SEED = 1959;
const RUNS = { numRuns: 60, seed: SEED };
/** Allowed disagreement of two ln-probabilities from rounding alone. */
const tol = (a: number) => 1e-9 * Math.max(1, Math.abs(a));

const nArb = fc.integer({ min: 2, max: 20_000 });
const frac = fc.double({ min: 0.05, max: 0.95, noNaN: true });
const dbArb = fc.double({ min: -2, max: 8, noNaN: true });

describe("the 1959 bound is monotone", () => {
  // In k the bound grows at a fixed energy per dimension (Es/N0): at a fixed Eb/N0 more bits also
  // bring more energy, and the bound need not grow (k = 1 and 2 at n = 5 nearly tie).
  it("falls as Eb/N0 grows, grows with k at fixed n and Es/N0, falls as n grows at fixed k and Eb/N0", () => {
    fc.assert(
      fc.property(nArb, frac, frac, dbArb, dbArb, fc.integer({ min: 1, max: 200 }), (n, f1, f2, d1, d2, dn) => {
        const [ka, kb] = [Math.max(1, Math.round(f1 * n)), Math.max(1, Math.round(f2 * n))].sort((a, b) => a - b);
        const [lo, hi] = [d1, d2].sort((a, b) => a - b);
        const a = spherePackingLog(n, ka, hi);
        expect(a).toBeLessThanOrEqual(spherePackingLog(n, ka, lo) + tol(a));
        const ebn0 = (k: number) => ebn0ToEsn0(hi, n / k); // Es/N0 = hi dB, as Eb/N0 at rate k/n
        const c = spherePackingLog(n, ka, ebn0(ka));
        expect(c).toBeLessThanOrEqual(spherePackingLog(n, kb, ebn0(kb)) + tol(c));
        expect(spherePackingLog(n + dn, ka, hi)).toBeLessThanOrEqual(a + tol(a));
      }),
      RUNS,
    );
  });
});

describe("the 1959 bound and the normal approximation (PPV 2010)", () => {
  it("stays below the BI-AWGN normal approximation for n >= 100 at rates 0.3 to 0.9 where it expects BLER 1e-9 to 1/2", () => {
    fc.assert(
      fc.property(fc.integer({ min: 100, max: 10_000 }), fc.double({ min: 0.3, max: 0.9, noNaN: true }), dbArb, (n, r, ebn0) => {
        const k = Math.round(r * n);
        const cd = biawgnCapDisp(ebn0ToEsn0(ebn0, k / n));
        const normal = normalApproxLogBler(n, k, cd.capacity, cd.dispersion, true);
        if (normal < Math.log(1e-9) || normal > Math.log(0.5)) return;
        expect(spherePackingLog(n, k, ebn0)).toBeLessThanOrEqual(normal);
      }),
      { numRuns: 80, seed: SEED },
    );
  });
});

describe("the inverses invert", () => {
  it("the least Eb/N0 of the 1959 bound meets the target, and 1e-6 dB less does not", () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 5000 }), frac, fc.double({ min: Math.log(1e-30), max: Math.log(0.3), noNaN: true }), (n, f, lnEps) => {
        const k = Math.max(2, Math.min(n, Math.round(f * n)));
        const t = spherePackingEbn0Db(n, k, lnEps);
        if (t === null) return;
        expect(spherePackingLog(n, k, t + 1e-9)).toBeLessThanOrEqual(lnEps + tol(lnEps));
        expect(spherePackingLog(n, k, t - 1e-6)).toBeGreaterThan(lnEps);
      }),
      { numRuns: 40, seed: SEED },
    );
  });
  it("orthogonal signalling needs at least the converse's energy, and both fall as the BLER target loosens", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 5000 }), fc.double({ min: Math.log(1e-12), max: Math.log(0.3), noNaN: true }), (k, lnEps) => {
        const c = energyConverseEbn0Db(k, lnEps)!;
        const a = orthogonalEbn0Db(k, lnEps)!;
        expect(a).toBeGreaterThanOrEqual(c - 1e-9);
        expect(energyConverseEbn0Db(k, lnEps + 0.5)!).toBeLessThanOrEqual(c);
      }),
      { numRuns: 40, seed: SEED },
    );
  });
});

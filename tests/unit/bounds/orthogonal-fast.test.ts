// The fast orthogonal-signalling inverse (lib/bounds/orthogonal.ts: Newton on a fixed trapezoid
// grid) against the careful adaptive path it replaced (energy.ts's orthogonalLogBler, adaptive
// Gauss-Kronrod, solved by regula falsi): same answers to the stated 1e-6 dB, and monotone.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { linearToDb, orthogonalEbn0Db, orthogonalLogBler } from "@/lib/bounds";
import { orthogonalLogBlerFast } from "@/lib/bounds/orthogonal";
import { solveIncreasing } from "@/lib/bounds/solve";
import { LN2, qInvLog } from "@/lib/bounds/special";

const SEED = 2011;

/** The old path: bracket from the converse's amplitude by galloping, then regula falsi to 1e-10. */
function slowEbn0Db(k: number, logEps: number): number | null {
  const f = (a: number) => logEps - orthogonalLogBler(k, a);
  if (f(0) >= 0) return null;
  const conv = qInvLog(-k * LN2) + qInvLog(logEps);
  let lo = conv > 0 && f(conv) <= 0 ? conv : 0;
  let hi = lo + 0.25;
  for (let i = 0; i < 200 && f(hi) <= 0; i++) [lo, hi] = [hi, lo + 2 * (hi - lo)];
  const a = solveIncreasing(f, lo, hi, 1e-10);
  return linearToDb((a * a) / (2 * k));
}

describe("fast orthogonal inverse agrees with the adaptive path (1e-6 dB)", () => {
  const ks = [1, 2, 3, 8, 30, 64, 160, 1000, 10_000, 1_000_000];
  const epss = [0.9, 0.5, 1e-1, 1e-3, 1e-9, 1e-30];
  for (const k of ks)
    it(`k = ${k}`, () => {
      for (const eps of epss) {
        const fast = orthogonalEbn0Db(k, Math.log(eps));
        const slow = slowEbn0Db(k, Math.log(eps));
        if (slow === null) expect(fast).toBeNull();
        else expect(Math.abs(fast! - slow)).toBeLessThan(1e-6);
      }
    });
  // 1e-6 in ln BLER moves the amplitude by less than 1e-6 / 3 (|d ln BLER / da| > 3 here), far
  // below 1e-6 dB; at k = 10^6 the two quadratures differ by about 2e-7 (terms of size y^2/2 ~ 7e5).
  it("the forward value agrees to 1e-6 in ln BLER, across the waterfall", () => {
    for (const [k, a] of [
      [1, 4],
      [8, 6.2],
      [30, 14],
      [64, 20],
      [160, 17.8],
      [10_000, 120.8],
      [1_000_000, 1180.5],
    ])
      for (const da of [-1, 0, 1]) {
        const slow = orthogonalLogBler(k, a + da);
        expect(Math.abs(orthogonalLogBlerFast(k, a + da) - slow)).toBeLessThan(1e-6);
      }
  });
});

describe("fast orthogonal inverse is monotone", () => {
  it("needs more Eb/N0 for a smaller BLER, and (at BLER 0.1 or below) less per bit for more bits", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 100_000 }),
        fc.integer({ min: 1, max: 500 }),
        fc.double({ min: Math.log(1e-40), max: Math.log(0.1), noNaN: true }), // above ~0.3 one bit is cheapest
        fc.double({ min: 0.01, max: 5, noNaN: true }),
        (k, dk, lnEps, d) => {
          const base = orthogonalEbn0Db(k, lnEps)!;
          expect(orthogonalEbn0Db(k, lnEps - d)!).toBeGreaterThan(base);
          expect(orthogonalEbn0Db(k + dk, lnEps)!).toBeLessThan(base);
        },
      ),
      { numRuns: 60, seed: SEED },
    );
  });
});

// Property tests of the finite-length bounds (Polyanskiy, Poor, Verdu 2010): ordering, monotonicity,
// inverses, and no NaN or infinity leaking out of a verdict anywhere in the accepted ranges.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  becAchievLog,
  becAchievableLog,
  becAchievableThreshold,
  becConverseLog,
  becConverseThreshold,
  biawgnCapacity,
  biawgnEsn0ForCapacity,
  bscAchievableLog,
  bscAchievableThreshold,
  bscConverseLog,
  bscConverseThreshold,
  bscRcuLog,
  evaluateClaim,
} from "@/lib/bounds";
import { logNumericSlack } from "@/lib/bounds/special";

const RUNS = { numRuns: 150 };
/** Allowed disagreement of two ln-probabilities: 1e-9 relative plus the rounding of ln n!. */
const tol = (n: number, a: number) => 1e-9 * Math.max(1, Math.abs(a)) + logNumericSlack(n);

const nArb = fc.integer({ min: 1, max: 4000 });
const frac = fc.double({ min: 0, max: 1, noNaN: true });
const pArb = fc.double({ min: Math.log(1e-9), max: Math.log(0.5), noNaN: true }).map((u) => Math.min(0.5, Math.exp(u)));
const eArb = fc.double({ min: 1e-6, max: 0.99, noNaN: true });
const kOf = (n: number, f: number) => Math.min(n, 1 + Math.floor(f * n));

describe("ordering: converse <= achievability (PPV Theorems 33, 35, 37, 38)", () => {
  it("BSC: converse <= RCU", () => {
    fc.assert(
      fc.property(nArb, frac, pArb, (n, f, p) => {
        const k = kOf(n, f);
        const c = bscConverseLog(n, k, p);
        expect(c).toBeLessThanOrEqual(bscRcuLog(n, k, p) + tol(n, c));
      }),
      RUNS,
    );
  });
  it("BEC: converse <= Theorem 37", () => {
    fc.assert(
      fc.property(nArb, frac, eArb, (n, f, e) => {
        const k = kOf(n, f);
        const c = becConverseLog(n, k, e);
        expect(c).toBeLessThanOrEqual(becAchievLog(n, k, e) + tol(n, c));
      }),
      RUNS,
    );
  });
});

describe("monotonicity in k, n and the channel", () => {
  const bounds = [
    ["BSC converse", bscConverseLog, pArb],
    ["BSC RCU", bscRcuLog, pArb],
    ["BEC converse", becConverseLog, eArb],
    ["BEC Theorem 37", becAchievLog, eArb],
  ] as const;
  for (const [name, f, xArb] of bounds) {
    it(`${name} grows with k and with the channel parameter`, () => {
      fc.assert(
        fc.property(nArb, frac, frac, xArb, xArb, (n, f1, f2, x1, x2) => {
          const [ka, kb] = [kOf(n, f1), kOf(n, f2)].sort((a, b) => a - b);
          const a = f(n, ka, x1);
          expect(a).toBeLessThanOrEqual(f(n, kb, x1) + tol(n, a));
          const [xa, xb] = [x1, x2].sort((a, b) => a - b);
          const c = f(n, ka, xa);
          expect(c).toBeLessThanOrEqual(f(n, ka, xb) + tol(n, c));
        }),
        RUNS,
      );
    });
    // The RCU bound itself is not monotone in n where it is close to 1: by direct summation,
    // 1 - RCU(194, 192, 0.0641) = 1.98e-6 > 1 - RCU(199, 192, 0.0641) = 1.88e-6. Below 1/2 it is.
    it(`${name} falls as n grows at fixed k (where the bound is below 1/2)`, () => {
      fc.assert(
        fc.property(nArb, frac, fc.integer({ min: 1, max: 50 }), xArb, (n, f1, d, x) => {
          const k = kOf(n, f1);
          const a = f(n, k, x);
          if (a > Math.log(0.5)) return;
          expect(f(n + d, k, x)).toBeLessThanOrEqual(a + tol(n + d, a));
        }),
        RUNS,
      );
    });
  }
});

describe("the inverses invert the bounds", () => {
  const target = fc.double({ min: Math.log(1e-15), max: Math.log(0.5), noNaN: true });
  it("BSC converse and achievability thresholds", () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 3000 }), frac, target, (n, f, lnT) => {
        const k = kOf(n, f);
        for (const [inv, bound] of [
          [bscConverseThreshold, bscConverseLog],
          [bscAchievableThreshold, bscAchievableLog],
        ] as const) {
          const p = inv(n, k, lnT);
          if (p > 0) expect(bound(n, k, p)).toBeLessThanOrEqual(lnT + tol(n, lnT));
          if (p > 0 && p < 0.5 / (1 + 1e-6)) expect(bound(n, k, p * (1 + 1e-6))).toBeGreaterThan(lnT - tol(n, lnT));
        }
      }),
      { numRuns: 60 },
    );
  });
  it("BEC converse and achievability thresholds", () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 3000 }), frac, target, (n, f, lnT) => {
        const k = kOf(n, f);
        for (const [inv, bound] of [
          [becConverseThreshold, becConverseLog],
          [becAchievableThreshold, becAchievableLog],
        ] as const) {
          const e = inv(n, k, lnT);
          if (e > 0) expect(bound(n, k, e)).toBeLessThanOrEqual(lnT + tol(n, lnT));
          if (e > 0 && e < 0.99) expect(bound(n, k, e * (1 + 1e-6))).toBeGreaterThan(lnT - tol(n, lnT));
        }
      }),
      { numRuns: 60 },
    );
  });
  it("BI-AWGN capacity threshold inverts the capacity", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 0.99, noNaN: true }), (r) => {
        expect(biawgnCapacity(biawgnEsn0ForCapacity(r))).toBeCloseTo(r, 9);
      }),
      { numRuns: 30 },
    );
  });
});

/** Every number anywhere in a result is finite (log10 values may be very negative). */
function allFinite(v: unknown): boolean {
  if (typeof v === "number") return Number.isFinite(v);
  if (Array.isArray(v)) return v.every(allFinite);
  if (v && typeof v === "object") return Object.values(v).every(allFinite);
  return true;
}

describe("no NaN or infinity leaks from a verdict", () => {
  const big = fc.oneof(fc.integer({ min: 1, max: 2000 }), fc.integer({ min: 1, max: 1_000_000 }));
  const targetArb = fc.double({ min: Math.log(1e-30), max: Math.log(0.5), noNaN: true }).map(Math.exp);
  const metric = fc.constantFrom("bler" as const, "ber" as const);
  const channel = fc.oneof(
    pArb.map((p) => ({ model: "bsc" as const, p })),
    eArb.map((e) => ({ model: "bec" as const, e })),
    fc.double({ min: -5, max: 20, noNaN: true }).map((ebn0Db) => ({ model: "biawgn" as const, ebn0Db })),
  );
  it("over n = 1..1e6, p = 1e-9..0.5, e = 1e-6..0.99, Eb/N0 = -5..20 dB, targets 1e-30..0.5", () => {
    fc.assert(
      fc.property(channel, big, frac, targetArb, metric, (ch, n, f, value, m) => {
        const r = evaluateClaim({ channel: ch, code: { n, k: kOf(n, f) }, target: { metric: m, value } });
        expect(allFinite(r)).toBe(true);
      }),
      { numRuns: 120 },
    );
  });
  it("for rate-only claims and the edge channels p = 0, p = 0.5, e = 0, k = n", () => {
    const edge = [
      { model: "bsc" as const, p: 0 },
      { model: "bsc" as const, p: 0.5 },
      { model: "bec" as const, e: 0 },
      { model: "biawgn" as const, esn0Db: -50 },
      { model: "biawgn" as const, esn0Db: 50 },
    ];
    for (const channel of edge)
      for (const code of [{ n: 1, k: 1 }, { n: 100, k: 100 }, { n: 100, k: 1 }, { rate: 1 }, { overhead: 0.07 }, { n: 5000, rate: 0.5 }]) {
        const r = evaluateClaim({ channel, code, target: { metric: "bler", value: 1e-30 } });
        expect(allFinite(r), JSON.stringify({ channel, code })).toBe(true);
      }
  });
});

// Finite-length rates against capacity and the normal approximation (Polyanskiy, Poor, Verdu 2010),
// Gallager's exponent (Gallager 1965), and the chart series builders.
import { describe, expect, it } from "vitest";
import {
  bscCapacity,
  bscDispersion,
  bscE0,
  bscGallagerExponent,
  becGallagerExponent,
  biawgnGallagerExponent,
  biawgnCapacity,
  channelCurve,
  qInv,
  rateCurve,
} from "@/lib/bounds";

describe("best rates against n (PPV)", () => {
  const p = 0.01;
  const eps = 1e-6;
  const C = bscCapacity(p);
  const curve = rateCurve({ model: "bsc", x: p, targetBler: eps, nMin: 100, nMax: 100_000, points: 7 });
  it("converse and RCU rates tend to C as n grows, converse above RCU", () => {
    let lastGap = Infinity;
    for (const pt of curve) {
      expect(pt.converseRate!).toBeGreaterThanOrEqual(pt.achievableRate!);
      expect(pt.converseRate!).toBeLessThan(C);
      const gap = C - pt.achievableRate!;
      expect(gap).toBeLessThan(lastGap);
      lastGap = gap;
    }
    // at n = 1e5 both are within the dispersion term sqrt(V/n) Qinv(eps) (plus a little) of C
    const last = curve[curve.length - 1];
    const spread = Math.sqrt(bscDispersion(p) / last.n) * qInv(eps);
    expect(C - last.achievableRate!).toBeLessThan(1.2 * spread);
    expect(C - last.converseRate!).toBeGreaterThan(0.8 * spread);
  });
  it("the normal approximation stays close to both for n >= 100 (within a few log2(n)/n)", () => {
    for (const pt of curve) {
      const slack = (2 * Math.log2(pt.n)) / pt.n + 2 / pt.n;
      expect(Math.abs(pt.normalRate - pt.converseRate!)).toBeLessThan(slack);
      expect(Math.abs(pt.normalRate - pt.achievableRate!)).toBeLessThan(slack);
    }
  });
  it("the normal approximation is not a bound: it can exceed the converse rate", () => {
    // BSC p = 0.01, BLER 1e-6: at moderate n the approximation promises more than any code can do
    expect(curve.some((pt) => pt.normalRate > pt.converseRate!)).toBe(true);
  });
  it("the BEC behaves the same way", () => {
    const bec = rateCurve({ model: "bec", x: 0.1, targetBler: 1e-3, nMin: 100, nMax: 100_000, points: 5 });
    for (const pt of bec) {
      expect(pt.converseRate!).toBeGreaterThanOrEqual(pt.achievableRate!);
      expect(Math.abs(pt.normalRate - pt.converseRate!)).toBeLessThan(2 / pt.n + Math.log2(pt.n) / pt.n);
    }
  });
});

describe("Gallager's random-coding exponent (Gallager 1965)", () => {
  it("is E0(1) (the cutoff rate) at R = 0, and 0 at capacity", () => {
    const p = 0.05;
    expect(bscGallagerExponent(p, 0).exponent).toBeCloseTo(bscE0(1, p), 9);
    expect(bscE0(1, p)).toBeCloseTo(1 - Math.log2(1 + 2 * Math.sqrt(p * (1 - p))), 12); // R0 of the BSC
    expect(bscGallagerExponent(p, bscCapacity(p)).exponent).toBeLessThan(1e-9);
    expect(becGallagerExponent(0.3, 0.7).exponent).toBeLessThan(1e-9);
    expect(biawgnGallagerExponent(0, biawgnCapacity(0)).exponent).toBeLessThan(1e-7);
  });
  it("falls as the rate grows", () => {
    let last = Infinity;
    for (const r of [0, 0.2, 0.4, 0.6]) {
      const e = bscGallagerExponent(0.02, r).exponent;
      expect(e).toBeLessThan(last);
      last = e;
    }
  });
});

describe("chart series (Bound explorer)", () => {
  it("BLER against the channel: ordered, monotone, finite", () => {
    for (const model of ["bsc", "bec"] as const) {
      // Its speed is tracked by the bench (npm run bench), never timed here.
      const pts = channelCurve({ model, n: 1944, k: 1620 });
      expect(pts.length).toBe(60);
      for (let i = 0; i < pts.length; i++) {
        expect(pts[i].converse!).toBeLessThanOrEqual(pts[i].achievable! + 1e-9);
        if (i > 0) {
          expect(pts[i].x).toBeGreaterThan(pts[i - 1].x);
          expect(pts[i].converse!).toBeGreaterThanOrEqual(pts[i - 1].converse! - 1e-9);
        }
      }
    }
    const awgn = channelCurve({ model: "biawgn", n: 64800, k: 32400, points: 40 });
    expect(awgn.length).toBe(40);
    // the BI-AWGN converse is Shannon's 1959 bound, below the normal approximation where that is moderate
    expect(awgn.every((pt) => pt.achievable === null && Number.isFinite(pt.normal) && pt.converse !== null)).toBe(true);
    for (const pt of awgn) if (pt.normal > -9 && pt.normal < -0.3) expect(pt.converse!).toBeLessThanOrEqual(pt.normal);
  });
  it("best rate against n for the BI-AWGN channel: the 1959 bound's rate above the normal approximation's, and only the unconstrained AWGN caps it", () => {
    const pts = rateCurve({ model: "biawgn", x: 0, targetBler: 1e-5 });
    expect(pts[0].n).toBe(10);
    expect(pts[pts.length - 1].n).toBe(100_000);
    // equal-energy codes need not be binary: their ceiling is the unconstrained AWGN, 1/2 log2(1 + 2 Es/N0) = 0.79 at 0 dB
    expect(
      pts.every((pt) => pt.achievableRate === null && pt.normalRate <= pt.capacity && pt.converseRate! >= pt.normalRate && pt.converseRate! <= 0.7925),
    ).toBe(true);
  });
});

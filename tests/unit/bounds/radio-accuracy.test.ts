// Accuracy of the radio bounds (BOUNDS.md sections 8-10) against independent computations:
// mpmath at 40 digits (reference/radio_reference.py, from the definitions), a Monte Carlo count,
// jstat's noncentral t and the @stdlib regularised incomplete beta.
import { describe, expect, it } from "vitest";
import jStat from "jstat";
import betainc from "@stdlib/math-base-special-betainc";
import {
  coneCot,
  coneExitLog,
  energyConverseEbn0Db,
  orthogonalEbn0Db,
  orthogonalLogBler,
  sensitivityToEbn0Db,
  ebn0ToSensitivityDbm,
  spherePackingEbn0Db,
  spherePackingLog,
  THERMAL_DBM_PER_HZ,
} from "@/lib/bounds";

const log10 = (ln: number) => ln / Math.LN10;
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe("Shannon 1959 against mpmath at 40 digits (relative 1e-8 on log10 BLER)", () => {
  // [dims, k, Eb/N0 dB, log10 BLER] from reference/radio_reference.py
  const cases = [
    [16, 8, 4, -2.6994946273707316],
    [128, 64, 3, -5.0199329946820387],
    [1024, 512, 1, -3.4668627850961801],
    [1024, 512, 2, -11.759473426751385],
    [2048, 1024, 3, -52.478499506919678],
    [8192, 7168, 5, -520.90700528049151], // far below 1e-300: about 1e-520 (BOUNDS.md section 8)
  ] as const;
  for (const [dims, k, db, ref] of cases)
    it(`n = ${dims}, k = ${k}, ${db} dB`, () => expect(rel(log10(spherePackingLog(dims, k, db)), ref)).toBeLessThan(1e-8));

  // [dims, k, BLER, least Eb/N0 dB]
  const inverse = [
    [128, 64, 1e-3, 2.17381595547097],
    [1024, 512, 1e-4, 1.09527797049423], // the "about 1.1 dB" for (1024, 512) at PER 1e-4
    [2048, 1024, 1e-10, 1.3499565260809],
  ] as const;
  for (const [dims, k, eps, ref] of inverse)
    it(`least Eb/N0 for n = ${dims}, k = ${k} at BLER ${eps} within 1e-6 dB`, () =>
      expect(Math.abs(spherePackingEbn0Db(dims, k, Math.log(eps))! - ref)).toBeLessThan(1e-6));
});

describe("energy per bit against mpmath (1e-6 dB), PPV 2011", () => {
  const converse = [
    [1, 1e-5, 9.58785834684761],
    [160, 1e-2, -0.455159818242876],
    [1000, 1e-3, -0.92551005930309],
    [100000, 1e-3, -1.52037743878828],
    [1000000, 1e-3, -1.56902818439733],
  ] as const;
  for (const [k, eps, ref] of converse)
    it(`converse at k = ${k}, BLER ${eps}`, () => expect(Math.abs(energyConverseEbn0Db(k, Math.log(eps))! - ref)).toBeLessThan(1e-6));
  const orthogonal = [
    [1, 1e-3, 9.79982256904398],
    [10, 1e-3, 3.35206655953456],
    [160, 1e-2, -0.430537500390375],
  ] as const;
  for (const [k, eps, ref] of orthogonal)
    it(`orthogonal signalling at k = ${k}, BLER ${eps}`, () => expect(Math.abs(orthogonalEbn0Db(k, Math.log(eps))! - ref)).toBeLessThan(1e-6));
});

describe("sensitivity conversion (1e-9 dB)", () => {
  it("10 log10(k_B T0 / 1 mW) at 290 K is -173.97518719422810 dBm/Hz (mpmath), the '-174 dBm/Hz' of common practice", () => {
    expect(Math.abs(THERMAL_DBM_PER_HZ - -173.9751871942281)).toBeLessThan(1e-9);
    expect(Math.round(THERMAL_DBM_PER_HZ)).toBe(-174);
  });
  it("S = -174 + 10 log10(bandwidth) + NF + required SNR, and back (common practice)", () => {
    // at Rb = 1200 bit/s and NF 2 dB, Eb/N0 = -121.5 + 173.97518719422810 - 30.791812460476248 - 2
    expect(Math.abs(sensitivityToEbn0Db(-121.5, 1200, 2) - 19.683374733751852)).toBeLessThan(1e-9);
    for (const ebn0 of [-1.59, 0, 9.6]) expect(Math.abs(sensitivityToEbn0Db(ebn0ToSensitivityDbm(ebn0, 250_000, 6), 250_000, 6) - ebn0)).toBeLessThan(1e-9);
  });
});

/** Seeded uniform generator (mulberry32) and Box-Muller normals, so the Monte Carlo count replays. */
function normals(seed: number) {
  let a = seed >>> 0;
  const uni = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uni())) * Math.cos(2 * Math.PI * uni());
}

describe("cross-checks of the 1959 bound (Shannon 1959; the libraries' documentation)", () => {
  it("agrees with a Monte Carlo count of received points outside the cone, n = 8 to 16 (seed 1959)", () => {
    const z = normals(1959);
    for (const [n, k, db] of [
      [8, 4, 2],
      [12, 6, 1],
      [16, 8, 3],
    ]) {
      const c = coneCot(n, k);
      const s = Math.sqrt(2 * k * 10 ** (db / 10));
      const trials = 200_000;
      let outside = 0;
      for (let t = 0; t < trials; t++) {
        const y1 = s + z();
        let perp = 0;
        for (let i = 1; i < n; i++) perp += z() ** 2;
        if (y1 < Math.sqrt(perp) * c) outside++; // the angle to the codeword exceeds theta_n
      }
      const p = Math.exp(coneExitLog(n, c, s));
      const sd = Math.sqrt((p * (1 - p)) / trials);
      expect(Math.abs(outside / trials - p), `n = ${n}`).toBeLessThan(5 * sd);
    }
  });
  it("agrees with jstat's noncentral t, P[T < sqrt(n-1) cot theta], where its double precision holds", () => {
    for (const [n, k, db] of [
      [16, 8, 4],
      [64, 32, 2],
      [128, 64, 3],
      [200, 100, 2.5],
    ]) {
      const c = coneCot(n, k);
      const s = Math.sqrt(2 * k * 10 ** (db / 10));
      const t = jStat.noncentralt.cdf(Math.sqrt(n - 1) * c, n - 1, s);
      expect(rel(Math.exp(coneExitLog(n, c, s)), t)).toBeLessThan(1e-8); // jstat itself is good to about 1e-9
    }
  });
  it("theta_n holds 2^-k of the sphere by @stdlib's incomplete beta: 1/2 I_{sin^2 theta}((n-1)/2, 1/2) = 2^-k", () => {
    for (const [n, k] of [
      [10, 3],
      [100, 50],
      [1000, 900],
      [4000, 500],
    ]) {
      const c = coneCot(n, k);
      const sin2 = 1 / (1 + c * c);
      expect(rel(0.5 * betainc(sin2, (n - 1) / 2, 0.5), 2 ** -k)).toBeLessThan(1e-9);
    }
  });
  it("with k = 1 (half the sphere) the bound is antipodal signalling exactly, Q(sqrt(2 Eb/N0))", () => {
    for (const db of [0, 4, 9.6]) {
      const q = jStat.normal.cdf(-Math.sqrt(2 * 10 ** (db / 10)), 0, 1);
      expect(rel(Math.exp(spherePackingLog(100, 1, db)), q)).toBeLessThan(1e-12);
    }
  });
  it("with k = 1, orthogonal signalling is binary orthogonal: Q(sqrt(E/N0)) (Proakis)", () => {
    const a = 3;
    expect(rel(Math.exp(orthogonalLogBler(1, a)), jStat.normal.cdf(-a / Math.SQRT2, 0, 1))).toBeLessThan(1e-10);
  });
});

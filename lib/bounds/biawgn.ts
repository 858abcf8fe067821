// Binary-input AWGN (soft-decision BPSK): capacity, dispersion, Gallager's E0, by quadrature.
import { dbToLinear, linearToDb } from "./channels";
import { integrate } from "./quadrature";
import { LN2 } from "./special";

const log1p = Math.log1p;
import { solveIncreasing } from "./solve";

const INV_SQRT_2PI = 1 / Math.sqrt(2 * Math.PI);
/**
 * Standard normal range integrated. Beyond |z| = 12 the density is below 2e-32, and every integrand
 * here is at most |L| + 1 = mu + s|z| + 1 bits, so the neglected part is below 1e-24 (mu + s) --
 * under 1e-17 for Es/N0 up to 60 dB, far inside the 1e-10 accuracy asked of the capacity.
 */
const Z_MAX = 12;
const TOL = 1e-14;

/** ln(1 + e^x) without overflow. */
function softplus(x: number): number {
  return x > 0 ? x + log1p(Math.exp(-x)) : log1p(Math.exp(x));
}

/**
 * E[h(Z)] for Z standard normal, split where the LLR crosses 0 (the bend of the integrand), so
 * each panel sees a smooth function.
 */
function gaussExpect(h: (z: number) => number, split: number, tol = TOL): number {
  const f = (z: number) => h(z) * INV_SQRT_2PI * Math.exp(-0.5 * z * z);
  // With no signal at all (Es/N0 so low that mu underflows to 0) the split is 0/0: any split will do.
  const c = Number.isNaN(split) ? 0 : Math.min(Z_MAX, Math.max(-Z_MAX, split));
  return integrate(f, -Z_MAX, c, tol) + integrate(f, c, Z_MAX, tol);
}

/**
 * The LLR of BPSK over AWGN given +1 was sent: L = 2Y/sigma^2 ~ N(mu, 2 mu) with mu = 4 Es/N0
 * (sigma^2 = 1 / (2 Es/N0)). Returns mu and its standard deviation.
 */
function llr(esn0Db: number): { mu: number; s: number } {
  const mu = 4 * dbToLinear(esn0Db);
  return { mu, s: Math.sqrt(2 * mu) };
}

/** 1 - C = E[log2(1 + exp(-L))], computed directly so it keeps its digits when small. */
export function biawgnCapacityGap(esn0Db: number): number {
  const { mu, s } = llr(esn0Db);
  return gaussExpect((z) => softplus(-(mu + s * z)) / LN2, -mu / s);
}

/** C = 1 - E[log2(1 + exp(-2Y/sigma^2))], Y ~ N(1, sigma^2) (Shannon 1948; e.g. Richardson and Urbanke 2008). */
export function biawgnCapacity(esn0Db: number): number {
  return 1 - biawgnCapacityGap(esn0Db);
}

/** V = Var[log2(1 + exp(-L))] (Polyanskiy, Poor, Verdu 2010, dispersion of a memoryless channel). */
export function biawgnDispersion(esn0Db: number): number {
  return biawgnCapDisp(esn0Db).dispersion;
}

/** Capacity and dispersion together (two passes: the variance is taken about the mean, no cancellation). */
export function biawgnCapDisp(esn0Db: number): { capacity: number; dispersion: number } {
  const { mu, s } = llr(esn0Db);
  const g = (z: number) => softplus(-(mu + s * z)) / LN2;
  const m = gaussExpect(g, -mu / s);
  const v = gaussExpect((z) => (g(z) - m) ** 2, -mu / s);
  return { capacity: 1 - m, dispersion: v };
}

/**
 * Gallager's E0(rho) in bits for uniform BPSK input:
 * E0 = -log2 E[((1 + exp(-L/(1+rho))) / 2)^(1+rho)] (Gallager 1965, eq. for symmetric channels).
 */
export function biawgnE0(rho: number, esn0Db: number): number {
  const { mu, s } = llr(esn0Db);
  const a = 1 + rho;
  const h = (z: number) => Math.exp(a * (softplus(-(mu + s * z) / a) - LN2));
  return -Math.log2(gaussExpect(h, -mu / s, 1e-11));
}

/** Smallest Es/N0 (dB) at which capacity reaches `capacity` (< 1), by bracketed root finding. */
export function biawgnEsn0ForCapacity(capacity: number): number {
  // Search on the gap 1 - C so that rates near 1 keep their digits. The unconstrained AWGN needs
  // less Es/N0 for the same capacity (2^(2C) - 1) / 2, which makes a good first guess.
  const gap = 1 - capacity;
  const guess = linearToDb(Math.expm1(2 * capacity * LN2) / 2);
  return esn0Where((db) => gap - biawgnCapacityGap(db), guess);
}

const DB_MIN = -100;
const DB_MAX = 60;

/**
 * Lowest Es/N0 (dB) where an increasing function of Es/N0 reaches 0, searched over -100..60 dB
 * (clamped there). A guess lets it gallop to a tight bracket first.
 */
export function esn0Where(f: (db: number) => number, guess?: number): number {
  let lo = DB_MIN;
  let hi = DB_MAX;
  if (guess !== undefined && Number.isFinite(guess)) {
    const g0 = Math.min(DB_MAX, Math.max(DB_MIN, guess));
    const up = f(g0) <= 0;
    let edge = g0;
    for (let d = 0.05; ; d *= 2) {
      const x = up ? Math.min(DB_MAX, g0 + d) : Math.max(DB_MIN, g0 - d);
      const fx = f(x);
      if (up && fx > 0) [lo, hi] = [edge, x];
      else if (!up && fx <= 0) [lo, hi] = [x, edge];
      else if (x === DB_MAX || x === DB_MIN) return x;
      else {
        edge = x;
        continue;
      }
      break;
    }
  } else {
    if (f(DB_MAX) <= 0) return DB_MAX;
    if (f(DB_MIN) > 0) return DB_MIN;
  }
  return solveIncreasing(f, lo, hi, 1e-9);
}

// Shannon's 1959 sphere-packing bound for codes whose codewords all have the same energy
// (C. E. Shannon, "Probability of error for optimal codes in a Gaussian channel", Bell Syst. Tech.
// J. 38(3), 1959), in the log domain: BLER >= Q_n(theta_n, A) = E[Phi(V cot theta_n - sqrt(n) A)].
import { logBetaInc } from "./beta";
import { dbToLinear, linearToDb } from "./channels";
import { integrate } from "./quadrature";
import { solveIncreasing } from "./solve";
import { onClearBoundsCaches } from "./sums";
import { erfcx, gammaln, LN2, lnGammaHalfRatio, logQ, millsInvLarge, stirlerr } from "./special";

const HALF_PI = Math.PI / 2;
/** Nats below the peak of a log-concave integrand where the window stops (e^-40: 4e-18 of the peak). */
const WINDOW_NATS = 40;

/**
 * theta_n: the half-angle of the cone that holds 2^-k of the surface of the sphere in `dims`
 * dimensions, 1/2 I_{sin^2 theta}((dims-1)/2, 1/2) = 2^-k (Shannon 1959, eq. (4) and the solid
 * angle of a cap). Returns cot theta_n (0 for k <= 1: half the sphere).
 */
export function coneCot(dims: number, k: number): number {
  if (k <= 1 || dims <= 1) return 0;
  const key = `${dims},${k}`;
  const hit = cotCache.get(key);
  if (hit !== undefined) return hit;
  const a = (dims - 1) / 2;
  const lnBeta = 0.5 * Math.log(Math.PI) - lnGammaHalfRatio(a); // ln B(a, 1/2) = ln Gamma(1/2) - ln(Gamma(a + 1/2) / Gamma(a))
  const target = (1 - k) * LN2; // ln 2^(1-k)
  // ln I grows with theta; solved in theta itself so that sin and cos keep their digits.
  const f = (t: number) => logBetaInc(a, 0.5, 2 * Math.log(Math.sin(t)), 2 * Math.log(Math.cos(t)), lnBeta) - target;
  let lo = Math.asin(Math.min(1, 2 ** (-k / (dims - 1)))); // the large-n estimate sin theta ~ 2^-R
  let hi = HALF_PI;
  for (let i = 0; i < 1100 && f(lo) > 0; i++) [hi, lo] = [lo, lo / 2]; // at most ~1075 halvings reach 0
  if (hi === HALF_PI) hi = HALF_PI - 1e-16;
  const theta = f(hi) <= 0 ? hi : solveIncreasing(f, lo, hi, 1e-15);
  const cot = Math.cos(theta) / Math.sin(theta);
  if (cotCache.size > 5000) cotCache.clear();
  cotCache.set(key, cot);
  return cot;
}
const cotCache = new Map<string, number>();
onClearBoundsCaches(() => cotCache.clear());

/** ln Phi(x) = ln Q(-x). */
const logPhi = (x: number) => logQ(-x);
/** phi(y) / Q(y), the inverse Mills ratio, for any y. */
const millsInv = (y: number) => (y >= 5 ? millsInvLarge(y) : Math.sqrt(2 / Math.PI) / erfcx(y / Math.SQRT2));

/**
 * ln of the chi density with m = nu + 1 degrees of freedom, v^nu e^(-v^2/2) / (2^(m/2-1) Gamma(m/2)).
 * For large nu it is written around v0 = sqrt(nu) with Stirling's series, so no two terms of size
 * nu ln nu cancel: nu [ln(1+d) - d - d^2/2] + C with d = v/v0 - 1.
 */
function chiLogDensity(nu: number): (v: number) => number {
  if (nu < 30) {
    const c = -(0.5 * (nu + 1) - 1) * LN2 - gammaln(0.5 * (nu + 1));
    return (v) => (nu === 0 ? 0 : nu * Math.log(v)) - 0.5 * v * v + c;
  }
  const v0 = Math.sqrt(nu);
  const c = -0.5 * nu * Math.log1p(1 / nu) + 0.5 - 0.5 * Math.log(Math.PI) - stirlerr(0.5 * (nu + 1));
  return (v) => {
    const d = v / v0 - 1;
    return nu * (Math.log1p(d) - d - 0.5 * d * d) + c;
  };
}

/** Largest point of a concave g on (0, inf), from the sign of its derivative dg (decreasing). */
function peakOf(dg: (v: number) => number, start: number): number {
  let lo = 0;
  let hi = Math.max(1, start);
  for (let i = 0; i < 200 && dg(hi) > 0; i++) [lo, hi] = [hi, 2 * hi];
  for (let i = 0; i < 200 && hi - lo > 1e-12 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (dg(mid) > 0) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/**
 * ln of the integral of exp(g) over (0, inf) for a concave g peaking at vStar: exp(g - g*) is
 * integrated between the points where g falls WINDOW_NATS below its peak (found by doubling steps).
 */
function logIntegralConcave(g: (v: number) => number, vStar: number, scale: number): number {
  const top = g(vStar);
  let lo = vStar;
  for (let d = scale; lo > 0; d *= 2) {
    lo = Math.max(0, vStar - d);
    if (g(lo) < top - WINDOW_NATS) break;
  }
  let hi = vStar;
  for (let d = scale, i = 0; i < 200; d *= 2, i++) {
    hi = vStar + d;
    if (g(hi) < top - WINDOW_NATS) break;
  }
  const f = (v: number) => Math.exp(g(v) - top);
  const mid = Math.min(hi, Math.max(lo, vStar));
  // The integrand peaks at 1 over a window of width hi - lo, so this tolerance is about 1e-12 of
  // the integral: far inside the rounding noise of g itself (an ulp of terms of size nu) is not asked for.
  const tol = 1e-12 * (hi - lo);
  return top + Math.log(integrate(f, lo, mid, tol) + integrate(f, mid, hi, tol));
}

/**
 * ln Q_n(theta, A) with s = sqrt(n) A the codeword's amplitude over the noise standard deviation
 * and c = cot theta: ln E[Phi(c V - s)], V chi-distributed with dims - 1 degrees of freedom
 * (Shannon 1959, eq. (21) in the form of Valembois and Fossorier 2004).
 */
export function coneExitLog(dims: number, c: number, s: number): number {
  if (c === 0 || dims <= 1) return logQ(s); // half-space: antipodal signalling, exact
  const nu = dims - 2;
  const lnChi = chiLogDensity(nu);
  const g = (v: number) => lnChi(v) + logPhi(c * v - s);
  const dg = (v: number) => nu / v - v + c * millsInv(s - c * v);
  const vStar = peakOf(dg, Math.sqrt(Math.max(1, nu)));
  return Math.min(0, logIntegralConcave(g, vStar, 0.5));
}

/**
 * ln of the least BLER of an equal-energy code with 2^k codewords in `dims` real dimensions at
 * energy per information bit Eb/N0 (dB): the total energy k Eb gives s^2 = 2 k Eb/N0.
 * dims = n for BPSK and Gray QPSK (n coded bits); n + 1 for a code under a power limit
 * (Polyanskiy, Poor, Verdu 2010, Lemma 39).
 */
export function spherePackingLog(dims: number, k: number, ebn0Db: number): number {
  const s = Math.sqrt(2 * k * dbToLinear(ebn0Db));
  return coneExitLog(dims, coneCot(dims, k), s);
}

/**
 * Least Eb/N0 (dB) at which the 1959 bound allows block error exp(logEps): the bound falls as s
 * grows, so the root is bracketed between s = 0 and a doubling upper end. null when the bound
 * allows it even with no energy at all (the claimed BLER is at or above the bound at s = 0).
 */
export function spherePackingEbn0Db(dims: number, k: number, logEps: number): number | null {
  const c = coneCot(dims, k);
  const f = (s: number) => logEps - coneExitLog(dims, c, s); // increasing in s
  if (f(0) >= 0) return null;
  let hi = c * Math.sqrt(Math.max(1, dims - 2)) + Math.sqrt(-2 * logEps) + 1;
  let lo = 0;
  for (let i = 0; i < 200 && f(hi) <= 0; i++) [lo, hi] = [hi, 2 * hi];
  const s = solveIncreasing(f, lo, hi, 1e-14);
  return linearToDb((s * s) / (2 * k));
}

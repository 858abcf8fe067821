// Thin wrappers around the special-function libraries, plus the log-domain helpers the
// bounds need. Probabilities are carried as natural logarithms throughout the engine.
import gammaln from "@stdlib/math-base-special-gammaln";
import erfc from "@stdlib/math-base-special-erfc";
import erfcinv from "@stdlib/math-base-special-erfcinv";
import erfcx from "@stdlib/math-base-special-erfcx";

// V8's Math.log1p and Math.expm1 are fdlibm ports (within 1 ulp) and much faster than any JS port.
const log1p = Math.log1p;
const expm1 = Math.expm1;

export { gammaln, erfc, erfcinv, erfcx, log1p, expm1 };

export const LN2 = Math.LN2;
export const LOG10E = Math.LOG10E;
const SQRT2 = Math.SQRT2;

/** ln(e^a + e^b) without overflow; -Infinity is the log of zero. */
export function logAddExp(a: number, b: number): number {
  if (a === -Infinity) return b;
  if (b === -Infinity) return a;
  const m = Math.max(a, b);
  return m + log1p(Math.exp(-Math.abs(a - b)));
}

/** ln(1 - e^x) for x <= 0 (Maechler 2012, "Accurately computing log(1 - exp(-|a|))"). */
export function log1mExp(x: number): number {
  if (x >= 0) return -Infinity;
  return x > -LN2 ? Math.log(-expm1(x)) : log1p(-Math.exp(x));
}

/** ln C(n, t) from the log-gamma function; n and t may be real (log2 M need not be an integer). */
export function logChoose(n: number, t: number): number {
  if (t < 0 || t > n) return -Infinity;
  if (t === 0 || t === n) return 0;
  return gammaln(n + 1) - gammaln(t + 1) - gammaln(n - t + 1);
}

/** ln P[Binomial(n, p) = t], given ln p and ln(1 - p); exact zeros stay -Infinity, never NaN. */
export function logBinomPmf(n: number, t: number, lnp: number, ln1mp: number): number {
  const a = t === 0 ? 0 : t * lnp;
  const b = n - t === 0 ? 0 : (n - t) * ln1mp;
  return logChoose(n, t) + a + b;
}

/** Binary entropy h2(x) in bits. */
export function h2(x: number): number {
  if (x <= 0 || x >= 1) return 0;
  return (-x * Math.log(x) - (1 - x) * log1p(-x)) / LN2;
}

/** Inverse of h2 on [0, 1/2], by bisection in log x (h2 grows there). */
export function h2inv(y: number): number {
  if (y <= 0) return 0;
  if (y >= 1) return 0.5;
  let lo = -746;
  let hi = -LN2;
  for (let i = 0; i < 200 && hi - lo > 1e-15 * Math.abs(lo); i++) {
    const mid = 0.5 * (lo + hi);
    if (h2(Math.exp(mid)) <= y) lo = mid;
    else hi = mid;
  }
  return Math.exp(lo);
}

const LN_SQRT_2PI = 0.5 * Math.log(2 * Math.PI);

/**
 * x Q(x) / phi(x)'s reciprocal partner: phi(x) / Q(x) = x + 1/(x + 2/(x + 3/(x + ...))), Laplace's
 * continued fraction, summed from 30 levels down; for x >= 5 that is exact to double precision
 * (the tests compare it with the library's erfcx). Much faster than erfcx in inner loops.
 */
export function millsInvLarge(x: number): number {
  let t = x;
  for (let j = 30; j >= 1; j--) t = x + j / t;
  return t;
}

/** ln Q(x), Q the Gaussian tail; finite far beyond where Q underflows. */
export function logQ(x: number): number {
  if (x === Infinity) return -Infinity;
  if (x === -Infinity) return 0;
  if (x < 5) return Math.log(0.5 * erfc(x / SQRT2));
  // Q(x) = phi(x) / (phi(x) / Q(x)), the ratio from Laplace's continued fraction
  return -0.5 * x * x - LN_SQRT_2PI - Math.log(millsInvLarge(x));
}

/** Q(x) = 0.5 erfc(x / sqrt 2). */
export function qFunc(x: number): number {
  return 0.5 * erfc(x / SQRT2);
}

/** Qinv(eps) = sqrt(2) erfcinv(2 eps). */
export function qInv(eps: number): number {
  return SQRT2 * erfcinv(2 * eps);
}

/** Qinv from ln eps, valid where eps itself underflows: Newton on ln Q, whose slope is -phi(x)/Q(x). */
export function qInvLog(lnEps: number): number {
  if (lnEps > -700) return qInv(Math.exp(lnEps));
  let x = Math.sqrt(-2 * lnEps);
  for (let i = 0; i < 50; i++) {
    const slope = -millsInvLarge(x); // d ln Q / dx = -phi(x) / Q(x), x > 37 here
    const step = (logQ(x) - lnEps) / slope;
    x -= step;
    if (Math.abs(step) < 1e-15 * x) break;
  }
  return x;
}

/** Turns a natural log into log10, mapping the log of an exact zero to a finite floor. */
export const LOG10_ZERO = -Number.MAX_VALUE;
export function toLog10(lnValue: number): number {
  if (lnValue === -Infinity) return LOG10_ZERO;
  return lnValue * LOG10E + 0; // + 0 turns -0 into 0
}

/**
 * Absolute error allowance of a natural-log probability at block length n: each log-binomial term
 * is a difference of log-gamma values of size about n ln n, each good to a few ulps.
 */
export function logNumericSlack(n: number): number {
  return 8 * Number.EPSILON * (gammaln(n + 1) + n);
}

/**
 * Stirling's error ln Gamma(x) - [(x - 1/2) ln x - x + 1/2 ln(2 pi)]: the asymptotic series for
 * x >= 15 (next term below 3e-16; Abramowitz and Stegun 6.1.41), log-gamma itself below.
 */
export function stirlerr(x: number): number {
  if (x < 15) return gammaln(x) - (x - 0.5) * Math.log(x) + x - 0.5 * Math.log(2 * Math.PI);
  const y = 1 / (x * x);
  return (1 / 12 - y * (1 / 360 - y * (1 / 1260 - y * (1 / 1680 - y / 1188)))) / x;
}

/** ln Gamma(a + 1/2) - ln Gamma(a) without the cancellation of two log-gammas of size a ln a. */
export function lnGammaHalfRatio(a: number): number {
  if (a < 15) return gammaln(a + 0.5) - gammaln(a);
  // from the Stirling form of both: a ln(1 + 1/(2a)) - 1/2 + 1/2 ln a + stirlerr(a + 1/2) - stirlerr(a)
  return a * log1p(0.5 / a) - 0.5 + 0.5 * Math.log(a) + stirlerr(a + 0.5) - stirlerr(a);
}

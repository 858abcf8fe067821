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

/** ln Q(x), Q the Gaussian tail; erfcx keeps it finite far beyond where Q underflows. */
export function logQ(x: number): number {
  if (x === Infinity) return -Infinity;
  if (x === -Infinity) return 0;
  if (x < 5) return Math.log(0.5 * erfc(x / SQRT2));
  // Q(x) = 0.5 erfcx(x / sqrt 2) exp(-x^2 / 2) (definition of the scaled complementary error function)
  return Math.log(0.5 * erfcx(x / SQRT2)) - (x * x) / 2;
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
    // phi(x) / Q(x) = sqrt(2/pi) / erfcx(x / sqrt 2)
    const slope = -Math.sqrt(2 / Math.PI) / erfcx(x / SQRT2);
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

// The log of the regularised incomplete beta function I_x(a, b), for arguments where I itself
// underflows (the cone of the sphere-packing bound holds 2^-k of the sphere, k in the thousands).
import { gammaln, log1mExp } from "./special";

/** Continued-fraction terms summed at most; the fraction converges in O(sqrt(max(a, b))) terms. */
const MAX_TERMS = 100_000;
const TINY = 1e-300;

/**
 * The continued fraction of I_x(a, b) by the modified Lentz method (Numerical Recipes, 3rd ed.,
 * section 6.4, betacf): I_x(a, b) = x^a (1-x)^b / (a B(a, b)) * cf. Converges fast for
 * x < (a + 1) / (a + b + 2).
 */
function betaCf(a: number, b: number, x: number): number {
  const qab = a + b;
  let c = 1;
  let d = 1 - (qab * x) / (a + 1);
  if (Math.abs(d) < TINY) d = TINY;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= MAX_TERMS; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (qab + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < 1e-16) break;
  }
  return h;
}

/**
 * ln I_x(a, b) given ln x and ln(1 - x) (both kept exact by the caller, e.g. 2 ln sin and
 * 2 ln cos of an angle). lnBeta is ln B(a, b), which the caller may compute without cancellation.
 */
export function logBetaInc(a: number, b: number, lnx: number, ln1mx: number, lnBeta = gammaln(a) + gammaln(b) - gammaln(a + b)): number {
  if (lnx === -Infinity) return -Infinity;
  if (ln1mx === -Infinity) return 0;
  const x = Math.exp(lnx);
  const front = a * lnx + b * ln1mx - lnBeta;
  if (x < (a + 1) / (a + b + 2)) return front - Math.log(a) + Math.log(betaCf(a, b, x));
  // symmetry I_x(a, b) = 1 - I_{1-x}(b, a), the second term small here
  return log1mExp(Math.min(0, front - Math.log(b) + Math.log(betaCf(b, a, Math.exp(ln1mx)))));
}

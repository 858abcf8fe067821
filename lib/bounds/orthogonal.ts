// Fast inverse of the M-ary orthogonal achievability (PPV 2011): the least amplitude a with
// BLER(a) <= eps, by Newton's method on ln BLER(a), from the converse's amplitude.
//
// BLER(a) = P[Y > X + a] with Y the largest of M - 1 standard normals and X standard normal, so
// BLER(a) = integral f_Y(y) Q(a - y) dy, f_Y(y) = (M-1) phi(y) Phi(y)^(M-2) (the same integral as
// energy.ts's orthogonalLogBler, with the order of integration swapped). Both factors are
// log-concave in y, so the log integrand L is concave and BLER is log-concave in a (Prekopa):
// Newton from the converse (a lower end, no code does better) overshoots once and then falls
// monotonically onto the root. d ln BLER / da = -integral f_Y phi(a - y) dy / BLER, from the same nodes.
//
// f_Y has the width of a Gumbel law, 1/sqrt(-L'') at its peak; the trapezoid rule on a smooth,
// rapidly decaying integrand over the line errs by about exp(-2 pi d / h), d the half-width of
// the strip where it is analytic (pi/2 for the Gumbel shape, in its own scale; Trefethen and
// Weideman, "The exponentially convergent trapezoidal rule", SIAM Review 56(3), 2014). With h =
// 0.5 of the width that is about exp(-20) = 3e-9, below the 1e-7 relative accuracy that 1e-6 dB
// asks for (an error d in ln BLER moves a by d / |d ln BLER / da|, and that slope is above 1). The grid stays fixed across Newton steps, so ln f_Y at a node is computed once.
import { linearToDb } from "./channels";
import { LN2, log1mExp, logQ, millsInvLarge, qInvLog } from "./special";

/** Trapezoid step in widths of the peak: error about exp(-pi^2 / STEP) = 3e-9 relative. */
const STEP = 0.5;
const LN_SQRT_2PI = 0.5 * Math.log(2 * Math.PI);
const CUT = 27; // nats below the running peak at which marching stops (e^-27 ~ 2e-12)

const lnPhiCdf = (y: number) => (y < 0 ? logQ(-y) : log1mExp(logQ(y)));

/** ln(-ln Phi(z)), accurate in both tails (-ln Phi(z) = Q(z) (1 + Q/2 + ...) far right). */
export function lnNegLogPhi(z: number): number {
  if (z <= 0) return Math.log(-logQ(-z));
  const lq = logQ(z);
  return lq < -30 ? lq : Math.log(-Math.log1p(-Math.exp(lq)));
}
/** phi(x) / Q(x), the inverse Mills ratio. */
const millsInv = (x: number) => (x >= 5 ? millsInvLarge(x) : Math.exp(-0.5 * x * x - LN_SQRT_2PI - logQ(x)));

interface Grid {
  lnM1: number; // ln(M - 1)
  lnM2: number; // ln(M - 2), -Infinity for M = 2
  origin: number;
  h: number;
  lnFy: Float64Array; // ln f_Y at node j, index j + HALF; NaN until computed
}

const HALF = 2048;

function lnFy(g: Grid, j: number): number {
  const i = j + HALF;
  const inside = i >= 0 && i < g.lnFy.length;
  let v = inside ? g.lnFy[i] : NaN;
  if (Number.isNaN(v)) {
    const y = g.origin + j * g.h;
    // (M-2) ln Phi(y) = -exp(ln(M-2) + ln(-ln Phi(y))), exact in both tails
    const tail = g.lnM2 === -Infinity ? 0 : -Math.exp(g.lnM2 + lnNegLogPhi(y));
    v = g.lnM1 - 0.5 * y * y - LN_SQRT_2PI + tail;
    if (inside) g.lnFy[i] = v;
  }
  return v;
}

/** Peak of the concave L(y) = ln f_Y(y) + ln Q(a - y) and the curvature there, by safeguarded Newton. */
function peak(lnM2: number, a: number, y0: number): { y: number; curv: number } {
  const d = (y: number) => {
    const lp = lnPhiCdf(y);
    const lnphi = -0.5 * y * y - LN_SQRT_2PI;
    const r = Math.exp(lnphi - lp); // phi / Phi
    const A = lnM2 === -Infinity ? 0 : Math.exp(lnM2 + lnphi - lp); // (M-2) phi / Phi, finite at the peak
    const x = a - y;
    const m = millsInv(x);
    return { d1: -y + A + m, d2: -1 - A * (y + r) - m * (m - x) };
  };
  let lo = -Infinity;
  let hi = Infinity;
  let y = y0;
  let cur = d(y);
  for (let i = 0; i < 100; i++) {
    if (cur.d1 > 0) lo = y;
    else hi = y;
    let next = y - cur.d1 / cur.d2;
    if (!(next > lo && next < hi)) next = Number.isFinite(lo) && Number.isFinite(hi) ? 0.5 * (lo + hi) : y + (cur.d1 > 0 ? 1 : -1) * Math.max(1, Math.abs(y));
    const step = Math.abs(next - y);
    y = next;
    cur = d(y);
    if (step < 1e-6 / Math.sqrt(-cur.d2)) break;
  }
  return { y, curv: -cur.d2 };
}

/** ln BLER(a) and its derivative in a, by marching the fixed grid from node j0 until both sides fade. */
function blerAt(g: Grid, a: number, j0: number): { lnB: number; slope: number; jPeak: number } {
  let top = -Infinity;
  let s0 = 0; // sum of exp(L - top)
  let s1 = 0; // sum of exp(ln f_Y + ln phi(a - y) - top)
  let jPeak = j0;
  const add = (j: number): number => {
    const x = a - (g.origin + j * g.h);
    const lq = logQ(x);
    const l = lnFy(g, j) + lq;
    if (l > top) {
      const r = Math.exp(top - l);
      s0 *= r;
      s1 *= r;
      top = l;
      jPeak = j;
    }
    s0 += Math.exp(l - top);
    s1 += Math.exp(l - lq - 0.5 * x * x - LN_SQRT_2PI - top);
    return l;
  };
  add(j0);
  for (const dir of [1, -1]) {
    let prev = Infinity;
    for (let j = j0 + dir, n = 0; n < 100_000; j += dir, n++) {
      const l = add(j);
      if (l < top - CUT && l < prev) break;
      prev = l;
    }
  }
  return { lnB: top + Math.log(g.h * s0), slope: -s1 / s0, jPeak };
}

function setup(k: number, a: number): Grid {
  const lnM1 = k * LN2 + log1mExp(-k * LN2);
  const lnM2 = k === 1 ? -Infinity : k * LN2 + log1mExp((1 - k) * LN2);
  const z0 = k === 1 ? 0 : qInvLog(-lnM1); // the Gumbel location of the largest of M - 1 normals
  const p = peak(lnM2, a, k === 1 ? 0.5 * a : z0);
  // the step resolves both the peak and the Gumbel flank of f_Y (width about 1/z0), which holds
  // mass when the peak sits far to the right of it (small k, deep BLER)
  return { lnM1, lnM2, origin: p.y, h: STEP / Math.sqrt(Math.max(p.curv, 1 + z0 * z0)), lnFy: new Float64Array(2 * HALF).fill(NaN) };
}

/** ln BLER of 2^k orthogonal signals at amplitude a (the same value as energy.ts's orthogonalLogBler, faster). */
export function orthogonalLogBlerFast(k: number, a: number): number {
  return Math.min(0, blerAt(setup(k, a), a, 0).lnB);
}

/**
 * Least amplitude sqrt(2 E/N0) at which 2^k orthogonal signals reach block error exp(logEps), or
 * null when even a = 0 does (eps >= 1 - 2^-k). Relative accuracy about 1e-9 in a.
 */
export function orthogonalAmplitude(k: number, logEps: number): number | null {
  if (logEps >= log1mExp(-k * LN2)) return null;
  let a = Math.max(0, qInvLog(-k * LN2) + qInvLog(logEps));
  const g = setup(k, a);
  let j0 = 0;
  for (let i = 0; i < 60; i++) {
    const r = blerAt(g, a, j0);
    j0 = r.jPeak;
    const step = (logEps - r.lnB) / r.slope;
    if (!Number.isFinite(step)) return null;
    a = Math.max(0, a + step);
    // quadratic convergence: after a step below 1e-7 the error left is of order 1e-14
    if (Math.abs(step) <= 1e-7 * (1 + a)) break;
  }
  return a;
}

/** Least Eb/N0 (dB) at which 2^k orthogonal signals reach block error exp(logEps) (achievability, PPV 2011). */
export function orthogonalEbn0Db(k: number, logEps: number): number | null {
  const a = orthogonalAmplitude(k, logEps);
  const db = a === null ? -Infinity : linearToDb((a * a) / (2 * k));
  return Number.isFinite(db) ? db : null; // eps a hair below 1 - 2^-k: no energy to speak of
}

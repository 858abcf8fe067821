// Windowed log-domain sums of log-concave sequences: the work horse of every finite-length bound.
import { gammaln as gammalnExport, h2inv, logBinomPmf, LN2 } from "./special";

// Local binding: module re-exports are reached through accessors in some loaders, too slow in inner loops.
const gammaln = gammalnExport;

/** Margin, in nats, below the largest term at which a term no longer matters. */
const DROP_NATS = 60;

/**
 * ln sum_{t=a..b} exp(f(t)) for a log-concave sequence f (binomial probabilities, binomial
 * coefficients, their products and partial sums are all log-concave).
 *
 * Window: starting from `guess`, step outwards with doubling steps until a term falls more than
 * 60 + ln(b - a + 1) nats below the starting term, then sum every term in between. Why the rest
 * is negligible: a log-concave sequence is unimodal, so every term beyond the stopping point is
 * smaller than the stopping term; there are at most b - a + 1 of them, so together they weigh less
 * than e^-60 (about 1e-26) times the starting term, hence less than 1e-26 of the result. A good
 * guess (the mode) keeps the window at O(sqrt n) terms; a poor one only costs time.
 */
export function logSumConcave(f: (t: number) => number, a: number, b: number, guess: number): number {
  if (a > b) return -Infinity;
  const w = concaveWindow(f, a, b, guess);
  return logSumRange(f, w.lo, w.hi, w.top);
}

/** The window [lo, hi] of logSumConcave, and the starting term `top` (see the argument above). */
export function concaveWindow(f: (t: number) => number, a: number, b: number, guess: number): { lo: number; hi: number; top: number } {
  const m = Math.min(b, Math.max(a, Math.round(guess)));
  const top = f(m);
  const floor = top - DROP_NATS - Math.log(b - a + 1);
  let lo = m;
  for (let d = 1; lo > a; d *= 2) {
    lo = Math.max(a, m - d);
    if (f(lo) < floor) break;
  }
  let hi = m;
  for (let d = 1; hi < b; d *= 2) {
    hi = Math.min(b, m + d);
    if (f(hi) < floor) break;
  }
  return { lo, hi, top };
}

/** Plain log-sum-exp over t = lo..hi, rescaling whenever a larger term appears. */
export function logSumRange(f: (t: number) => number, lo: number, hi: number, ref0 = -Infinity): number {
  let ref = ref0;
  let sum = 0;
  for (let t = lo; t <= hi; t++) {
    const v = f(t);
    if (v === -Infinity) continue;
    if (v > ref) {
      sum = sum * Math.exp(ref - v) + 1;
      ref = v;
    } else sum += Math.exp(v - ref);
  }
  return sum === 0 ? -Infinity : ref + Math.log(sum);
}

/** A binomial distribution prepared for repeated log-domain tail sums. */
export interface Binomial {
  n: number;
  p: number;
  lnp: number;
  ln1mp: number;
  mode: number;
  logPmf: (t: number) => number;
}

export function binomial(n: number, p: number): Binomial {
  const lnp = Math.log(p);
  const ln1mp = Math.log1p(-p);
  const lgn = gammaln(n + 1);
  const logPmf = (t: number): number => {
    if (t < 0 || t > n) return -Infinity;
    if (p === 0) return t === 0 ? 0 : -Infinity;
    if (t === 0 || t === n) return logBinomPmf(n, t, lnp, ln1mp);
    return lgn - gammaln(t + 1) - gammaln(n - t + 1) + t * lnp + (n - t) * ln1mp;
  };
  return { n, p, lnp, ln1mp, mode: Math.floor((n + 1) * p), logPmf };
}

/** Terms between exact log-gamma evaluations when walking a binomial by its term ratio. */
export const RESYNC = 64;

/**
 * ln sum_{t=a..b} P[T = t] e^(slope t) for T ~ Binomial(n, p): log-concave, so windowed as in
 * logSumConcave. Inside the window the terms follow from their ratio
 * (n-t)/(t+1) p/(1-p) e^slope, re-anchored on the exact log-gamma value every RESYNC terms: the
 * drift between anchors (a few ulps of O(1) numbers per step) stays far below the absolute error
 * of the anchor itself (an ulp of ln n! ~ n ln n).
 */
export function logBinomSum(B: Binomial, a: number, b: number, slope = 0, guess = B.mode): number {
  const lo0 = Math.max(0, Math.ceil(a));
  const hi0 = Math.min(B.n, Math.floor(b));
  if (lo0 > hi0) return -Infinity;
  if (B.p === 0) return lo0 <= 0 ? 0 : -Infinity;
  const f = (t: number) => B.logPmf(t) + slope * t;
  const { lo, hi, top } = concaveWindow(f, lo0, hi0, guess);
  // Linear terms relative to ref, walked by multiplying by the term ratio (no log or exp per term);
  // each RESYNC block starts from the exact log term, rescaling the sum when a block starts higher.
  const odds = Math.exp(B.lnp - B.ln1mp + slope);
  const n = B.n;
  let ref = top;
  let sum = 0;
  for (let t0 = lo; t0 <= hi; t0 += RESYNC) {
    const v = f(t0);
    if (v > ref) {
      sum *= Math.exp(ref - v);
      ref = v;
    }
    let w = Math.exp(v - ref);
    const end = Math.min(hi, t0 + RESYNC - 1);
    for (let t = t0; t <= end; t++) {
      sum += w;
      w *= ((n - t) / (t + 1)) * odds;
    }
  }
  // With the default guess (the mode, clamped to [a, b]) no term exceeds the first one by much; a
  // far-off guess could overflow a block, and then the plain log-domain sum answers instead.
  return Number.isFinite(sum) ? ref + Math.log(sum) : logSumRange(f, lo, hi, top);
}

/** ln P[a <= T <= b] for T ~ Binomial(n, p); integer a, b. */
export function logBinomRange(B: Binomial, a: number, b: number): number {
  return logBinomSum(B, a, b);
}

/**
 * ln S_L = ln sum_{t<L} C(n, t), the volume of a Hamming ball of radius L - 1 (integer n).
 * Memoised per n because the converse, the RCU bound and their inverses ask for the same L
 * again and again while only the channel changes.
 */
export class BallVolumes {
  private readonly cache = new Map<number, number>();
  private readonly lgn: number;
  private readonly half: Binomial;
  constructor(readonly n: number) {
    this.lgn = gammaln(n + 1);
    this.half = binomial(n, 0.5);
  }
  logChoose = (t: number): number => {
    if (t < 0 || t > this.n) return -Infinity;
    return this.lgn - gammaln(t + 1) - gammaln(this.n - t + 1);
  };
  /** ln S_L; S_0 = 0, S_{n+1} = 2^n. */
  logS(L: number): number {
    if (L <= 0) return -Infinity;
    if (L > this.n) return this.n * LN2;
    let v = this.cache.get(L);
    if (v === undefined) {
      // sum_{t<L} C(n, t) = 2^n P[Binomial(n, 1/2) < L], walked by the term ratio
      v = this.n * LN2 + logBinomSum(this.half, 0, L - 1);
      if (this.cache.size > 50_000) this.cache.clear();
      this.cache.set(L, v);
    }
    return v;
  }
  /**
   * Largest L in [1, n + 1] with ln S_L <= target (S_L grows with L). Starts from the entropy
   * estimate S_L ~ 2^(n h2(L/n)), gallops to a bracket, then bisects: O(log n) volume sums,
   * none of them near the centre n/2 unless the answer is there.
   */
  largestBelow(target: number): number {
    // the converse and RCU ask for the same target (it depends on n and k only) at every channel
    // value their inverses try: remember the answer
    let L = this.below.get(target);
    if (L === undefined) {
      L = this.searchBelow(target);
      if (this.below.size > 10_000) this.below.clear();
      this.below.set(target, L);
    }
    return L;
  }
  private readonly below = new Map<number, number>();
  private searchBelow(target: number): number {
    const n = this.n;
    if (this.logS(n + 1) <= target) return n + 1;
    const est = target <= 0 ? 1 : n * h2inv(Math.min(1, target / (n * LN2)));
    const L0 = Math.min(n, Math.max(1, Math.round(est)));
    let lo: number;
    let hi: number;
    if (this.logS(L0) <= target) {
      lo = L0;
      hi = L0 + 1;
      for (let d = 1; this.logS(hi) <= target; d *= 2) [lo, hi] = [hi, Math.min(n + 1, L0 + 2 * d)];
    } else {
      hi = L0;
      lo = L0 - 1;
      for (let d = 1; lo > 1 && this.logS(lo) > target; d *= 2) [hi, lo] = [lo, Math.max(1, L0 - 2 * d)];
      if (this.logS(lo) > target) return 1; // S_1 = 1 <= 2^(n-k) always holds for k <= n
    }
    while (hi - lo > 1) {
      const mid = Math.floor((lo + hi) / 2);
      if (this.logS(mid) <= target) lo = mid;
      else hi = mid;
    }
    return lo;
  }
}

const ballCache = new Map<number, BallVolumes>();
/** Shared, bounded cache of ball-volume tables (one per block length in recent use). */
export function ballVolumes(n: number): BallVolumes {
  let b = ballCache.get(n);
  if (!b) {
    if (ballCache.size >= 16) ballCache.delete(ballCache.keys().next().value as number);
    b = new BallVolumes(n);
    ballCache.set(n, b);
  }
  return b;
}

/** Drops the cached ball-volume tables (for cold-start benchmarks, or to free memory). */
export function clearBoundsCaches(): void {
  ballCache.clear();
  for (const clear of cacheClearers) clear();
}

const cacheClearers: (() => void)[] = [];
/** Lets another module's cache be dropped with the others by clearBoundsCaches. */
export function onClearBoundsCaches(clear: () => void): void {
  cacheClearers.push(clear);
}

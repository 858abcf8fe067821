// Exact finite-length bounds for the binary symmetric channel, as natural logs of block error rates.
import { LN2, log1mExp, logAddExp as logAddExpExport } from "./special";

const logAddExp = logAddExpExport; // local binding for the inner loop
import { ballVolumes, binomial, concaveWindow, logBinomRange, RESYNC } from "./sums";
import { channelThreshold } from "./solve";

/** Largest p searched by the inverses, and the smallest (logit -690, p about 1e-300). */
const U_MIN = -690;
const U_MAX = 0;

/**
 * ln epsilon_min(n, k, p): no code with 2^k codewords of length n has average block error below it
 * (Polyanskiy, Poor, Verdu 2010, Theorem 35). k may be real (k = log2 M).
 */
export function bscConverseLog(n: number, k: number, p: number): number {
  if (p === 0) return -Infinity; // noiseless: every codeword is decoded, since L >= 1 and P[T = 0] = 1
  const V = ballVolumes(n);
  const target = (n - k) * LN2; // ln 2^(n-k), the volume each codeword may claim
  const L = Math.min(n, V.largestBelow(target)); // S_L <= 2^(n-k) < S_{L+1}
  const lnS = V.logS(L);
  // lambda = (2^(n-k) - S_L) / C(n, L), in [0, 1) by the choice of L
  const lnLambda = lnS >= target ? -Infinity : Math.min(0, target + log1mExp(lnS - target) - V.logChoose(L));
  const B = binomial(n, p);
  if (L >= B.mode) {
    // epsilon_min = P[T > L] + (1 - lambda) P[T = L]: small, so summed directly
    return Math.min(0, logAddExp(logBinomRange(B, L + 1, n), log1mExp(lnLambda) + B.logPmf(L)));
  }
  // epsilon_min = 1 - P[T < L] - lambda P[T = L]: the subtracted part is the small one here
  return log1mExp(Math.min(-1e-300, logAddExp(logBinomRange(B, 0, L - 1), lnLambda + B.logPmf(L))));
}

/**
 * ln of the RCU bound: some code with 2^k codewords of length n has block error at most
 * sum_t P[T = t] min{1, (2^k - 1) 2^-n S_{t+1}} (Polyanskiy, Poor, Verdu 2010, Theorem 33).
 */
export function bscRcuLog(n: number, k: number, p: number): number {
  const V = ballVolumes(n);
  const lnMm1 = k * LN2 + log1mExp(-k * LN2); // ln(2^k - 1)
  if (lnMm1 === -Infinity) return -Infinity;
  const c0 = lnMm1 - n * LN2;
  // For t < tStar the minimum is the second argument, from tStar on it is 1 (S grows with t).
  const tStar = V.largestBelow(-c0);
  const B = binomial(n, p);
  const tail = logBinomRange(B, tStar, n);
  const last = Math.min(n, tStar - 1);
  if (last < 0) return Math.min(0, tail);
  // The head terms P[T = t] S_{t+1} are log-concave (products and partial sums of log-concave
  // sequences), peaking near t/(n-t) = sqrt(p/(1-p)); see logSumConcave for the window argument.
  const g = (t: number) => B.logPmf(t) + c0 + V.logS(t + 1);
  const sp = Math.sqrt(p);
  const guess = (n * sp) / (sp + Math.sqrt(1 - p));
  const w = concaveWindow(g, 0, last, guess);
  const head = p === 0 ? rcuHeadLogDomain(V, B, c0, w) : rcuHeadLinear(V, B, c0, w);
  return Math.min(0, logAddExp(Number.isFinite(head) || head === -Infinity ? head : rcuHeadLogDomain(V, B, c0, w), tail));
}

type Window = { lo: number; hi: number; top: number };

/**
 * The RCU head sum over the window, walked upwards in linear terms within blocks of RESYNC: the
 * binomial coefficient, the term and the ball volume S_{t+1} follow from their ratios
 * (C(n, t+1) = C(n, t) (n-t)/(t+1), S_{t+2} = S_{t+1} + C(n, t+1)); each block starts from exact
 * logs (log-gamma for the coefficient, the carried ln S). NaN if a block overflows (n in the millions).
 */
function rcuHeadLinear(V: ReturnType<typeof ballVolumes>, B: ReturnType<typeof binomial>, c0: number, w: Window): number {
  const n = B.n;
  const odds = Math.exp(B.lnp - B.ln1mp);
  const lnOdds = B.lnp - B.ln1mp;
  let s = V.logS(w.lo + 1); // ln S_{t0+1}
  let ref = w.top;
  let sum = 0;
  for (let t0 = w.lo; t0 <= w.hi; t0 += RESYNC) {
    const c = V.logChoose(t0);
    const v0 = c + t0 * lnOdds + n * B.ln1mp + c0 + s;
    if (v0 > ref) {
      sum *= Math.exp(ref - v0);
      ref = v0;
    }
    const q = Math.exp(c - s); // C(n, t0) / S_{t0+1}
    let pre = Math.exp(v0 - ref); // the term at t0, relative to ref, without its S ratio
    let cl = 1; // C(n, t) / C(n, t0)
    let sl = 1; // S_{t+1} / S_{t0+1}
    const end = Math.min(w.hi, t0 + RESYNC - 1);
    for (let t = t0; t <= end; t++) {
      sum += pre * sl;
      const r = (n - t) / (t + 1);
      pre *= r * odds;
      cl *= r;
      sl += cl * q;
    }
    s += Math.log(sl); // ln S_{end+2}, the next block's S_{t0+1}
  }
  if (!Number.isFinite(sum)) return NaN;
  return sum === 0 ? -Infinity : ref + Math.log(sum);
}

/** The same sum term by term in the log domain (p = 0, and the fallback when a linear block overflows). */
function rcuHeadLogDomain(V: ReturnType<typeof ballVolumes>, B: ReturnType<typeof binomial>, c0: number, w: Window): number {
  const n = B.n;
  const p = B.p;
  let s = V.logS(w.lo + 1);
  let ref = w.top;
  let sum = 0;
  let c = 0;
  const lnOdds = B.lnp - B.ln1mp;
  for (let t = w.lo; t <= w.hi; t++) {
    if ((t - w.lo) % RESYNC === 0) c = V.logChoose(t);
    const v = p === 0 ? (t === 0 ? c0 + s : -Infinity) : c + t * lnOdds + n * B.ln1mp + c0 + s;
    if (v > ref) {
      sum = sum * Math.exp(ref - v) + 1;
      ref = v;
    } else if (v !== -Infinity) sum += Math.exp(v - ref);
    c += Math.log((n - t) / (t + 1)); // ln C(n, t+1)
    s = logAddExp(s, c);
  }
  return sum === 0 ? -Infinity : ref + Math.log(sum);
}

/**
 * Codes known to meet the converse with equality (perfect codes with ML decoding): the identity
 * code (k = n), repetition codes (k = 1, ties broken at random), Hamming codes (R. W. Hamming 1950)
 * and the binary Golay code (M. J. E. Golay 1949).
 */
export function bscPerfectCode(n: number, k: number): string | null {
  if (!Number.isInteger(k)) return null;
  if (k === n) return "uncoded (identity code)";
  if (k === 1) return `(${n}, 1) repetition code`;
  const m = n - k;
  if (m >= 2 && n === 2 ** m - 1) return `(${n}, ${k}) Hamming code`;
  if (n === 23 && k === 12) return "(23, 12) Golay code";
  return null;
}

/** ln of the best achievability result known: the perfect code where one exists, else RCU; 0 errors when noiseless. */
export function bscAchievableLog(n: number, k: number, p: number): number {
  if (p === 0) return -Infinity; // noiseless: any code with distinct codewords is error-free
  return bscPerfectCode(n, k) ? bscConverseLog(n, k, p) : bscRcuLog(n, k, p);
}

/** Largest p at which the converse still allows block error exp(logEps) (inverse of Theorem 35). */
export function bscConverseThreshold(n: number, k: number, logEps: number, guess?: number): number {
  return channelThreshold((p) => bscConverseLog(n, k, p), logEps, U_MIN, U_MAX, guess);
}

/** Largest p at which some code is guaranteed block error exp(logEps) (inverse of RCU, or perfect codes). */
export function bscAchievableThreshold(n: number, k: number, logEps: number, guess?: number): number {
  return channelThreshold((p) => bscAchievableLog(n, k, p), logEps, U_MIN, U_MAX, guess);
}

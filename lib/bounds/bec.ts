// Exact finite-length bounds for the binary erasure channel, as natural logs of block error rates.
import { LN2, log1mExp, logAddExp } from "./special";
import { binomial, logBinomRange, logBinomSum, logSumConcave } from "./sums";
import { channelThreshold } from "./solve";

/** Logit range searched by the inverses: e from about 1e-300 to 1 - 2.3e-16. */
const U_MIN = -690;
const U_MAX = 36;

/**
 * ln epsilon_min: no code with 2^k codewords of length n has block error below
 * sum_{l > n-k} P[l erasures] (1 - 2^(n-l-k)) (Polyanskiy, Poor, Verdu 2010, Theorem 38).
 */
export function becConverseLog(n: number, k: number, e: number): number {
  if (e === 0) return -Infinity; // no erasures: every code of rate <= 1 is decoded
  const B = binomial(n, e);
  const first = Math.floor(n - k) + 1;
  if (!Number.isInteger(k)) {
    // Each term is a binomial probability times 1 - 2^-(l-n+k): both log-concave in l.
    const term = (l: number) => B.logPmf(l) + log1mExp((n - l - k) * LN2);
    return Math.min(0, logSumConcave(term, first, n, Math.max(first, B.mode)));
  }
  // With whole k the sum splits as P[L >= first] - 2^(n-k) E[2^-L; L >= first], two walks by the
  // term ratio; every factor 2^(n-k-l) is at most 1/2 there, so the difference loses at most one bit.
  const tail = logBinomRange(B, first, n);
  const weighted = logBinomSum(B, first, n, -LN2, (n * e) / (2 - e)) + (n - k) * LN2;
  return Math.min(0, tail + log1mExp(Math.min(0, weighted - tail)));
}

/**
 * ln of the BEC achievability bound: some code has block error at most
 * sum_l P[l erasures] 2^-max(0, n - l - log2(2^k - 1)) (Polyanskiy, Poor, Verdu 2010, Theorem 37).
 */
export function becAchievLog(n: number, k: number, e: number): number {
  const log2Mm1 = k + log1mExp(-k * LN2) / LN2; // log2(2^k - 1)
  if (log2Mm1 === -Infinity) return -Infinity;
  const c = n - log2Mm1; // with l >= c erasures the exponent is 0 and the term is P[l]
  const B = binomial(n, e);
  const tail = logBinomRange(B, Math.ceil(c), n);
  if (e === 0) return c <= 0 ? 0 : -c * LN2; // only l = 0 occurs: 2^-(n - log2(2^k - 1))
  // Below c the term is P[l] 2^(l-c): a binomial with odds doubled, log-concave, mode near n 2e/(1+e).
  const head = logBinomSum(B, 0, Math.ceil(c) - 1, LN2, (n * 2 * e) / (1 + e)) - c * LN2;
  return Math.min(0, logAddExp(head, tail));
}

/**
 * Binary codes meeting the Singleton bound (MDS), which meet the BEC converse exactly with ML
 * decoding and random guessing on ambiguity: uncoded, single parity check, repetition.
 */
export function becMdsCode(n: number, k: number): string | null {
  if (!Number.isInteger(k)) return null;
  if (k === n) return "uncoded (identity code)";
  if (k === n - 1) return `(${n}, ${k}) single parity check code`;
  if (k === 1) return `(${n}, 1) repetition code`;
  return null;
}

/** ln of the best achievability result known: an MDS code where one exists, else Theorem 37. */
export function becAchievableLog(n: number, k: number, e: number): number {
  if (e === 0) return -Infinity; // no erasures: any code with distinct codewords is error-free
  return becMdsCode(n, k) ? becConverseLog(n, k, e) : becAchievLog(n, k, e);
}

/** Largest e at which the converse still allows block error exp(logEps). */
export function becConverseThreshold(n: number, k: number, logEps: number, guess?: number): number {
  return channelThreshold((e) => becConverseLog(n, k, e), logEps, U_MIN, U_MAX, guess);
}

/** Largest e at which some code is guaranteed block error exp(logEps). */
export function becAchievableThreshold(n: number, k: number, logEps: number, guess?: number): number {
  return channelThreshold((e) => becAchievableLog(n, k, e), logEps, U_MIN, U_MAX, guess);
}

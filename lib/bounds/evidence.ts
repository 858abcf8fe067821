// Measured evidence: lab error counts against a claimed error rate (specification, section 7).
import betaQuantile from "@stdlib/stats-base-dists-beta-quantile";

export interface EvidenceInput {
  /** Errors counted (bits or frames). */
  errors: number;
  /** Trials observed (bits or frames), at least 1. */
  trials: number;
  /** The claimed error rate q, in (0, 1). */
  claimed: number;
  /** Confidence level c in (0, 1); 0.95 unless given. */
  confidence?: number;
}

export interface EvidenceResult {
  /** One-sided lower Clopper-Pearson bound at confidence c: Beta(1 - c; x, N - x + 1), 0 when x = 0. */
  lower: number;
  /** One-sided upper Clopper-Pearson bound at confidence c: Beta(c; x + 1, N - x), 1 when x = N. */
  upper: number;
  /** Two-sided Clopper-Pearson interval at confidence c (alpha/2 in each tail). */
  twoSided: { lower: number; upper: number };
  /** verified: upper <= claimed; contradicted: lower > claimed; inconclusive otherwise. */
  status: "verified" | "contradicted" | "inconclusive";
  /** Length of an error-free run that alone verifies the claim: ceil(ln(1 - c) / ln(1 - q)). */
  errorFreeTrialsNeeded: number;
  /**
   * Further error-free trials after this run until its upper bound reaches the claim (0 when
   * verified, null when contradicted). With no errors so far it is errorFreeTrialsNeeded - N.
   */
  additionalTrialsNeeded: number | null;
  confidence: number;
}

/** One-sided upper Clopper-Pearson bound (Clopper and Pearson, Biometrika 1934). */
export function clopperPearsonUpper(x: number, N: number, c: number): number {
  return x >= N ? 1 : betaQuantile(c, x + 1, N - x);
}

/** One-sided lower Clopper-Pearson bound (Clopper and Pearson, Biometrika 1934). */
export function clopperPearsonLower(x: number, N: number, c: number): number {
  return x <= 0 ? 0 : betaQuantile(1 - c, x, N - x + 1);
}

/** Error-free run that verifies rate q at confidence c: (1 - q)^N <= 1 - c (Hanley and Lippman-Hand, JAMA 1983). */
export function errorFreeTrials(q: number, c: number): number {
  return Math.ceil(Math.log1p(-c) / Math.log1p(-q));
}

export function assessEvidence({ errors, trials, claimed, confidence = 0.95 }: EvidenceInput): EvidenceResult {
  const ok = (v: number, lo: number, hi: number) => Number.isFinite(v) && v >= lo && v <= hi;
  if (!Number.isInteger(errors) || !Number.isInteger(trials) || trials < 1 || errors < 0 || errors > trials)
    throw new RangeError("errors and trials must be integers with 0 <= errors <= trials and trials >= 1");
  if (!ok(claimed, Number.MIN_VALUE, 1 - Number.EPSILON)) throw new RangeError("claimed must be strictly between 0 and 1");
  if (!ok(confidence, Number.MIN_VALUE, 1 - Number.EPSILON)) throw new RangeError("confidence must be strictly between 0 and 1");
  const x = errors;
  const N = trials;
  const c = confidence;
  const lower = clopperPearsonLower(x, N, c);
  const upper = clopperPearsonUpper(x, N, c);
  const a2 = (1 - c) / 2;
  const twoSided = { lower: clopperPearsonLower(x, N, 1 - a2), upper: clopperPearsonUpper(x, N, 1 - a2) };
  const status = upper <= claimed ? "verified" : lower > claimed ? "contradicted" : "inconclusive";
  const needed = errorFreeTrials(claimed, c);
  let additional: number | null = null;
  if (status === "verified") additional = 0;
  else if (status === "inconclusive") additional = x === 0 ? Math.max(0, needed - N) : extraTrials(x, N, claimed, c);
  return { lower, upper, twoSided, status, errorFreeTrialsNeeded: needed, additionalTrialsNeeded: additional, confidence: c };
}

/** Smallest m with clopperPearsonUpper(x, N + m, c) <= q: the upper bound falls as N grows, so gallop and bisect. */
function extraTrials(x: number, N: number, q: number, c: number): number {
  let lo = 0;
  let hi = Math.max(1, N);
  while (clopperPearsonUpper(x, N + hi, c) > q) {
    lo = hi;
    hi *= 2;
    if (hi > 1e18) return Infinity;
  }
  while (hi - lo > 1) {
    const mid = Math.floor((lo + hi) / 2);
    if (clopperPearsonUpper(x, N + mid, c) <= q) hi = mid;
    else lo = mid;
  }
  return hi;
}

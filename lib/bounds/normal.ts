// The normal approximation of the best achievable rate (Polyanskiy, Poor, Verdu 2010, eq. (1) and
// Theorems 52-54): an approximation, not a bound, so it never makes a claim impossible.
import { logQ, qInvLog } from "./special";

/**
 * log2 M*(n, eps) ~ nC - sqrt(nV) Qinv(eps) + 1/2 log2 n (BSC, BI-AWGN; PPV Theorems 52 and 54);
 * without the log term for the BEC (PPV Theorem 53). Takes ln eps so tiny targets stay exact.
 */
export function normalApproxLog2M(n: number, capacity: number, dispersion: number, logEps: number, withLogTerm = true): number {
  const extra = withLogTerm ? 0.5 * Math.log2(n) : 0;
  const spread = dispersion > 0 ? Math.sqrt(n * dispersion) * qInvLog(logEps) : 0;
  return n * capacity - spread + extra;
}

/** The best rate the normal approximation gives, kept in the physical range [0, 1]. */
export function normalApproxRate(...args: Parameters<typeof normalApproxLog2M>): number {
  const r = normalApproxLog2M(...args) / args[0];
  return Math.min(1, Math.max(0, r));
}

/** ln eps at (n, k), solving the same expansion for eps: eps = Q((nC + 1/2 log2 n - k) / sqrt(nV)). */
export function normalApproxLogBler(n: number, k: number, capacity: number, dispersion: number, withLogTerm = true): number {
  const extra = withLogTerm ? 0.5 * Math.log2(n) : 0;
  const excess = n * capacity + extra - k;
  if (dispersion <= 0) return excess >= 0 ? -Infinity : 0; // a deterministic channel: all or nothing
  return logQ(excess / Math.sqrt(n * dispersion));
}

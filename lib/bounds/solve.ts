// One-dimensional root finding for the inverses (thresholds) of monotone bounds.

/**
 * Root of an increasing function on [lo, hi] with f(lo) <= 0 < f(hi), by the Illinois variant of
 * regula falsi (Dowell and Jarratt 1971) with a bisection step whenever progress stalls, so the
 * bracket always shrinks at least as fast as plain bisection every other step.
 * Returns the left end of the final bracket: a point where f <= 0.
 */
export function solveIncreasing(f: (x: number) => number, lo: number, hi: number, tol = 1e-12, maxIter = 200): number {
  let flo = f(lo);
  let fhi = f(hi);
  let side = 0;
  let lastWidth = hi - lo;
  for (let i = 0; i < maxIter && hi - lo > tol * (1 + Math.abs(lo)); i++) {
    let x = (lo * fhi - hi * flo) / (fhi - flo);
    const width = hi - lo;
    if (i % 3 === 2 && width > 0.5 * lastWidth) x = 0.5 * (lo + hi);
    if (i % 3 === 2) lastWidth = width;
    if (!Number.isFinite(x) || x <= lo || x >= hi) x = 0.5 * (lo + hi);
    const fx = f(x);
    if (fx <= 0) {
      lo = x;
      flo = fx;
      if (side === -1) fhi /= 2;
      side = -1;
    } else {
      hi = x;
      fhi = fx;
      if (side === 1) flo /= 2;
      side = 1;
    }
    if (!Number.isFinite(flo) || !Number.isFinite(fhi)) side = 0;
  }
  return lo;
}

/** Probability from its logit, accurate at both ends. */
export function fromLogit(u: number): number {
  return u < 0 ? Math.exp(u) / (1 + Math.exp(u)) : 1 / (1 + Math.exp(-u));
}

/** Logit of a probability. */
export function toLogit(x: number): number {
  return Math.log(x) - Math.log1p(-x);
}

/**
 * Largest channel parameter x (in logit coordinates between uMin and uMax) with
 * logBound(x) <= logTarget, for a bound that grows with x: fromLogit(uMax) when even the worst
 * channel satisfies it, 0 when no representable channel does. A guess (e.g. from the normal
 * approximation) lets it gallop to a tight bracket first, so a dozen bound evaluations suffice.
 */
export function channelThreshold(logBound: (x: number) => number, logTarget: number, uMin: number, uMax: number, guess?: number): number {
  const f = (u: number) => logBound(fromLogit(u)) - logTarget;
  let lo = uMin;
  let hi = uMax;
  if (guess !== undefined && guess > 0 && Number.isFinite(toLogit(guess))) {
    const u0 = Math.min(uMax, Math.max(uMin, toLogit(guess)));
    if (f(u0) <= 0) {
      lo = u0;
      for (let d = 0.01; lo < uMax; d *= 2) {
        const u = Math.min(uMax, u0 + d);
        if (f(u) > 0) {
          hi = u;
          break;
        }
        lo = u;
      }
      if (lo >= uMax) return fromLogit(uMax);
    } else {
      hi = u0;
      for (let d = 0.01; hi > uMin; d *= 2) {
        const u = Math.max(uMin, u0 - d);
        if (f(u) <= 0) {
          lo = u;
          break;
        }
        hi = u;
      }
      if (hi <= uMin) return 0;
    }
  } else {
    if (f(uMax) <= 0) return fromLogit(uMax);
    if (f(uMin) > 0) return 0;
  }
  return fromLogit(solveIncreasing(f, lo, hi, 1e-13));
}

// Capacities and dispersions of the binary-output channels and the unconstrained AWGN reference.
import { h2, LN2, log1p } from "./special";

/** Es/N0 in dB to linear. */
export function dbToLinear(db: number): number {
  return 10 ** (db / 10);
}
export function linearToDb(x: number): number {
  return 10 * Math.log10(x);
}

/** C = 1 - h2(p) (Shannon 1948). */
export function bscCapacity(p: number): number {
  return 1 - h2(p);
}

/** V = p(1-p) log2((1-p)/p)^2 (Polyanskiy, Poor, Verdu 2010, Theorem 52). */
export function bscDispersion(p: number): number {
  if (p <= 0 || p >= 0.5) return 0;
  const l = (log1p(-p) - Math.log(p)) / LN2;
  return p * (1 - p) * l * l;
}

/** C = 1 - e (Elias 1955). */
export function becCapacity(e: number): number {
  return 1 - e;
}

/** V = e(1-e) (Polyanskiy, Poor, Verdu 2010, Theorem 53). */
export function becDispersion(e: number): number {
  return e * (1 - e);
}

/** Unconstrained real AWGN, C = 1/2 log2(1 + 2 Es/N0) (Shannon 1948). */
export function awgnCapacity(esn0Db: number): number {
  return (0.5 * log1p(2 * dbToLinear(esn0Db))) / LN2;
}

/** Eb/N0 (dB) the unconstrained AWGN needs at rate R: (2^(2R) - 1) / (2R) (Shannon 1949). */
export function awgnEbn0LimitDb(rate: number): number {
  return linearToDb(Math.expm1(2 * rate * LN2) / (2 * rate));
}

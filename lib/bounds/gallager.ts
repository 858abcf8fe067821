// Gallager's random-coding exponent (R. G. Gallager, "A simple derivation of the coding theorem
// and some applications", IEEE Trans. Inf. Theory 1965), shown for orientation only.
import { biawgnE0 } from "./biawgn";
import { LN2 } from "./special";

/** E0(rho) in bits for the BSC with uniform input: rho - (1+rho) log2(p^(1/(1+rho)) + (1-p)^(1/(1+rho))). */
export function bscE0(rho: number, p: number): number {
  const a = 1 / (1 + rho);
  return rho - (1 + rho) * Math.log2(p ** a + (1 - p) ** a);
}

/** E0(rho) in bits for the BEC: -log2(e + (1 - e) 2^-rho). */
export function becE0(rho: number, e: number): number {
  return -Math.log2(e + (1 - e) * 2 ** -rho);
}

/**
 * E_r(R) = max over 0 <= rho <= 1 of E0(rho) - rho R (bits); E0 is concave in rho, so a golden
 * section search finds the maximum (24 steps: rho to 1e-5, the value to about 1e-10, ample
 * for a figure shown for orientation). Some code then has block error <= 2^(-n E_r(R)).
 */
export function gallagerExponent(e0: (rho: number) => number, rate: number): { exponent: number; rho: number } {
  const g = (rho: number) => e0(rho) - rho * rate;
  const phi = (Math.sqrt(5) - 1) / 2;
  let a = 0;
  let b = 1;
  let c = b - phi * (b - a);
  let d = a + phi * (b - a);
  let gc = g(c);
  let gd = g(d);
  for (let i = 0; i < 24; i++) {
    if (gc >= gd) {
      [b, d, gd] = [d, c, gc];
      c = b - phi * (b - a);
      gc = g(c);
    } else {
      [a, c, gc] = [c, d, gd];
      d = a + phi * (b - a);
      gd = g(d);
    }
  }
  const candidates = [
    { rho: 0, v: 0 },
    { rho: 1, v: g(1) },
    { rho: 0.5 * (a + b), v: g(0.5 * (a + b)) },
  ];
  const best = candidates.reduce((x, y) => (y.v > x.v ? y : x));
  return { exponent: Math.max(0, best.v), rho: best.rho };
}

export const bscGallagerExponent = (p: number, rate: number) => gallagerExponent((r) => bscE0(r, p), rate);
export const becGallagerExponent = (e: number, rate: number) => gallagerExponent((r) => becE0(r, e), rate);
export const biawgnGallagerExponent = (esn0Db: number, rate: number) =>
  gallagerExponent((r) => biawgnE0(r, esn0Db), rate);

/** ln of Gallager's bound at (n, R): (M - 1)^rho 2^(-n E0(rho)) <= 2^(-n E_r(R)). */
export function gallagerLogBler(n: number, exponent: number): number {
  return -n * exponent * LN2;
}

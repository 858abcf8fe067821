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
 * E_r(R) = max over 0 <= rho <= 1 of E0(rho) - rho R (bits). E0 is concave in rho, so Brent's
 * minimiser (parabolic steps with a golden-section fallback; Brent, Algorithms for Minimization
 * without Derivatives, 1973) finds the maximum in a dozen E0 evaluations at most. Any rho gives a
 * valid bound, so stopping early only loosens it (by about 1e-8 relative here): some code has block error <= 2^(-n E_r(R)).
 */
export function gallagerExponent(e0: (rho: number) => number, rate: number): { exponent: number; rho: number } {
  const f = (rho: number) => -(e0(rho) - rho * rate);
  // Concavity settles the edges at once: still rising at rho = 1 means the maximum is there
  // (rates below the critical rate), not rising at 0 means E_r = 0 (rates at or above capacity).
  const f1 = f(1);
  if (f1 <= f(1 - 1e-6)) return { exponent: Math.max(0, -f1), rho: 1 };
  if (f(1e-6) >= 0) return { exponent: 0, rho: 0 };
  const best = brentMin(f, 0, 1, 1e-5, 12);
  const ends = [
    { rho: 0, v: 0 }, // E0(0) = 0
    { rho: 1, v: -f(1) },
    { rho: best.x, v: -best.fx },
  ];
  const top = ends.reduce((x, y) => (y.v > x.v ? y : x));
  return { exponent: Math.max(0, top.v), rho: top.rho };
}

/** Brent's fmin on [a, b] to absolute tolerance tol in x, or until maxIter evaluations. */
function brentMin(f: (x: number) => number, a: number, b: number, tol: number, maxIter: number): { x: number; fx: number } {
  const gold = 0.381966011250105;
  let x = a + gold * (b - a);
  let w = x;
  let v = x;
  let fx = f(x);
  let fw = fx;
  let fv = fx;
  let d = 0;
  let e = 0;
  for (let i = 1; i < maxIter; i++) {
    const m = 0.5 * (a + b);
    const tol1 = tol + 1e-10 * Math.abs(x);
    if (Math.abs(x - m) <= 2 * tol1 - 0.5 * (b - a)) break;
    let parabolic = false;
    if (Math.abs(e) > tol1) {
      let r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      r = e;
      e = d;
      if (Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (a - x) && p < q * (b - x)) {
        d = p / q;
        parabolic = true;
      }
    }
    if (!parabolic) {
      e = (x < m ? b : a) - x;
      d = gold * e;
    }
    const u = x + (Math.abs(d) >= tol1 ? d : d > 0 ? tol1 : -tol1);
    const fu = f(u);
    if (fu <= fx) {
      if (u < x) b = x;
      else a = x;
      [v, fv, w, fw, x, fx] = [w, fw, x, fx, u, fu];
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) [v, fv, w, fw] = [w, fw, u, fu];
      else if (fu <= fv || v === x || v === w) [v, fv] = [u, fu];
    }
  }
  return { x, fx };
}

export const bscGallagerExponent = (p: number, rate: number) => gallagerExponent((r) => bscE0(r, p), rate);
export const becGallagerExponent = (e: number, rate: number) => gallagerExponent((r) => becE0(r, e), rate);
export const biawgnGallagerExponent = (esn0Db: number, rate: number) => gallagerExponent((r) => biawgnE0(r, esn0Db), rate);

/** ln of Gallager's bound at (n, R): (M - 1)^rho 2^(-n E0(rho)) <= 2^(-n E_r(R)). */
export function gallagerLogBler(n: number, exponent: number): number {
  return -n * exponent * LN2;
}

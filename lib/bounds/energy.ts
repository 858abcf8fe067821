// Energy per bit with no bandwidth limit (Y. Polyanskiy, H. V. Poor, S. Verdu, "Minimum energy to
// send k bits through the Gaussian channel with and without feedback", IEEE Trans. Inf. Theory
// 57(8), 2011), and the conversion of a receiver sensitivity to Eb/N0.
import { linearToDb } from "./channels";
import { integrate } from "./quadrature";
import { lnNegLogPhi } from "./orthogonal";
import { LN2, log1mExp, logQ, qInvLog } from "./special";
import { THERMAL_DBM_PER_HZ } from "./thermal";

/** ln(2^k - 1), for k >= 1 (no overflow for k in the millions). */
const lnMm1 = (k: number) => k * LN2 + log1mExp(-k * LN2);

/**
 * Least Eb/N0 (dB) of any code with 2^k codewords and block error exp(logEps), any modulation,
 * any bandwidth: E/N0 >= (Qinv(2^-k) + Qinv(eps))^2 / 2 (PPV 2011, Theorem 2, without feedback),
 * Eb = E / k. null when the bound asks for no energy at all (Qinv(2^-k) + Qinv(eps) <= 0).
 * Qinv(2^-k) comes from ln 2^-k, so k in the thousands stays exact.
 */
export function energyConverseEbn0Db(k: number, logEps: number): number | null {
  const a = qInvLog(-k * LN2) + qInvLog(logEps);
  if (!(a > 0)) return null;
  return linearToDb((a * a) / (2 * k));
}

/**
 * ln of the least block error of any code with 2^k codewords at energy per bit Eb/N0 (dB), any
 * modulation and bandwidth: the converse above solved for eps, eps >= Q(sqrt(2 k Eb/N0) - Qinv(2^-k))
 * (PPV 2011, Theorem 2). The curve the charts draw beside the 1959 bound; its inverse is
 * energyConverseEbn0Db.
 */
export function energyConverseLogBler(k: number, ebn0Db: number): number {
  return logQ(Math.sqrt(2 * k * 10 ** (ebn0Db / 10)) - qInvLog(-k * LN2));
}

/**
 * ln BLER of M = 2^k orthogonal signals of energy E, a = sqrt(2 E/N0), with ML detection:
 * 1 - integral phi(z - a) (1 - Q(z))^(M-1) dz (PPV 2011, eq. for orthogonal signalling; Proakis).
 * Written as the integral of phi(z - a) (1 - Phi(z)^(M-1)): both factors are log-concave in z (the
 * second is the survival function of a maximum of normals), so the log integrand is concave and is
 * integrated over the window where it is within 40 nats of its peak.
 */
export function orthogonalLogBler(k: number, a: number): number {
  const lm = lnMm1(k);
  const lnSurvival = (z: number) => {
    const lnw = lm + lnNegLogPhi(z); // ln of w = -(M-1) ln Phi(z); 1 - Phi^(M-1) = 1 - e^-w
    return lnw < -30 ? lnw : log1mExp(-Math.exp(lnw));
  };
  const h = (z: number) => -0.5 * (z - a) * (z - a) + lnSurvival(z);
  // golden-section search for the peak of the concave h on [min(0, a) - 40, a + 40]
  const g = 0.6180339887498949;
  let lo = Math.min(0, a) - 40;
  let hi = a + 40;
  let x1 = hi - g * (hi - lo);
  let x2 = lo + g * (hi - lo);
  let f1 = h(x1);
  let f2 = h(x2);
  for (let i = 0; i < 120 && hi - lo > 1e-3; i++) {
    if (f1 > f2) {
      [hi, x2, f2] = [x2, x1, f1];
      x1 = hi - g * (hi - lo);
      f1 = h(x1);
    } else {
      [lo, x1, f1] = [x1, x2, f2];
      x2 = lo + g * (hi - lo);
      f2 = h(x2);
    }
  }
  const zStar = 0.5 * (lo + hi);
  const top = h(zStar);
  let left = zStar;
  let right = zStar;
  for (let d = 0.5; d < 1e4 && h(left) > top - 40; d *= 2) left = zStar - d;
  for (let d = 0.5; d < 1e4 && h(right) > top - 40; d *= 2) right = zStar + d;
  const f = (z: number) => Math.exp(h(z) - top);
  // about 1e-11 of the integral (its peak is 1 over the window): ample for 1e-6 dB on the inverse
  const tol = 1e-11 * (right - left);
  const I = integrate(f, left, zStar, tol) + integrate(f, zStar, right, tol);
  return Math.min(0, top - 0.5 * Math.log(2 * Math.PI) + Math.log(I));
}

// The inverse of orthogonal signalling lives in orthogonal.ts (Newton on a fixed trapezoid grid);
// orthogonalLogBler above stays as the careful adaptive reference that the tests compare it with.
export { orthogonalEbn0Db, orthogonalAmplitude } from "./orthogonal";
export { THERMAL_DBM_PER_HZ };

/** Implied Eb/N0 (dB) = S - 10 log10(k_B T0 / 1 mW) - 10 log10(Rb) - NF (common practice; BOUNDS.md section 9). */
export function sensitivityToEbn0Db(sensitivityDbm: number, bitRate: number, noiseFigureDb = 0): number {
  return sensitivityDbm - THERMAL_DBM_PER_HZ - 10 * Math.log10(bitRate) - noiseFigureDb;
}

/** The input level (dBm) at which a receiver with noise figure NF sees Eb/N0 at bit rate Rb. */
export function ebn0ToSensitivityDbm(ebn0Db: number, bitRate: number, noiseFigureDb = 0): number {
  return ebn0Db + THERMAL_DBM_PER_HZ + 10 * Math.log10(bitRate) + noiseFigureDb;
}

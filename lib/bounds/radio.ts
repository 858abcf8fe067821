// The radio checks of a BI-AWGN claim (BOUNDS.md sections 8 and 9): Shannon's 1959 sphere-packing
// bound at the claim's n and k, the energy per bit to send k bits, and which achievability result
// a "plausible" rests on.
import type { OperatingPoint } from "./resolve";
import type { Finding } from "./findings";
import { biawgnCapDisp } from "./biawgn";
import { biawgnGallagerExponent, gallagerLogBler } from "./gallager";
import { ebn0ToEsn0 } from "./conversions";
import { energyConverseEbn0Db, orthogonalEbn0Db } from "./energy";
import { normalApproxLogBler } from "./normal";
import { spherePackingEbn0Db, spherePackingLog } from "./sphere";
import { sci, sciLn } from "./format";
import * as R from "./radio-findings";

/**
 * Below this BLER the normal approximation is not relied on for "plausible": PPV 2010 compare it
 * with the exact bounds at BLER 1e-3 and 1e-6 (from memory), and in deeper tails it can fall far
 * below even a rigorous converse.
 */
export const NORMAL_RELIABLE_BLER = 1e-6;

/** dB comparisons get the same benefit of the doubt as probabilities: a relative 1e-9. */
const dbSlack = (x: number) => 1e-9 * Math.max(1, Math.abs(x));

export interface RadioOutcome {
  findings: Finding[];
  violated: boolean;
  /** null when the radio checks do not decide plausibility (no n and k and no payload-only claim). */
  plausible: boolean | null;
  spherePacking: { log10Bler: number } | null;
  spThreshold: number | null;
  /** Why the normal approximation is not relied on (deep tail, below the converse), or null. */
  normalUnreliable: string | null;
  energy: { converseEbn0Db: number | null; achievableEbn0Db: number | null } | null;
}

/** The energy limits at k: converse held to logConv, orthogonal achievability to logAch. */
export function energyLimits(k: number, logConv: number, logAch: number) {
  return { converseEbn0Db: energyConverseEbn0Db(k, logConv), achievableEbn0Db: orthogonalEbn0Db(k, logAch) };
}

/** The energy converse check at k (every BI-AWGN claim with k known). */
function energyCheck(op: OperatingPoint, k: number, limit: number | null) {
  const violated = limit !== null && op.radio!.ebn0Db < limit - dbSlack(limit);
  return { violated, finding: R.energyConverseFinding(op, k, limit, violated) };
}

/**
 * Checks with n and k: the 1959 bound (impossibility at the judged Eb/N0), the energy converse,
 * and plausibility at the realistic Eb/N0 by the normal approximation where it is reliable or by
 * Gallager's random-coding bound (rigorous) anywhere.
 */
export function radioWithCode(op: OperatingPoint, logConv: number, logAch: number, tol: number, exponentAtClaim: number): RadioOutcome {
  const r = op.radio!;
  const n = op.n as number;
  const k = op.k as number;
  const dims = r.dims as number;
  const lnSp = spherePackingLog(dims, k, r.ebn0Db);
  const spThreshold = spherePackingEbn0Db(dims, k, logConv);
  const spViolated = logConv < lnSp - tol - 1e-10 * Math.abs(lnSp);
  const energy = energyLimits(k, logConv, logAch);
  const e = energyCheck(op, k, energy.converseEbn0Db);
  const findings = [R.spherePackingFinding(op, lnSp, logConv, spThreshold, spViolated), e.finding];

  // Plausibility at the realistic Eb/N0 (the same as the judged one unless a noise figure was assumed).
  const esn0 = ebn0ToEsn0(r.realisticEbn0Db, op.rate);
  const cd = r.realisticEbn0Db === r.ebn0Db ? { capacity: op.capacity, dispersion: op.dispersion } : biawgnCapDisp(esn0);
  const lnNormal = normalApproxLogBler(n, k, cd.capacity, cd.dispersion, true);
  const lnSpReal = r.realisticEbn0Db === r.ebn0Db ? lnSp : spherePackingLog(dims, k, r.realisticEbn0Db);
  const deep = logAch < Math.log(NORMAL_RELIABLE_BLER);
  const belowConverse = lnNormal < lnSpReal - tol;
  const whyNot = deep
    ? `the claimed ${op.metric === "ber" ? "BER" : "BLER"} ${sci(op.target)} lies below ${sci(NORMAL_RELIABLE_BLER)}`
    : belowConverse
      ? `its BLER ${sciLn(lnNormal)} falls below the 1959 converse ${sciLn(lnSpReal)}`
      : null;
  const same = r.realisticEbn0Db === r.ebn0Db;
  const lnGallager = gallagerLogBler(n, same ? exponentAtClaim : biawgnGallagerExponent(esn0, op.rate).exponent);
  const basis = lnGallager <= logAch + tol ? "gallager" : whyNot === null && lnNormal <= logAch + tol ? "normal" : null;
  findings.push(R.restsOnFinding(op, basis, lnGallager, whyNot));
  return {
    findings,
    violated: spViolated || e.violated,
    plausible: basis !== null && !spViolated,
    spherePacking: { log10Bler: lnSp * Math.LOG10E + 0 },
    spThreshold,
    normalUnreliable: whyNot,
    energy,
  };
}

/** Checks with k only (a payload, no block length): energy converse and orthogonal achievability. */
export function radioPayload(op: OperatingPoint, logConv: number, logAch: number): RadioOutcome {
  const k = op.k as number;
  const energy = energyLimits(k, logConv, logAch);
  const e = energyCheck(op, k, energy.converseEbn0Db);
  const ach = energy.achievableEbn0Db;
  const ok = ach === null || op.radio!.realisticEbn0Db >= ach - dbSlack(ach);
  return {
    findings: [e.finding, R.orthogonalFinding(op, k, ach, ok)],
    violated: e.violated,
    plausible: ok,
    spherePacking: null,
    spThreshold: null,
    normalUnreliable: null,
    energy,
  };
}

/** Findings that introduce a BI-AWGN claim: the sensitivity conversion and the noise figure used. */
export function radioPreamble(op: OperatingPoint): Finding[] {
  if (op.radio?.noiseBasis == null) return [];
  const nf = R.noiseFigureFinding(op);
  return nf ? [R.sensitivityFinding(op), nf] : [R.sensitivityFinding(op)];
}

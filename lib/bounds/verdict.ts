// The verdict on one claim (section 5 of the specification): findings, bounds, thresholds, margins.
import type { ClaimInput, ClaimResult } from "./schema";
import { resolveClaim, type OperatingPoint } from "./resolve";
import { bscAchievableLog, bscConverseLog, bscPerfectCode } from "./bsc";
import { becAchievableLog, becConverseLog, becMdsCode } from "./bec";
import { normalApproxLogBler, normalApproxRate } from "./normal";
import { requiredCapacity } from "./residual";
import { bscGallagerExponent, becGallagerExponent, biawgnGallagerExponent, gallagerLogBler } from "./gallager";
import { claimThresholds, type Thresholds } from "./thresholds";
import { logNumericSlack, toLog10 } from "./special";
import { ENGINE_VERSION } from "./version";
import { evaluatePayloadClaim } from "./payload";
import { radioPreamble, radioWithCode, type RadioOutcome } from "./radio";
import { wholeKFinding } from "./radio-findings";
import * as F from "./findings";

/** A claim within a relative 1e-9 of a bound gets the benefit of the doubt (specification, section 5). */
const BENEFIT = 1e-9;

const bound = (ln: number) => ({ log10Bler: toLog10(ln), bler: Math.exp(ln) });

function gallager(op: OperatingPoint) {
  const r =
    op.model === "bsc" ? bscGallagerExponent(op.x, op.rate) : op.model === "bec" ? becGallagerExponent(op.x, op.rate) : biawgnGallagerExponent(op.x, op.rate);
  return r.exponent;
}

/** Channel margins: threshold over claimed (p, e), or threshold minus claimed (dB). */
function channelMargins(op: OperatingPoint, t: Thresholds, radio: RadioOutcome | null) {
  const db = op.model === "biawgn";
  // A ratio over a subnormal claimed p or e can overflow: no margin is shown then, rather than infinity.
  const finite = (x: number) => (Number.isFinite(x) ? x : null);
  const m = (th: number | null) => (th === null ? null : db ? finite(th - op.claimed) : op.claimed > 0 ? finite(th / op.claimed) : null);
  return {
    channelKind: db ? ("dB" as const) : ("ratio" as const),
    channel: {
      capacity: m(t.capacity),
      // BI-AWGN: the 1959 threshold minus the implied Eb/N0 (a difference of dB, the same in Es/N0)
      converse: radio?.spThreshold != null && op.radio ? finite(radio.spThreshold - op.radio.ebn0Db) : m(t.converse),
      achievable: m(t.achievable),
      normal: m(t.normal),
    },
  };
}

export function evaluateClaim(input: ClaimInput): ClaimResult {
  if (input.code.n === undefined && input.code.k !== undefined) return evaluatePayloadClaim(input);
  const op = resolveClaim(input);
  const { n, k, rate, model } = op;
  const known = n !== null && k !== null;
  const findings: F.Finding[] = [];
  const lnTarget = Math.log(op.target);
  // A BER claim is held to BLER k pb by the converses and to BLER pb by achievability.
  const logConv = op.metric === "ber" && known ? Math.min(0, Math.log(k) + lnTarget) : lnTarget;
  const logAch = lnTarget;
  const tol = Math.log1p(BENEFIT) + (known ? logNumericSlack(n) : 0);

  findings.push(...radioPreamble(op));
  if (op.kFrom !== null) findings.push(wholeKFinding(op));
  if (op.channel.ncgDb !== undefined) findings.push(F.ncgFinding(op));
  if (op.metric === "ber") findings.push(F.berFinding(op));
  if (op.x === 0 && model !== "biawgn") findings.push(F.noiselessFinding(op));

  // Section 4: R (1 - h2(pb)) <= C at every block length (BER <= BLER, so BLER claims too).
  const required = requiredCapacity(rate, op.target);
  const capViolated = required > op.capacity * (1 + BENEFIT);
  findings.push(F.capacityFinding(op, required, capViolated));
  let violated = capViolated;

  let converse: ClaimResult["converse"] = null;
  let achievable: ClaimResult["achievable"] = null;
  let normal: ClaimResult["normal"] = null;
  let plausible = false;
  let radio: RadioOutcome | null = null;
  const exponent = gallager(op);
  if (known) {
    const lnNormal = normalApproxLogBler(n, k, op.capacity, op.dispersion, op.logTerm);
    const nRate = normalApproxRate(n, op.capacity, op.dispersion, logAch, op.logTerm);
    normal = { rate: nRate, ...bound(lnNormal) };
    if (model === "biawgn") {
      radio = radioWithCode(op, logConv, logAch, tol, exponent);
      violated ||= radio.violated;
      plausible = radio.plausible === true;
      findings.push(F.normalFinding(op, lnNormal, nRate, false, false, radio.normalUnreliable), ...radio.findings);
    } else {
      const bsc = model === "bsc";
      const lnConv = bsc ? bscConverseLog(n, k, op.x) : becConverseLog(n, k, op.x);
      const lnAch = bsc ? bscAchievableLog(n, k, op.x) : becAchievableLog(n, k, op.x);
      converse = bound(lnConv);
      achievable = bound(lnAch);
      const convViolated = logConv < lnConv - tol;
      violated ||= convViolated;
      findings.push(F.converseFinding(op, lnConv, logConv, convViolated));
      plausible = lnAch <= logAch + tol;
      const perfect = op.x > 0 ? (bsc ? bscPerfectCode(n, k) : becMdsCode(n, k)) : null;
      findings.push(F.achievabilityFinding(op, lnAch, perfect, plausible));
      findings.push(F.normalFinding(op, lnNormal, nRate, false, false));
    }
  } else findings.push(F.asymptoticFinding(op));

  const lnGallager = known ? gallagerLogBler(n, exponent) : null;
  findings.push(F.gallagerFinding(op, exponent, lnGallager));

  const thresholds = { ...claimThresholds(op, logConv, logAch, op.target), spherePacking: radio?.spThreshold ?? null };
  const gap = normal ? normal.rate - rate : null;
  const energy = radio?.energy ?? null;
  return {
    verdict: violated ? "impossible" : plausible ? "plausible" : "needs-evidence",
    findings,
    rate,
    capacity: op.capacity,
    converse,
    achievable,
    normal,
    spherePacking: radio?.spherePacking ?? null,
    thresholds,
    energy,
    implied: op.radio ? { ebn0Db: op.radio.ebn0Db } : null,
    margins: {
      rateGapBits: gap,
      rateGapFraction: gap !== null && normal && normal.rate > 0 ? gap / normal.rate : null,
      ...channelMargins(op, thresholds, radio),
    },
    channel: op.channel,
    n,
    k,
    target: { metric: op.metric, value: op.target, log10: toLog10(lnTarget) },
    dispersion: op.dispersion,
    gallager: { exponent, log10Bler: lnGallager === null ? null : toLog10(lnGallager) },
    engineVersion: ENGINE_VERSION,
  };
}

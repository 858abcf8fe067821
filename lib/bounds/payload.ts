// The verdict on a payload-only BI-AWGN claim (k information bits, no block length): energy per
// bit with no bandwidth limit (BOUNDS.md section 9).
import type { ClaimInput, ClaimResult } from "./schema";
import { resolvePayload } from "./resolve";
import { radioPayload, radioPreamble } from "./radio";
import { requiredCapacity } from "./residual";
import { linearToDb } from "./channels";
import { LN2, toLog10 } from "./special";
import { berFinding } from "./findings";
import { ENGINE_VERSION } from "./version";

export function evaluatePayloadClaim(input: ClaimInput): ClaimResult {
  const op = resolvePayload(input);
  const k = op.k as number;
  const lnTarget = Math.log(op.target);
  const logConv = op.metric === "ber" ? Math.min(0, Math.log(k) + lnTarget) : lnTarget;
  const findings = [...radioPreamble(op)];
  if (op.metric === "ber") findings.push(berFinding(op));
  const r = radioPayload(op, logConv, lnTarget);
  findings.push(...r.findings);
  // The wideband limits: Eb/N0 >= ln 2 (Shannon 1949), and ln 2 (1 - h2(pb)) with residual errors.
  const capacity = linearToDb(LN2 * requiredCapacity(1, op.target));
  const shannon = linearToDb(LN2);
  const ebn0 = op.radio!.ebn0Db;
  const diff = (th: number | null) => (th === null ? null : th - ebn0);
  return {
    verdict: r.violated ? "impossible" : r.plausible ? "plausible" : "needs-evidence",
    findings,
    rate: null,
    capacity: null,
    converse: null,
    achievable: null,
    normal: null,
    spherePacking: null,
    thresholds: { capacity, shannon, converse: null, achievable: null, normal: null, spherePacking: null, unit: "ebn0Db" },
    energy: r.energy,
    implied: { ebn0Db: ebn0 },
    margins: {
      rateGapBits: null,
      rateGapFraction: null,
      channelKind: "dB",
      channel: { capacity: diff(capacity), converse: diff(r.energy!.converseEbn0Db), achievable: diff(r.energy!.achievableEbn0Db), normal: null },
    },
    channel: op.channel,
    n: null,
    k,
    target: { metric: op.metric, value: op.target, log10: toLog10(lnTarget) },
    dispersion: null,
    gallager: null,
    engineVersion: ENGINE_VERSION,
  };
}

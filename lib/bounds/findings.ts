// The findings a verdict is built from: a code, a one-sentence message with the numbers, a source.
import type { OperatingPoint } from "./resolve";
import { fmtChannel, fmtCode, fmtRate, sci, sciLn } from "./format";
import { logRawBerForNcg } from "./conversions";

export type Severity = "violation" | "gap" | "support" | "info";
export interface Finding {
  code: string;
  severity: Severity;
  message: string;
  source: string;
}

export const SOURCES = {
  capacity: "Shannon 1948 with the rate-distortion converse (Cover and Thomas, Elements of Information Theory, joint source-channel coding)",
  bscConverse: "Polyanskiy, Poor, Verdu 2010, Theorem 35",
  bscRcu: "Polyanskiy, Poor, Verdu 2010, Theorem 33 (RCU bound)",
  becConverse: "Polyanskiy, Poor, Verdu 2010, Theorem 38",
  becAchiev: "Polyanskiy, Poor, Verdu 2010, Theorem 37",
  normal: "Polyanskiy, Poor, Verdu 2010, normal approximation (eq. 1, Theorems 52-54)",
  gallager: "Gallager 1965, random-coding exponent",
  ncg: "ITU-T G.975.1, net coding gain definition",
  berBler: "BER <= BLER <= k BER (a block error spoils between 1 and k information bits)",
  perfect: "Hamming 1950; Golay 1949; perfect and MDS codes meet the converse (Polyanskiy, Poor, Verdu 2010)",
} as const;

const modelName = { bsc: "BSC", bec: "BEC", biawgn: "BI-AWGN channel" } as const;
const metricName = (op: OperatingPoint) => (op.metric === "ber" ? "BER" : "BLER");

/** "the BSC at p = 2.0e-3" */
export function where(op: OperatingPoint): string {
  return `the ${modelName[op.model]} at ${fmtChannel(op.claimed, op.unit)}`;
}

export function capacityFinding(op: OperatingPoint, required: number, violated: boolean): Finding {
  const need = `A code of rate ${fmtRate(op.rate)} delivering ${metricName(op)} ${sci(op.target)} needs capacity at least ${fmtRate(required)} bits per channel use`;
  return violated
    ? { code: "capacity-exceeded", severity: "violation", message: `${need}, but ${where(op)} has only ${fmtRate(op.capacity)}.`, source: SOURCES.capacity }
    : { code: "within-capacity", severity: "support", message: `${need}, and ${where(op)} has ${fmtRate(op.capacity)}.`, source: SOURCES.capacity };
}

export function converseFinding(op: OperatingPoint, lnConverse: number, lnAllowed: number, violated: boolean): Finding {
  const n = op.n as number;
  const k = op.k as number;
  const source = op.model === "bsc" ? SOURCES.bscConverse : SOURCES.becConverse;
  const least = `the least possible BLER with ${fmtCode(n, k)} on ${where(op)} is ${sciLn(lnConverse)}`;
  const asked = op.metric === "ber" ? `BER ${sci(op.target)} (which needs BLER at most ${sciLn(lnAllowed)})` : `BLER ${sci(op.target)}`;
  return violated
    ? { code: "below-converse", severity: "violation", message: `No code can reach ${asked}: ${least}.`, source }
    : { code: "within-converse", severity: "support", message: `The converse allows ${asked}: ${least}.`, source };
}

export function achievabilityFinding(op: OperatingPoint, lnAch: number, perfect: string | null, ok: boolean): Finding {
  const bound = perfect ? `the ${perfect}, which meets the converse,` : op.model === "bsc" ? "the RCU bound" : "the random-coding bound";
  const source = perfect ? SOURCES.perfect : op.model === "bsc" ? SOURCES.bscRcu : SOURCES.becAchiev;
  const got = `${bound} guarantees BLER ${sciLn(lnAch)} at ${fmtCode(op.n as number, op.k as number)} on ${where(op)}`;
  return ok
    ? { code: "within-achievability", severity: "support", message: `The claimed ${metricName(op)} ${sci(op.target)} is achievable: ${got}.`, source }
    : {
        code: "beyond-achievability",
        severity: "gap",
        message: `The claimed ${metricName(op)} ${sci(op.target)} beats what is guaranteed (${got}), so it needs a code better than a random one, and evidence.`,
        source,
      };
}

export function normalFinding(op: OperatingPoint, lnBler: number, rate: number, deciding: boolean, ok: boolean, unreliable: string | null = null): Finding {
  const text = `At n = ${op.n} the normal approximation expects BLER ${sciLn(lnBler)} at rate ${fmtRate(op.rate)} and a best rate of ${fmtRate(rate)} at ${metricName(op)} ${sci(op.target)}`;
  if (unreliable)
    return {
      code: "normal-approximation-unreliable",
      severity: "info",
      message: `${text} (an approximation, not a bound, and unreliable here since ${unreliable}).`,
      source: SOURCES.normal,
    };
  if (!deciding) return { code: "normal-approximation", severity: "info", message: `${text} (an approximation, not a bound).`, source: SOURCES.normal };
  return ok
    ? {
        code: "within-normal-approximation",
        severity: "support",
        message: `${text}, so a good code of this length is expected to do it.`,
        source: SOURCES.normal,
      }
    : {
        code: "beyond-normal-approximation",
        severity: "gap",
        message: `${text}, so the claim beats what a good code of this length is expected to do and needs evidence.`,
        source: SOURCES.normal,
      };
}

export function asymptoticFinding(op: OperatingPoint): Finding {
  return {
    code: "asymptotic-only",
    severity: "gap",
    message: `No block length was given, so only the asymptotic capacity test applies to rate ${fmtRate(op.rate)} on ${where(op)}, and finite-length achievability cannot be judged.`,
    source: SOURCES.capacity,
  };
}

export function berFinding(op: OperatingPoint): Finding {
  if (op.k === null)
    return {
      code: "ber-target",
      severity: "info",
      message: `Without a block length the BER ${sci(op.target)} is checked by the capacity test R (1 - h2(BER)) <= C only.`,
      source: SOURCES.capacity,
    };
  return {
    code: "ber-target",
    severity: "info",
    message: `The BER ${sci(op.target)} is held to BLER ${sci(Math.min(1, (op.k ?? 1) * op.target))} by the converse and to BLER ${sci(op.target)} by achievability, since BER <= BLER <= k BER.`,
    source: SOURCES.berBler,
  };
}

export function ncgFinding(op: OperatingPoint): Finding {
  const c = op.channel;
  const soft = op.model === "biawgn" ? `, that is Es/N0 = ${(c.esn0Db as number).toFixed(2)} dB` : "";
  return {
    code: "ncg-resolved",
    severity: "info",
    message: `A net coding gain of ${(c.ncgDb as number).toFixed(2)} dB at output BER ${sci(op.target)} and rate ${fmtRate(op.rate)} implies a raw BER of ${sciLn(logRawBerForNcg(c.ncgDb as number, op.target, op.rate))}${soft}.`,
    source: SOURCES.ncg,
  };
}

export function gallagerFinding(op: OperatingPoint, exponent: number, lnBler: number | null): Finding {
  const tail = lnBler === null ? "" : `, so some code of length ${op.n} has BLER at most ${sciLn(lnBler)}`;
  return {
    code: "gallager-exponent",
    severity: "info",
    message: `Gallager's random-coding exponent at rate ${fmtRate(op.rate)} on ${where(op)} is ${exponent.toPrecision(4)} bits per channel use${tail}.`,
    source: SOURCES.gallager,
  };
}

export function noiselessFinding(op: OperatingPoint): Finding {
  return {
    code: "noiseless-channel",
    severity: "info",
    message: `${where(op)[0].toUpperCase()}${where(op).slice(1)} is noiseless, so any rate up to 1 is possible without errors.`,
    source: SOURCES.capacity,
  };
}

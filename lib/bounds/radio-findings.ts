// Findings of the radio checks (BOUNDS.md sections 8 and 9): sphere packing, energy per bit,
// sensitivity, and which bound a BI-AWGN verdict rests on.
import type { OperatingPoint } from "./resolve";
import type { Finding } from "./findings";
import { fmtDb, sci, sciLn } from "./format";
import { THERMAL_DBM_PER_HZ } from "./energy";

export const RADIO_SOURCES = {
  spherePacking: 'Shannon 1959, "Probability of error for optimal codes in a Gaussian channel" (sphere-packing bound)',
  energyConverse: "Polyanskiy, Poor, Verdu 2011, minimum energy to send k bits, converse without feedback",
  orthogonal: "Polyanskiy, Poor, Verdu 2011, M-ary orthogonal signalling (achievability)",
  sensitivity: "Thermal noise k_B T0 at T0 = 290 K, the IEEE noise-figure reference; Eb/N0 = S - 10 log10(k_B T0 / 1 mW) - 10 log10(Rb) - NF",
  gallager: "Gallager 1965, random-coding bound",
  normal: "Polyanskiy, Poor, Verdu 2010, normal approximation (eq. 1, Theorems 52-54)",
  wholeK: "k = log2 M is a whole number of information bits",
} as const;

const asked = (op: OperatingPoint) => `${op.metric === "ber" ? "BER" : "BLER"} ${sci(op.target)}`;
const margin = (m: number) => `${m >= 0 ? "" : "-"}${fmtDb(Math.abs(m))}`;

export function wholeKFinding(op: OperatingPoint): Finding {
  return {
    code: "whole-k",
    severity: "info",
    message: `Rate and n = ${op.n} give n R = ${(op.kFrom as number).toFixed(2)} information bits, so k = ${op.k} is used (rounded down, which never overstates an impossibility).`,
    source: RADIO_SOURCES.wholeK,
  };
}

export function sensitivityFinding(op: OperatingPoint): Finding {
  const c = op.channel;
  const nf = c.noiseFigureDb ?? 0;
  const basis = c.noiseFigureDb !== undefined ? `the stated noise figure ${fmtDb(nf)}` : "an ideal receiver (noise figure 0 dB)";
  return {
    code: "sensitivity-to-ebn0",
    severity: "info",
    message: `A sensitivity of ${(c.sensitivityDbm as number).toFixed(2)} dBm at ${c.bitRate} bit/s (the information bit rate) with ${basis} amounts to Eb/N0 = ${fmtDb(op.radio!.ebn0Db)}, with thermal noise ${THERMAL_DBM_PER_HZ.toFixed(3)} dBm/Hz; the verdict judges only this physical limit, while measured sensitivity also depends on test conditions (conducted or radiated, temperature, interference).`,
    source: RADIO_SOURCES.sensitivity,
  };
}

export function noiseFigureFinding(op: OperatingPoint): Finding | null {
  const r = op.radio!;
  if (r.noiseBasis === "assumed")
    return {
      code: "noise-figure-assumed",
      severity: "info",
      message: `No noise figure was stated, so impossibility is judged at 0 dB and plausibility at the tender's assumed ${fmtDb(op.channel.assumedNoiseFigureDb as number)}, where the claim amounts to Eb/N0 = ${fmtDb(r.realisticEbn0Db)}.`,
      source: RADIO_SOURCES.sensitivity,
    };
  if (r.noiseBasis === "ideal")
    return {
      code: "noise-figure-ideal",
      severity: "info",
      message: "No noise figure is known at all, so plausibility too assumes an ideal receiver (0 dB), which favours the claim.",
      source: RADIO_SOURCES.sensitivity,
    };
  return null;
}

export function spherePackingFinding(op: OperatingPoint, lnSp: number, lnAllowed: number, threshold: number | null, violated: boolean): Finding {
  const r = op.radio!;
  const code = `n = ${op.n}, k = ${op.k} (${r.modulation === "qpsk" ? "Gray QPSK" : "BPSK"}, codewords of equal energy)`;
  const need = threshold === null ? "" : `; it needs Eb/N0 at least ${fmtDb(threshold)} (margin ${margin(r.ebn0Db - threshold)})`;
  const held = op.metric === "ber" ? ` (held to BLER ${sciLn(lnAllowed)})` : "";
  return violated
    ? {
        code: "below-sphere-packing",
        severity: "violation",
        message: `No code with ${code} can reach ${asked(op)}${held} at Eb/N0 = ${fmtDb(r.ebn0Db)}: Shannon's 1959 bound gives BLER at least ${sciLn(lnSp)}${need}.`,
        source: RADIO_SOURCES.spherePacking,
      }
    : {
        code: "within-sphere-packing",
        severity: "support",
        message: `Shannon's 1959 bound allows ${asked(op)}${held} with ${code} at Eb/N0 = ${fmtDb(r.ebn0Db)}: the least possible BLER is ${sciLn(lnSp)}${need}.`,
        source: RADIO_SOURCES.spherePacking,
      };
}

export function energyConverseFinding(op: OperatingPoint, k: number, limit: number | null, violated: boolean): Finding {
  const r = op.radio!;
  const what = `Sending k = ${k} bits at ${asked(op)} with any code, modulation and bandwidth needs`;
  if (limit === null)
    return {
      code: "within-energy-converse",
      severity: "support",
      message: `${what} no energy at all by the converse, so it cannot object.`,
      source: RADIO_SOURCES.energyConverse,
    };
  const tail = `Eb/N0 at least ${fmtDb(limit)}; the claim amounts to ${fmtDb(r.ebn0Db)} (margin ${margin(r.ebn0Db - limit)})`;
  return violated
    ? { code: "below-energy-converse", severity: "violation", message: `${what} ${tail}, so it is impossible.`, source: RADIO_SOURCES.energyConverse }
    : { code: "within-energy-converse", severity: "support", message: `${what} ${tail}.`, source: RADIO_SOURCES.energyConverse };
}

export function orthogonalFinding(op: OperatingPoint, k: number, limit: number | null, ok: boolean): Finding {
  const r = op.radio!;
  const reach = limit === null ? "at any Eb/N0" : `from Eb/N0 = ${fmtDb(limit)}`;
  const at = `the claim amounts to ${fmtDb(r.realisticEbn0Db)} at a realistic noise figure${limit === null ? "" : ` (margin ${margin(r.realisticEbn0Db - limit)})`}`;
  return ok
    ? {
        code: "within-orthogonal",
        severity: "support",
        message: `2^${k} orthogonal signals reach ${asked(op)} ${reach}, and ${at}, so the claim is achievable.`,
        source: RADIO_SOURCES.orthogonal,
      }
    : {
        code: "beyond-orthogonal",
        severity: "gap",
        message: `2^${k} orthogonal signals reach ${asked(op)} only ${reach}, but ${at}, so the claim needs evidence.`,
        source: RADIO_SOURCES.orthogonal,
      };
}

/** Which bound a BI-AWGN verdict with n and k rests on, at the realistic Eb/N0. */
export function restsOnFinding(op: OperatingPoint, basis: "normal" | "gallager" | null, lnGallager: number, normalWhyNot: string | null): Finding {
  const at = `at Eb/N0 = ${fmtDb(op.radio!.realisticEbn0Db)}`;
  const g = `Gallager's random-coding bound guarantees some code with n = ${op.n}, k = ${op.k} BLER at most ${sciLn(lnGallager)} ${at}`;
  if (basis === "gallager")
    return {
      code: "within-random-coding",
      severity: "support",
      message: `${g}, so the claimed ${asked(op)} is achievable (the verdict rests on this rigorous bound).`,
      source: RADIO_SOURCES.gallager,
    };
  if (basis === "normal")
    return {
      code: "rests-on-normal-approximation",
      severity: "info",
      message: `The verdict rests on the normal approximation, which is reliable here (BLER at least 1e-6 and above the 1959 converse); ${g}.`,
      source: RADIO_SOURCES.normal,
    };
  const why = normalWhyNot ? `; the normal approximation is not relied on here, since ${normalWhyNot}` : "";
  return {
    code: "beyond-random-coding",
    severity: "gap",
    message: `${g}, which does not reach the claimed ${asked(op)}, so the claim needs a code better than a random one, and evidence${why}.`,
    source: RADIO_SOURCES.gallager,
  };
}

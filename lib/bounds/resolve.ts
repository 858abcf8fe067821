// Turns a validated claim into one operating point: rate, n and log2 M, the channel actually used.
import type { ClaimInput } from "./schema";
import { bscCapacity, bscDispersion, becCapacity, becDispersion } from "./channels";
import { biawgnCapDisp } from "./biawgn";
import { ebn0ToEsn0, esn0ForNcg, esn0ToEbn0, overheadToRate, rawBerForNcg } from "./conversions";

export type Model = "bsc" | "bec" | "biawgn";
export type Unit = "p" | "e" | "ebn0Db" | "esn0Db";

export interface OperatingPoint {
  model: Model;
  /** Block length, when the claim states one. */
  n: number | null;
  /** log2 M; an integer when stated as k, n times the rate otherwise (real values are allowed by PPV). */
  k: number | null;
  rate: number;
  metric: "bler" | "ber";
  target: number;
  /** The channel parameter the bounds use: p (BSC), e (BEC) or Es/N0 in dB (BI-AWGN). */
  x: number;
  /** The unit thresholds are reported in, and the claimed value in that unit. */
  unit: Unit;
  claimed: number;
  channel: { model: Model; p?: number; e?: number; esn0Db?: number; ebn0Db?: number; ncgDb?: number };
  capacity: number;
  dispersion: number;
  /** Whether the normal approximation carries the 1/2 log2 n term (not for the BEC). */
  logTerm: boolean;
}

/** n times the rate, snapped to the nearest integer when it is one up to rounding noise. */
function log2M(n: number, rate: number): number {
  const k = n * rate;
  return Math.abs(k - Math.round(k)) < 1e-6 ? Math.round(k) : k;
}

export function resolveClaim(claim: ClaimInput): OperatingPoint {
  const { code, target } = claim;
  const n = code.n ?? null;
  let rate: number;
  let k: number | null = null;
  if (code.k !== undefined && n !== null) {
    k = code.k;
    rate = k / n;
  } else {
    rate = code.rate ?? overheadToRate(code.overhead ?? 0);
    if (n !== null) k = log2M(n, rate);
  }
  const base = { n, k, rate, metric: target.metric, target: target.value };
  const ch = claim.channel as { model: Model; p?: number; e?: number; ebn0Db?: number; esn0Db?: number; ncgDb?: number };
  if (ch.model === "bec") {
    const e = ch.e as number;
    return { ...base, model: "bec", x: e, unit: "e", claimed: e, channel: { model: "bec", e }, capacity: becCapacity(e), dispersion: becDispersion(e), logTerm: false };
  }
  // A net coding gain names the raw BER it implies at the target's output BER (ITU-T G.975.1).
  const ncgP = ch.ncgDb !== undefined ? rawBerForNcg(ch.ncgDb, target.value, rate) : undefined;
  if (ch.model === "bsc") {
    const p = ncgP ?? (ch.p as number);
    const channel = { model: "bsc" as const, p, ...(ch.ncgDb !== undefined ? { ncgDb: ch.ncgDb } : {}) };
    return { ...base, model: "bsc", x: p, unit: "p", claimed: p, channel, capacity: bscCapacity(p), dispersion: bscDispersion(p), logTerm: true };
  }
  let esn0Db: number;
  let unit: Unit = "ebn0Db";
  if (ch.ncgDb !== undefined) esn0Db = esn0ForNcg(ch.ncgDb, target.value, rate);
  else if (ch.esn0Db !== undefined) {
    esn0Db = ch.esn0Db;
    unit = "esn0Db";
  } else esn0Db = ebn0ToEsn0(ch.ebn0Db as number, rate);
  const ebn0Db = esn0ToEbn0(esn0Db, rate);
  const cd = biawgnCapDisp(esn0Db);
  const channel = { model: "biawgn" as const, esn0Db, ebn0Db, ...(ncgP !== undefined ? { p: ncgP, ncgDb: ch.ncgDb } : {}) };
  return {
    ...base, model: "biawgn", x: esn0Db, unit, claimed: unit === "esn0Db" ? esn0Db : ebn0Db, channel,
    capacity: cd.capacity, dispersion: cd.dispersion, logTerm: true,
  };
}

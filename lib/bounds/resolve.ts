// Turns a validated claim into one operating point: rate, n and log2 M, the channel actually used.
import type { ClaimInput } from "./schema";
import { bscCapacity, bscDispersion, becCapacity, becDispersion } from "./channels";
import { biawgnCapDisp } from "./biawgn";
import { ebn0ToEsn0, esn0ForNcg, esn0ToEbn0, overheadToRate, rawBerForNcg } from "./conversions";
import { sensitivityToEbn0Db } from "./energy";
import type { ChannelModel } from "./vocabulary";

export type Model = ChannelModel;
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
  channel: { model: Model; p?: number; e?: number; esn0Db?: number; ebn0Db?: number; ncgDb?: number } & ChannelFields;
  capacity: number;
  dispersion: number;
  /** Whether the normal approximation carries the 1/2 log2 n term (not for the BEC). */
  logTerm: boolean;
  /** n times the stated rate when that was not a whole number and k was rounded down from it. */
  kFrom: number | null;
  /** BI-AWGN only: the Eb/N0 the claim amounts to, and how a receiver's noise figure enters it. */
  radio: Radio | null;
}

export interface Radio {
  /** Eb/N0 (dB) at the vendor's stated noise figure, or 0 dB: impossibility is judged here. */
  ebn0Db: number;
  /** Eb/N0 (dB) at a realistic noise figure (the vendor's, else the tender's assumption, else 0 dB). */
  realisticEbn0Db: number;
  /** Where the realistic noise figure comes from (null when the claim is not a sensitivity). */
  noiseBasis: "stated" | "assumed" | "ideal" | null;
  modulation: "bpsk" | "qpsk";
  /** Real dimensions of a codeword: n for BPSK and Gray QPSK (two per symbol), null without n. */
  dims: number | null;
}

/** n times the rate, snapped to an integer when it is one up to rounding noise, else rounded down. */
function wholeK(n: number, rate: number): number {
  const k = n * rate;
  return Math.abs(k - Math.round(k)) < 1e-6 ? Math.round(k) : Math.floor(k);
}

export function resolveClaim(claim: ClaimInput): OperatingPoint {
  const { code, target } = claim;
  const n = code.n ?? null;
  let rate: number;
  let k: number | null = null;
  let kFrom: number | null = null;
  if (code.k !== undefined && n !== null) {
    k = code.k;
    rate = k / n;
  } else {
    rate = code.rate ?? overheadToRate(code.overhead ?? 0);
    if (n !== null) {
      // A whole number of information bits, rounded down so that no impossibility is overstated.
      k = wholeK(n, rate);
      if (k !== n * rate) kFrom = n * rate;
      rate = k / n;
    }
  }
  const base = { n, k, rate, metric: target.metric, target: target.value, kFrom, radio: null };
  const ch = claim.channel as ClaimInput["channel"] & {
    p?: number;
    e?: number;
    ebn0Db?: number;
    esn0Db?: number;
    ncgDb?: number;
    sensitivityDbm?: number;
    bitRate?: number;
    noiseFigureDb?: number;
    assumedNoiseFigureDb?: number;
  };
  if (ch.model === "bec") {
    const e = ch.e as number;
    return {
      ...base,
      model: "bec",
      x: e,
      unit: "e",
      claimed: e,
      channel: { model: "bec", e },
      capacity: becCapacity(e),
      dispersion: becDispersion(e),
      logTerm: false,
    };
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
  const sens = sensitivityOf(ch);
  if (ch.ncgDb !== undefined) esn0Db = esn0ForNcg(ch.ncgDb, target.value, rate);
  else if (ch.esn0Db !== undefined) {
    esn0Db = ch.esn0Db;
    unit = "esn0Db";
  } else esn0Db = ebn0ToEsn0(sens ? sens.ebn0Db : (ch.ebn0Db as number), rate);
  const ebn0Db = esn0ToEbn0(esn0Db, rate);
  const cd = biawgnCapDisp(esn0Db);
  const channel = {
    model: "biawgn" as const,
    esn0Db,
    ebn0Db,
    ...(ncgP !== undefined ? { p: ncgP, ncgDb: ch.ncgDb } : {}),
    ...(sens ? sens.channel : {}),
  };
  const modulation = code.modulation ?? "bpsk";
  const radio: Radio = {
    ebn0Db,
    realisticEbn0Db: sens ? sens.realisticEbn0Db : ebn0Db,
    noiseBasis: sens ? sens.basis : null,
    modulation,
    dims: n,
  };
  return {
    ...base,
    model: "biawgn",
    x: esn0Db,
    unit,
    claimed: unit === "esn0Db" ? esn0Db : ebn0Db,
    channel,
    capacity: cd.capacity,
    dispersion: cd.dispersion,
    logTerm: true,
    radio,
  };
}

type ChannelFields = { sensitivityDbm?: number; bitRate?: number; noiseFigureDb?: number; assumedNoiseFigureDb?: number };

/**
 * A sensitivity claim as Eb/N0 (BOUNDS.md section 9): judged at the vendor's noise figure or 0 dB,
 * and at a realistic one (the vendor's, else the tender's assumption, else the ideal 0 dB).
 */
export function sensitivityOf(ch: ChannelFields) {
  if (ch.sensitivityDbm === undefined || ch.bitRate === undefined) return null;
  const stated = ch.noiseFigureDb;
  const realisticNf = stated ?? ch.assumedNoiseFigureDb ?? 0;
  const basis = stated !== undefined ? ("stated" as const) : ch.assumedNoiseFigureDb !== undefined ? ("assumed" as const) : ("ideal" as const);
  const channel = {
    sensitivityDbm: ch.sensitivityDbm,
    bitRate: ch.bitRate,
    ...(stated !== undefined ? { noiseFigureDb: stated } : {}),
    ...(ch.assumedNoiseFigureDb !== undefined ? { assumedNoiseFigureDb: ch.assumedNoiseFigureDb } : {}),
  };
  return {
    ebn0Db: sensitivityToEbn0Db(ch.sensitivityDbm, ch.bitRate, stated ?? 0),
    realisticEbn0Db: sensitivityToEbn0Db(ch.sensitivityDbm, ch.bitRate, realisticNf),
    realisticNf,
    basis,
    channel,
  };
}

/**
 * A payload-only BI-AWGN claim (k without n: no block length, no bandwidth limit). Only the
 * energy checks apply; the rate is taken as its wideband limit 0 and the Es/N0 is undefined.
 */
export function resolvePayload(claim: ClaimInput): OperatingPoint {
  const ch = claim.channel as ChannelFields & { ebn0Db?: number };
  const sens = sensitivityOf(ch);
  const ebn0Db = sens ? sens.ebn0Db : (ch.ebn0Db as number);
  const radio: Radio = {
    ebn0Db,
    realisticEbn0Db: sens ? sens.realisticEbn0Db : ebn0Db,
    noiseBasis: sens ? sens.basis : null,
    modulation: claim.code.modulation ?? "bpsk",
    dims: null,
  };
  return {
    model: "biawgn",
    n: null,
    k: claim.code.k as number,
    rate: 0,
    metric: claim.target.metric,
    target: claim.target.value,
    x: NaN,
    unit: "ebn0Db",
    claimed: ebn0Db,
    channel: { model: "biawgn", ebn0Db, ...(sens ? sens.channel : {}) },
    capacity: 0,
    dispersion: 0,
    logTerm: true,
    kFrom: null,
    radio,
  };
}

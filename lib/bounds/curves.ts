// Pure series builders for the Bound explorer charts (log10 BLER against the channel, best rate against n).
import { bscConverseLog, bscRcuLog } from "./bsc";
import { becAchievLog, becConverseLog } from "./bec";
import { biawgnCapDisp, biawgnEsn0ForCapacity, esn0Where } from "./biawgn";
import { bscCapacity, bscDispersion, becCapacity, becDispersion } from "./channels";
import { ebn0ToEsn0, esn0ToEbn0 } from "./conversions";
import { energyConverseLogBler } from "./energy";
import { spherePackingLog } from "./sphere";
import { normalApproxLog2M, normalApproxLogBler, normalApproxRate } from "./normal";
import { channelThreshold } from "./solve";
import { h2inv, toLog10 } from "./special";
import type { Model } from "./resolve";

export interface ChannelCurvePoint {
  /** p, e, or Eb/N0 in dB. */
  x: number;
  /** log10 BLER of the converse, the achievability bound and the normal approximation (null where none applies). */
  converse: number | null;
  achievable: number | null;
  normal: number;
  /** BI-AWGN only: log10 of the least BLER any code with 2^k words reaches at this energy per bit (PPV 2011). */
  energy?: number | null;
}

export interface ChannelCurveOptions {
  model: Model;
  n: number;
  k: number;
  points?: number;
  /** Range of the channel parameter; by default around the Shannon limit of the rate k/n. */
  from?: number;
  to?: number;
}

function spaced(from: number, to: number, points: number, log: boolean): number[] {
  const a = log ? Math.log(from) : from;
  const b = log ? Math.log(to) : to;
  return Array.from({ length: points }, (_, i) => {
    const v = a + ((b - a) * i) / Math.max(1, points - 1);
    return log ? Math.exp(v) : v;
  });
}

/** Normal-approximation BLER curve extremes the default range spans: from 1e-15 up to 1/2. */
const LN_LOW = Math.log(1e-15);
const LN_HIGH = Math.log(0.5);

/**
 * BLER bounds of a code (n, k) across the channel: log-spaced p or e, Eb/N0 linear in dB. By
 * default the range runs from where the normal approximation gives BLER 1e-15 to where it gives
 * 1/2, widened by a margin, so the waterfall fills the chart.
 */
export function channelCurve({ model, n, k, points = 60, from, to }: ChannelCurveOptions): ChannelCurvePoint[] {
  const rate = k / n;
  if (model === "biawgn") {
    const ebn0ForNormal = (lnEps: number) =>
      esn0Where((db) => {
        const cd = biawgnCapDisp(db);
        return normalApproxLog2M(n, cd.capacity, cd.dispersion, lnEps, true) - k;
      }, biawgnEsn0ForCapacity(rate)) - ebn0ToEsn0(0, rate);
    const lo = from ?? ebn0ForNormal(LN_HIGH) - 1;
    const hi = to ?? Math.max(lo + 1, ebn0ForNormal(LN_LOW) + 1);
    // The converse is Shannon's 1959 bound (equal-energy codes: BPSK, Gray QPSK).
    return spaced(lo, hi, points, false).map((x) => {
      const cd = biawgnCapDisp(ebn0ToEsn0(x, rate));
      return {
        x,
        converse: toLog10(spherePackingLog(n, k, x)),
        achievable: null,
        normal: toLog10(normalApproxLogBler(n, k, cd.capacity, cd.dispersion, true)),
        energy: toLog10(energyConverseLogBler(k, x)),
      };
    });
  }
  const bsc = model === "bsc";
  const C = bsc ? bscCapacity : becCapacity;
  const V = bsc ? bscDispersion : becDispersion;
  const uMax = bsc ? 0 : 36;
  const limit = bsc ? h2inv(1 - rate) : 1 - rate;
  const at = (lnEps: number) => channelThreshold((x) => normalApproxLogBler(n, k, C(x), V(x), bsc), lnEps, -690, uMax, limit);
  const xMax = bsc ? 0.5 : 0.999;
  const lo = from ?? Math.max(1e-12, at(LN_LOW) / 2);
  const hi = to ?? Math.min(xMax, Math.max(2 * lo, 1.5 * at(LN_HIGH)));
  return spaced(lo, hi, points, true).map((x) => ({
    x,
    converse: toLog10(bsc ? bscConverseLog(n, k, x) : becConverseLog(n, k, x)),
    achievable: toLog10(bsc ? bscRcuLog(n, k, x) : becAchievLog(n, k, x)),
    normal: toLog10(normalApproxLogBler(n, k, C(x), V(x), bsc)),
  }));
}

export interface RateCurvePoint {
  n: number;
  capacity: number;
  /** Largest k/n the converse allows at the target BLER (BI-AWGN: Shannon's 1959 bound at this Es/N0). */
  converseRate: number | null;
  /** Largest k/n the RCU (BSC) or Theorem 37 (BEC) bound guarantees (null for the BI-AWGN channel). */
  achievableRate: number | null;
  normalRate: number;
}

export interface RateCurveOptions {
  /** p for the BSC, e for the BEC, Es/N0 in dB for the BI-AWGN channel. */
  model: Model;
  x: number;
  targetBler: number;
  nMin?: number;
  nMax?: number;
  points?: number;
}

/** Largest integer k in [0, n] with ok(k), for ok true up to some k and false beyond; gallops from a guess. */
function largestK(n: number, ok: (k: number) => boolean, guess: number): number {
  let lo = 0;
  let hi = n + 1;
  const g = Math.min(n, Math.max(1, Math.round(guess)));
  const step = Math.max(1, Math.ceil(Math.sqrt(n)));
  if (ok(g)) {
    lo = g;
    for (let d = step; lo < n; d *= 2) {
      const t = Math.min(n, g + d);
      if (!ok(t)) {
        hi = t;
        break;
      }
      lo = t;
    }
    if (lo === n) return n;
  } else {
    hi = g;
    for (let d = step; hi > 1; d *= 2) {
      const t = Math.max(1, g - d);
      if (ok(t)) {
        lo = t;
        break;
      }
      hi = t;
    }
  }
  while (hi - lo > 1) {
    const mid = Math.floor((lo + hi) / 2);
    if (ok(mid)) lo = mid;
    else hi = mid;
  }
  return lo;
}

/** Best rate against block length (n log-spaced, 10..10^5 by default) at a target BLER. */
export function rateCurve({ model, x, targetBler, nMin = 10, nMax = 100_000, points = 40 }: RateCurveOptions): RateCurvePoint[] {
  const lnEps = Math.log(targetBler);
  const cd =
    model === "biawgn"
      ? biawgnCapDisp(x)
      : model === "bsc"
        ? { capacity: bscCapacity(x), dispersion: bscDispersion(x) }
        : { capacity: becCapacity(x), dispersion: becDispersion(x) };
  const ns = [...new Set(spaced(nMin, nMax, points, true).map(Math.round))];
  return ns.map((n) => {
    const normalRate = normalApproxRate(n, cd.capacity, cd.dispersion, lnEps, model !== "bec");
    if (model === "biawgn") {
      // At a fixed Es/N0 the 1959 bound grows with k, so the largest k it allows is a bisection.
      const ok = (k: number) => spherePackingLog(n, k, esn0ToEbn0(x, k / n)) <= lnEps;
      return { n, capacity: cd.capacity, converseRate: largestK(n, ok, n * normalRate) / n, achievableRate: null, normalRate };
    }
    const conv = model === "bsc" ? bscConverseLog : becConverseLog;
    const ach = model === "bsc" ? bscRcuLog : becAchievLog;
    const kc = largestK(n, (k) => conv(n, k, x) <= lnEps, n * normalRate);
    const ka = largestK(n, (k) => ach(n, k, x) <= lnEps, Math.min(kc, n * normalRate));
    return { n, capacity: cd.capacity, converseRate: kc / n, achievableRate: ka / n, normalRate };
  });
}

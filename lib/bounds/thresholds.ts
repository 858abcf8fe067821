// The channel thresholds of a claim: the worst channel at which each bound still allows it.
import type { OperatingPoint, Unit } from "./resolve";
import { bscAchievableThreshold, bscConverseThreshold } from "./bsc";
import { becAchievableThreshold, becConverseThreshold } from "./bec";
import { biawgnCapacityGap, biawgnCapDisp, esn0Where } from "./biawgn";
import { bscCapacity, bscDispersion, becCapacity, becDispersion } from "./channels";
import { esn0ToEbn0 } from "./conversions";
import { normalApproxLog2M, normalApproxLogBler } from "./normal";
import { bscCapacityThreshold, becCapacityThreshold, biawgnCapacityThresholdEsn0Db } from "./residual";
import { channelThreshold } from "./solve";
import { h2inv } from "./special";

export interface Thresholds {
  /** Worst channel with capacity R (1 - h2(target)): beyond it the claim is impossible at any n. */
  capacity: number;
  /** Worst channel with capacity R (the Shannon limit of the rate, no residual errors allowed). */
  shannon: number;
  converse: number | null;
  achievable: number | null;
  normal: number | null;
  unit: Unit;
}

/**
 * Thresholds in the claim's unit. logConv and logAch are ln of the BLER the converse and the
 * achievability bound are held to (they differ for BER claims); pbCap is the residual error rate
 * of the capacity test (section 4 of the specification).
 */
export function claimThresholds(op: OperatingPoint, logConv: number, logAch: number, pbCap: number): Thresholds {
  const { n, k, rate, unit } = op;
  const known = n !== null && k !== null;
  if (op.model === "biawgn") {
    const toUnit = (esn0: number) => (unit === "esn0Db" ? esn0 : esn0ToEbn0(esn0, rate));
    let normal: number | null = null;
    const f = (db: number) => {
      const cd = biawgnCapDisp(db);
      return normalApproxLog2M(n as number, cd.capacity, cd.dispersion, logAch, true) - (k as number);
    };
    const capacity = biawgnCapacityThresholdEsn0Db(rate, pbCap);
    if (known) normal = toUnit(esn0Where(f, capacity + 0.5));
    // The Shannon limit is the capacity threshold without residual errors: just above it.
    const shannon = esn0Where((db) => 1 - rate - biawgnCapacityGap(db), capacity);
    return {
      capacity: toUnit(capacity),
      shannon: toUnit(shannon),
      converse: null,
      achievable: null,
      normal,
      unit,
    };
  }
  const bsc = op.model === "bsc";
  const capacity = bsc ? bscCapacityThreshold(rate, pbCap) : becCapacityThreshold(rate, pbCap);
  const shannon = bsc ? h2inv(1 - rate) : 1 - rate;
  if (!known) return { capacity, shannon, converse: null, achievable: null, normal: null, unit };
  const C = bsc ? bscCapacity : becCapacity;
  const V = bsc ? bscDispersion : becDispersion;
  const uMax = bsc ? 0 : 36;
  const normal = channelThreshold((x) => normalApproxLogBler(n, k, C(x), V(x), bsc), logAch, -690, uMax, capacity);
  const guess = normal > 0 ? normal : capacity;
  const converse = bsc ? bscConverseThreshold(n, k, logConv, guess) : becConverseThreshold(n, k, logConv, guess);
  const achievable = bsc ? bscAchievableThreshold(n, k, logAch, converse) : becAchievableThreshold(n, k, logAch, converse);
  return { capacity, shannon, converse, achievable, normal, unit };
}

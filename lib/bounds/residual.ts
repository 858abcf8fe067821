// Residual bit error rate: the rate-distortion converse R (1 - h2(pb)) <= C (Shannon 1948/1959;
// Cover and Thomas, Elements of Information Theory, joint source-channel coding).
import { h2, h2inv } from "./special";
import { biawgnEsn0ForCapacity } from "./biawgn";

/** R (1 - h2(pb)): the capacity a code of rate R needs to deliver post-decoder BER pb (pb <= 1/2). */
export function requiredCapacity(rate: number, pb: number): number {
  return rate * (1 - h2(Math.min(0.5, pb)));
}

/** Largest p at which a BSC still has the capacity R (1 - h2(pb)). */
export function bscCapacityThreshold(rate: number, pb: number): number {
  return h2inv(1 - requiredCapacity(rate, pb));
}

/** Largest e at which a BEC still has the capacity R (1 - h2(pb)). */
export function becCapacityThreshold(rate: number, pb: number): number {
  return 1 - requiredCapacity(rate, pb);
}

/** Smallest Es/N0 (dB) at which the BI-AWGN has the capacity R (1 - h2(pb)). */
export function biawgnCapacityThresholdEsn0Db(rate: number, pb: number): number {
  return biawgnEsn0ForCapacity(requiredCapacity(rate, pb));
}

// Conversions of the trade between rates, overheads, SNRs, Q-factors and coding gains.
import { dbToLinear, linearToDb } from "./channels";
import { erfc, erfcinv, logQ, qFunc, qInv } from "./special";

/** OH = n/k - 1, so R = 1 / (1 + OH). */
export function overheadToRate(overhead: number): number {
  return 1 / (1 + overhead);
}
export function rateToOverhead(rate: number): number {
  return 1 / rate - 1;
}

/** Es/N0 = R Eb/N0 (linear), so in dB Es/N0 = Eb/N0 + 10 log10 R. */
export function ebn0ToEsn0(ebn0Db: number, rate: number): number {
  return ebn0Db + linearToDb(rate);
}
export function esn0ToEbn0(esn0Db: number, rate: number): number {
  return esn0Db - linearToDb(rate);
}

/** Uncoded BPSK: BER = Q(sqrt(2 Eb/N0)) (Proakis, Digital Communications). */
export function uncodedBpskBer(ebn0Db: number): number {
  return qFunc(Math.sqrt(2 * dbToLinear(ebn0Db)));
}

/** Raw BER a hard-decision decoder sees on BPSK coded bits: p = Q(sqrt(2 Es/N0)). */
export function hardDecisionBer(esn0Db: number): number {
  return qFunc(Math.sqrt(2 * dbToLinear(esn0Db)));
}

/** Es/N0 (dB) at which hard-decision BPSK has raw BER p (inverse of hardDecisionBer). */
export function esn0ForRawBer(p: number): number {
  const q = qInv(p);
  return linearToDb((q * q) / 2);
}

/** Q-factor of a BER: Q = sqrt(2) erfcinv(2 BER) (ITU-T G.975.1). */
export function qFactor(ber: number): number {
  return qInv(ber);
}
export function qFactorDb(ber: number): number {
  return 20 * Math.log10(qFactor(ber));
}

/** NCG = 20 log10 erfcinv(2 BER_out) - 20 log10 erfcinv(2 BER_in) + 10 log10 R (ITU-T G.975.1). */
export function netCodingGainDb(berIn: number, berOut: number, rate: number): number {
  return 20 * Math.log10(erfcinv(2 * berOut)) - 20 * Math.log10(erfcinv(2 * berIn)) + 10 * Math.log10(rate);
}

/** erfcinv(2 BER_in) for a claimed NCG at output BER berOut and rate R (the G.975.1 definition solved). */
function ncgArgument(ncgDb: number, berOut: number, rate: number): number {
  return erfcinv(2 * berOut) * 10 ** ((10 * Math.log10(rate) - ncgDb) / 20);
}

/** The raw BER a claimed NCG implies at output BER berOut and rate R (the G.975.1 definition solved for BER_in). */
export function rawBerForNcg(ncgDb: number, berOut: number, rate: number): number {
  return 0.5 * erfc(ncgArgument(ncgDb, berOut, rate));
}

/** ln of that raw BER, ln Q(sqrt(2) x), finite where the BER itself underflows. */
export function logRawBerForNcg(ncgDb: number, berOut: number, rate: number): number {
  return logQ(Math.SQRT2 * ncgArgument(ncgDb, berOut, rate));
}

/**
 * Es/N0 (dB) of hard-decision BPSK at the raw BER a claimed NCG implies: Qinv(BER_in)^2 / 2 with
 * Qinv(BER_in) = sqrt(2) erfcinv(2 BER_in), so Es/N0 = erfcinv(2 BER_in)^2, taken straight from the
 * NCG so that it stays finite where the raw BER itself underflows to 0.
 */
export function esn0ForNcg(ncgDb: number, berOut: number, rate: number): number {
  return 20 * Math.log10(ncgArgument(ncgDb, berOut, rate));
}

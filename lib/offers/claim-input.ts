// Maps an offer's code and one claim, at one operating point of its tender, to the engine's claim input.
import { channelAt, type ClaimInput, type ClaimResult } from "@/lib/bounds";

import type { ChannelModel } from "@/lib/bounds/vocabulary";
export type { ChannelModel };
export type ClaimMetric = "bler" | "ber" | "ncg";

/** The code as an offer states it: n and k, or a rate, or an overhead (n may accompany either). */
export interface OfferCode {
  decision?: "hard" | "soft";
  n?: number | null;
  k?: number | null;
  rate?: number | null;
  overhead?: number | null;
}

export interface OfferClaim {
  metric: ClaimMetric;
  /** A BER or BLER, or the net coding gain in dB for "ncg". */
  value: number;
  /** For "ncg": the output BER at which the gain is stated. */
  ncgOutputBer?: number | null;
}

const given = (value: number | null | undefined): value is number => value !== null && value !== undefined;

/** The engine's code object: exactly the forms the offer gave, nothing invented. */
export function engineCode(code: OfferCode): ClaimInput["code"] {
  const out: ClaimInput["code"] = {};
  if (given(code.n)) out.n = code.n;
  if (given(code.k)) out.k = code.k;
  else if (given(code.rate)) out.rate = code.rate;
  else if (given(code.overhead)) out.overhead = code.overhead;
  return out;
}

/**
 * bsc -> p, bec -> e, biawgn -> Eb/N0 in dB, taken from the operating point. A net coding gain
 * claim names its own channel (the raw BER the gain implies at its output BER), so the engine
 * gets the gain and the output BER instead of the point's value.
 */
export function claimInputFor(model: ChannelModel, pointValue: number, code: OfferCode, claim: OfferClaim): ClaimInput {
  const engine = engineCode(code);
  if (claim.metric === "ncg") {
    if (model === "bec") throw new RangeError("A net coding gain is not stated for an erasure channel.");
    return {
      channel: { model, ncgDb: claim.value },
      code: engine,
      target: { metric: "ber", value: claim.ncgOutputBer ?? Number.NaN },
    };
  }
  return { channel: channelAt(model, pointValue), code: engine, target: { metric: claim.metric, value: claim.value } };
}

/**
 * The finding an engineer reads first: the first violation, else the first gap, else the last
 * supporting finding (the engine lists capacity, then converse, then achievability, so for a
 * plausible claim that is the bound that guarantees it).
 */
export function keyFinding(result: Pick<ClaimResult, "findings">): ClaimResult["findings"][number] | null {
  const { findings } = result;
  return (
    findings.find((f) => f.severity === "violation") ??
    findings.find((f) => f.severity === "gap") ??
    findings.filter((f) => f.severity === "support").at(-1) ??
    findings[0] ??
    null
  );
}

/** The code's rate whichever way it was stated, or null when nothing was. */
export function codeRate(code: OfferCode): number | null {
  if (given(code.n) && given(code.k) && code.n > 0) return code.k / code.n;
  if (given(code.rate)) return code.rate;
  if (given(code.overhead)) return 1 / (1 + code.overhead);
  return null;
}

// One pure function per scoring criterion, each on a 0..100 scale, each with its formula.
import type { PriceBreak, ScoringClaim, ScoringTender } from "./types";

export const clamp = (x: number, lo = 0, hi = 1) => Math.min(hi, Math.max(lo, x));

/**
 * The scale of the technical margins: a rate gap of RATE_GAP_FULL (25 % of the normal
 * approximation's rate) or a channel margin of one decade (ratio 10) or CHANNEL_DB_FULL dB
 * earns full marks on that part; the same margin the other way earns nothing; no margin is 50 %.
 */
export const RATE_GAP_FULL = 0.25;
export const CHANNEL_DB_FULL = 3;
/** What each verdict lets a point keep of its margin score. */
export const VERDICT_FACTOR = { plausible: 1, "needs-evidence": 0.5, impossible: 0 } as const;

/**
 * The claim's residual error expressed in the tender's metric, as an upper bound:
 * - same metric: the claimed value;
 * - BLER claim, BER required: BER <= BLER, so the claimed BLER bounds the BER;
 * - BER claim, BLER required: BLER <= k * BER (a block error spoils at least one of k bits), so k * BER, capped at 1;
 * - gain claim: its stated output BER, treated as a BER claim.
 * null when the claim cannot be compared (a BER claim without k against a BLER requirement).
 */
export function residualInTargetMetric(claim: Pick<ScoringClaim, "metric" | "value" | "ncgOutputBer" | "k">, target: "bler" | "ber"): number | null {
  const metric = claim.metric === "ncg" ? "ber" : claim.metric;
  const value = claim.metric === "ncg" ? claim.ncgOutputBer : claim.value;
  if (value === null) return null;
  if (metric === target || (metric === "bler" && target === "ber")) return value;
  return claim.k === null ? null : Math.min(1, claim.k * value);
}

/**
 * The technical score of one operating point, 0..100:
 *   0 if there is no claim, if the claim does not meet the required residual error, or if it is impossible;
 *   otherwise 100 * f(verdict) * mean(sRate, sChannel), over the parts the engine could compute
 *   (50 % when it computed neither), where
 *   sRate    = clamp(0.5 + 0.5 * g / RATE_GAP_FULL), g = (normalRate - claimRate) / normalRate,
 *   sChannel = clamp(0.5 + 0.5 * log10(threshold / claimed))            for p or e (ratio),
 *              clamp(0.5 + 0.5 * (threshold - claimed) / CHANNEL_DB_FULL) for Eb/N0 (dB),
 *   f = 1 plausible, 0.5 needs evidence. Larger margins never lower the score (monotone).
 */
export function pointScore(
  claim: ScoringClaim | undefined,
  tender: Pick<ScoringTender, "targetMetric" | "targetValue">,
): { score: number; meets: boolean; note: string } {
  if (!claim) return { score: 0, meets: false, note: "No claim at this point." };
  if (claim.sensitivity && !claim.sensitivity.meets) return { score: 0, meets: false, note: claim.sensitivity.note };
  // A sensitivity claim is held to its point's own PER (checked above), not to the tender-wide residual error.
  const residual = claim.sensitivity ? 0 : residualInTargetMetric(claim, tender.targetMetric);
  if (residual === null) return { score: 0, meets: false, note: "The claim cannot be compared with the required residual error." };
  if (residual > tender.targetValue) return { score: 0, meets: false, note: "Worse than the required residual error." };
  if (claim.verdict === "impossible") return { score: 0, meets: true, note: "Impossible claim." };
  const parts: number[] = [];
  if (claim.rateGapFraction !== null) parts.push(clamp(0.5 + (0.5 * claim.rateGapFraction) / RATE_GAP_FULL));
  if (claim.channelMargin !== null) {
    const x = claim.channelKind === "dB" ? claim.channelMargin / CHANNEL_DB_FULL : claim.channelMargin > 0 ? Math.log10(claim.channelMargin) : -Infinity;
    parts.push(clamp(0.5 + 0.5 * x));
  }
  const margin = parts.length ? parts.reduce((a, b) => a + b, 0) / parts.length : 0.5;
  const factor = VERDICT_FACTOR[claim.verdict];
  return { score: 100 * factor * margin, meets: true, note: claim.verdict === "needs-evidence" ? "Needs evidence: half weight." : "Plausible." };
}

/** Technical score: the mean of the point scores over the tender's operating points (a missing point counts 0). */
export function technicalScore(pointScores: readonly number[]): number {
  return pointScores.length ? pointScores.reduce((a, b) => a + b, 0) / pointScores.length : 0;
}

/** A claim counts against the offer when a lab run contradicted it or an engineer rejected it as impossible. */
export const countsContradicted = (c: Pick<ScoringClaim, "evidence" | "mark">) => c.evidence === "contradicted" || c.mark === "rejected-impossible";
export const countsVerified = (c: Pick<ScoringClaim, "evidence" | "mark">) => c.evidence === "verified" && !countsContradicted(c);

/**
 * Evidence score: 50 + 50 * (verified - contradicted) / claims, clamped to 0..100.
 * Verified: a lab run verified the claim. Contradicted: a lab run contradicted it, or its
 * current mark is "rejected as impossible". An offer with no claims scores 50.
 */
export function evidenceScore(claims: readonly Pick<ScoringClaim, "evidence" | "mark">[]): { score: number; verified: number; contradicted: number } {
  const verified = claims.filter(countsVerified).length;
  const contradicted = claims.filter(countsContradicted).length;
  const score = claims.length ? 100 * clamp(0.5 + (0.5 * (verified - contradicted)) / claims.length) : 50;
  return { score, verified, contradicted };
}

/** The unit price at a quantity: that of the largest break with minQuantity <= quantity, else the base unit price. */
export function unitPriceAt(unitPrice: number, priceBreaks: readonly PriceBreak[], quantity: number): number {
  let best: PriceBreak | null = null;
  for (const b of priceBreaks) if (b.minQuantity <= quantity && (best === null || b.minQuantity > best.minQuantity)) best = b;
  return best ? best.unitPrice : unitPrice;
}

/** Total price at a quantity, in whole cents so that it agrees to the cent: round(unit * 100) * quantity / 100. */
export function totalPriceAt(unitPrice: number, priceBreaks: readonly PriceBreak[], quantity: number): number {
  return (Math.round(unitPriceAt(unitPrice, priceBreaks, quantity) * 100) * quantity) / 100;
}

/** Price score: 100 * lowest / offered (a free offer scores 100). */
export function priceScore(offered: number, lowest: number): number {
  return offered <= 0 ? 100 : (100 * Math.max(0, lowest)) / offered;
}

/** Lead-time score: 100 * shortest / offered, in weeks; 0 weeks is best and scores 100. */
export function leadTimeScore(offered: number, shortest: number): number {
  return offered <= 0 ? 100 : (100 * Math.max(0, shortest)) / offered;
}

/** Warranty score: 100 * offered / longest, in months (when nobody offers any warranty, 0 for all). */
export function warrantyScore(offered: number, longest: number): number {
  return longest <= 0 ? 0 : (100 * Math.max(0, offered)) / longest;
}

/** The engine's stored margins, as the technical score reads them. */
interface StoredMargins {
  rateGapFraction?: number | null;
  channelKind?: "ratio" | "dB";
  channel?: { normal?: number | null; capacity?: number | null };
}

/**
 * The two margins scoring uses from a claim's stored engine result: the rate gap to the normal
 * approximation, and the channel margin against the normal approximation's threshold (against
 * capacity when the engine had no n to approximate with).
 */
export function scoringMargins(margins: StoredMargins | null | undefined): Pick<ScoringClaim, "rateGapFraction" | "channelMargin" | "channelKind"> {
  return {
    rateGapFraction: margins?.rateGapFraction ?? null,
    channelMargin: margins?.channel?.normal ?? margins?.channel?.capacity ?? null,
    channelKind: margins?.channelKind ?? "ratio",
  };
}

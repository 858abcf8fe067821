// The score sheet: every offer's criteria, weighted, penalised or disqualified, and ranked.
// Pure, so the server computes it on every read and the what-if panel recomputes it in the browser.
import { clamp, evidenceScore, leadTimeScore, pointScore, priceScore, technicalScore, totalPriceAt, unitPriceAt, warrantyScore } from "./criteria";
import {
  CRITERIA,
  type Criterion,
  type OfferScore,
  type ScoreLine,
  type ScoreSheet,
  type ScoringClaim,
  type ScoringInput,
  type ScoringOffer,
  type ScoringWeights,
} from "./types";
import { formatMoney } from "@/lib/format";
import { acceptedAgainstImpossible } from "@/lib/review/marks";

const units = new Intl.NumberFormat("en-GB");

/** Totals closer than this are a tie and share a rank. */
const TIE = 1e-9;

/**
 * A claim is confirmed impossible when the engine found it impossible and an engineer's current
 * mark rejects it as impossible, or when a lab run contradicted it. One sentence per such claim.
 */
export function confirmedImpossible(claims: readonly ScoringClaim[], pointLabels: readonly string[]): string[] {
  const reasons: string[] = [];
  for (const c of claims) {
    const at = pointLabels[c.pointIndex] ?? `point ${c.pointIndex + 1}`;
    if (c.verdict === "impossible" && c.mark === "rejected-impossible") reasons.push(`Claim at ${at}: impossible, and rejected as impossible by an engineer.`);
    else if (c.evidence === "contradicted") reasons.push(`Claim at ${at}: contradicted by a lab run.`);
  }
  return reasons;
}

/** One flag per claim an engineer accepted although the engine found it impossible. */
export function acceptedImpossibleFlags(claims: readonly ScoringClaim[], pointLabels: readonly string[]): string[] {
  return claims
    .filter(acceptedAgainstImpossible)
    .map(
      (c) => `Accepted although the engine found it impossible (${pointLabels[c.pointIndex] ?? `point ${c.pointIndex + 1}`}): see the engineer's justification`,
    );
}

const comparable = (o: ScoringOffer, currency: string) => o.envelope !== null && o.envelope.currency === currency;

/** The smallest (or largest) of some numbers, or null when there are none. */
const extreme = (values: number[], pick: (...v: number[]) => number) => (values.length ? pick(...values) : null);

/**
 * Builds the sheet. Relative criteria (price, lead time, warranty) compare each offer with the
 * best among offers still in the ranking: not disqualified, envelope readable, in the tender
 * currency. An offer in another currency is flagged "needs conversion" and not scored on price,
 * rather than converted at a guessed rate. `weights` overrides the tender's frozen weights (what-if only).
 */
export function buildScoreSheet(input: ScoringInput, weights: ScoringWeights = input.tender.weights): ScoreSheet {
  const { tender } = input;
  const labels = tender.operatingPoints.map((p) => p.label);
  const weightSum = CRITERIA.reduce((sum, c) => sum + Math.max(0, weights[c]), 0);
  const sealed = input.offers.some((o) => o.envelope === null);

  const confirmed = new Map(input.offers.map((o) => [o.id, confirmedImpossible(o.claims, labels)]));
  const disqualified = (o: ScoringOffer) => tender.impossibleRule === "disqualify" && confirmed.get(o.id)!.length > 0;
  const field = <K extends "leadTimeWeeks" | "warrantyMonths">(key: K) =>
    input.offers.filter((o) => !disqualified(o) && o.envelope !== null).map((o) => o.envelope![key]);
  const price = (o: ScoringOffer) => totalPriceAt(o.envelope!.unitPrice, o.envelope!.priceBreaks, tender.quantity);
  const lowest = extreme(input.offers.filter((o) => !disqualified(o) && comparable(o, tender.currency)).map(price), Math.min);
  const shortest = extreme(field("leadTimeWeeks"), Math.min);
  const longest = extreme(field("warrantyMonths"), Math.max);

  const scored = input.offers.map((offer): OfferScore => {
    const points = tender.operatingPoints.map((point, i) => {
      const claim = offer.claims.find((c) => c.pointIndex === i);
      const s = pointScore(claim, tender);
      return { pointIndex: i, label: point.label, verdict: claim?.verdict ?? null, meetsRequirement: s.meets, score: s.score, note: s.note };
    });
    const technical = technicalScore(points.map((p) => p.score));
    const evidence = evidenceScore(offer.claims);
    const env = offer.envelope;
    const needsConversion = env !== null && env.currency !== tender.currency;
    const total = env && !needsConversion ? price(offer) : null;
    const unit = env ? unitPriceAt(env.unitPrice, env.priceBreaks, tender.quantity) : null;

    const out = disqualified(offer);
    // A disqualified offer is shown with what was measured, but scores nothing: it is out of the ranking.
    const line = (criterion: Criterion, raw: number | null, rawText: string, score: number | null): ScoreLine => {
      const normalised = out || score === null ? null : clamp(score, 0, 100);
      return {
        criterion,
        raw,
        rawText,
        normalised,
        weight: weights[criterion],
        contribution: normalised === null ? null : weightSum > 0 ? (Math.max(0, weights[criterion]) * normalised) / weightSum : 0,
      };
    };
    const sealedText = "Envelope sealed";
    const lines: ScoreLine[] = [
      line("technical", technical, points.map((p) => `${p.label}: ${p.score.toFixed(1)}`).join("; ") || "No operating points", technical),
      line(
        "evidence",
        offer.claims.length ? (evidence.verified - evidence.contradicted) / offer.claims.length : 0,
        `${evidence.verified} verified, ${evidence.contradicted} contradicted of ${offer.claims.length} claims`,
        evidence.score,
      ),
      !env
        ? line("price", null, sealedText, null)
        : needsConversion
          ? line("price", null, `Offered in ${env.currency}: needs conversion to ${tender.currency}`, null)
          : line(
              "price",
              total,
              `${formatMoney(total!, tender.currency)} (${units.format(tender.quantity)} × ${formatMoney(unit!, tender.currency)})`,
              priceScore(total!, lowest ?? total!),
            ),
      !env
        ? line("leadTime", null, sealedText, null)
        : line("leadTime", env.leadTimeWeeks, `${env.leadTimeWeeks} weeks`, leadTimeScore(env.leadTimeWeeks, shortest ?? env.leadTimeWeeks)),
      !env
        ? line("warranty", null, sealedText, null)
        : line("warranty", env.warrantyMonths, `${env.warrantyMonths} months`, warrantyScore(env.warrantyMonths, longest ?? env.warrantyMonths)),
    ];
    const complete = lines.every((l) => l.contribution !== null);
    const subtotal = complete ? lines.reduce((sum, l) => sum + l.contribution!, 0) : null;
    const reasons = confirmed.get(offer.id)!;
    const penalised = tender.impossibleRule === "penalty" && reasons.length > 0;
    const penalty = penalised && subtotal !== null ? Math.min(subtotal, tender.impossiblePenalty) : 0;
    const flags = [
      ...(out ? ["Disqualified: confirmed impossible claim"] : []),
      ...(penalised ? [`Penalty of ${tender.impossiblePenalty} points: confirmed impossible claim`] : []),
      ...(needsConversion ? [`Needs conversion: offered in ${env!.currency}, the tender is in ${tender.currency}`] : []),
      ...acceptedImpossibleFlags(offer.claims, labels),
    ];
    return {
      offerId: offer.id,
      vendorName: offer.vendorName,
      lines,
      points,
      totalPrice: total,
      unitPriceUsed: needsConversion ? null : unit,
      subtotal,
      penalty,
      total: subtotal === null ? null : Math.max(0, subtotal - (penalised ? tender.impossiblePenalty : 0)),
      rank: null,
      confirmedImpossible: reasons,
      disqualified: out,
      needsConversion,
      flags,
    };
  });

  const ranked = sealed ? [] : scored.filter((s) => !s.disqualified && s.total !== null);
  for (const s of ranked) s.rank = 1 + ranked.filter((o) => o.total! > s.total! + TIE).length;
  scored.sort((a, b) => (a.rank ?? Infinity) - (b.rank ?? Infinity) || a.vendorName.localeCompare(b.vendorName));

  return {
    tenderReference: tender.reference,
    quantity: tender.quantity,
    currency: tender.currency,
    weights,
    weightSum,
    rule: tender.impossibleRule,
    penaltyPoints: tender.impossiblePenalty,
    sealed,
    offers: scored,
  };
}

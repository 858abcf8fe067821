// The shapes the commercial evaluation works on. Pure data: the server fills them from the
// database (with only the fields the viewer may read), the Comparison grid recomputes with them.
import type { offers, PriceBreak } from "@/db/schema/offers";
import type { ScoringWeights } from "@/db/schema/tenders";
import type { MarkKind } from "@/db/schema/evaluation";
import type { EvidenceSummary } from "@/lib/review/evidence";
import type { ChannelModel, Verdict } from "@/lib/bounds/vocabulary";

export type { PriceBreak, ScoringWeights };
export type Criterion = keyof ScoringWeights;
export const CRITERIA: readonly Criterion[] = ["technical", "evidence", "price", "leadTime", "warranty"];
export const CRITERION_LABELS: Record<Criterion, string> = {
  technical: "Technical",
  evidence: "Evidence",
  price: "Price",
  leadTime: "Lead time",
  warranty: "Warranty",
};

export interface ScoringTender {
  reference: string;
  channelModel: ChannelModel;
  operatingPoints: { label: string; value: number; sensitivity?: { bitRate: number; payloadBits: number; targetPer: number } | null }[];
  targetMetric: "bler" | "ber";
  targetValue: number;
  quantity: number;
  currency: string;
  weights: ScoringWeights;
  impossibleRule: "disqualify" | "penalty";
  impossiblePenalty: number;
}

/** One claim, reduced to what scoring reads from the engine's stored result and the review. */
export interface ScoringClaim {
  id: string;
  pointIndex: number;
  metric: "bler" | "ber" | "ncg";
  value: number;
  ncgOutputBer: number | null;
  verdict: Verdict;
  /** Information bits per frame, when the vendor gave n and k. */
  k: number | null;
  /** (normal-approximation rate - claimed rate) / normal-approximation rate; null without n. */
  rateGapFraction: number | null;
  /** Threshold over claimed (ratio: p, e) or threshold minus claimed (dB: Eb/N0). */
  channelMargin: number | null;
  channelKind: "ratio" | "dB";
  /** A sensitivity claim (point stated in dBm): its worst point's margin and whether it meets the required level. */
  sensitivity?: { marginDb: number | null; meets: boolean; note: string; place: string } | null;
  /** The current (latest) mark, if any. */
  mark: MarkKind | null;
  evidence: EvidenceSummary;
}

/** The sealed envelope; absent while the viewer may not read it. */
export interface Envelope {
  unitPrice: number;
  currency: string;
  leadTimeWeeks: number;
  warrantyMonths: number;
  priceBreaks: PriceBreak[];
}

/** The offer's own fields as stored, with its vendor's name and the envelope as the viewer may read it. */
export interface ScoringOffer extends Pick<
  typeof offers.$inferSelect,
  "id" | "vendorOrgId" | "moduleName" | "partNumber" | "codeFamily" | "decision" | "n" | "k" | "rate"
> {
  vendorName: string;
  envelope: Envelope | null;
  claims: ScoringClaim[];
}

export interface ScoringInput {
  tender: ScoringTender;
  offers: ScoringOffer[];
}

/** One criterion of one offer, explained: what was measured, its 0..100 score, and its share of the total. */
export interface ScoreLine {
  criterion: Criterion;
  /** The measured value (price in the tender currency, weeks, months, or the criterion's own number). */
  raw: number | null;
  /** The raw value in words, with its unit. */
  rawText: string;
  /** 0..100, or null when it cannot be scored (sealed envelope, currency needing conversion). */
  normalised: number | null;
  weight: number;
  /** weight * normalised / sum of weights: points of the total. */
  contribution: number | null;
}

export interface PointScore {
  pointIndex: number;
  label: string;
  verdict: ScoringClaim["verdict"] | null;
  meetsRequirement: boolean;
  score: number;
  note: string;
}

export interface OfferScore {
  offerId: string;
  vendorName: string;
  lines: ScoreLine[];
  points: PointScore[];
  /** Total price at the tender quantity, with the unit price used; null while sealed or in another currency. */
  totalPrice: number | null;
  unitPriceUsed: number | null;
  subtotal: number | null;
  penalty: number;
  total: number | null;
  rank: number | null;
  /** Why the offer has a confirmed impossible claim, one sentence per claim; empty if none. */
  confirmedImpossible: string[];
  disqualified: boolean;
  needsConversion: boolean;
  flags: string[];
}

export interface ScoreSheet {
  tenderReference: string;
  quantity: number;
  currency: string;
  weights: ScoringWeights;
  weightSum: number;
  rule: "disqualify" | "penalty";
  penaltyPoints: number;
  /** True while the envelopes are sealed to this viewer: commercial criteria, totals and ranks are withheld. */
  sealed: boolean;
  offers: OfferScore[];
}

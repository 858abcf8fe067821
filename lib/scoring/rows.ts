// One Comparison-grid row per offer, from the scoring input and its sheet (pure, used in the browser).
import { formatMarginDb } from "@/lib/offers/radio";
import { formatSci } from "@/lib/format";
import { summariseEvidence } from "@/lib/review/evidence";
import { CRITERIA, type Criterion, type ScoreSheet, type ScoringClaim, type ScoringInput } from "./types";

export interface PointCell {
  verdict: ScoringClaim["verdict"] | null;
  /** The channel margin in words: "×2.4" (threshold over claimed) or "+1.3 dB". */
  margin: string;
  score: number;
}

export interface ComparisonRow {
  offerId: string;
  vendorName: string;
  moduleName: string;
  partNumber: string;
  codeFamily: string;
  n: number | null;
  k: number | null;
  rate: number | null;
  points: PointCell[];
  evidence: string;
  totalPrice: number | null;
  unitPrice: number | null;
  leadTimeWeeks: number | null;
  warrantyMonths: number | null;
  scores: Record<Criterion, number | null>;
  total: number | null;
  rank: number | null;
  status: string;
}

export function formatMargin(claim: ScoringClaim | undefined): string {
  if (claim?.sensitivity)
    return claim.sensitivity.marginDb === null ? "–" : `${formatMarginDb(claim.sensitivity.marginDb)} (worst: ${claim.sensitivity.place})`;
  if (!claim || claim.channelMargin === null) return "–";
  if (claim.channelKind === "dB") return `${claim.channelMargin >= 0 ? "+" : ""}${claim.channelMargin.toFixed(2)} dB`;
  return `×${formatSci(claim.channelMargin, 2)}`;
}

/** One word for an offer's lab evidence: any contradiction wins, then full or partial verification. */
export function evidenceWord(claims: readonly ScoringClaim[]): string {
  const overall = summariseEvidence(claims.flatMap((c) => (c.evidence === "none" ? [] : [c.evidence])));
  if (overall === "verified" && claims.some((c) => c.evidence !== "verified")) return "Partly verified";
  return { none: "No lab run", verified: "Verified", contradicted: "Contradicted", inconclusive: "Inconclusive" }[overall];
}

export function comparisonRows(input: ScoringInput, sheet: ScoreSheet): ComparisonRow[] {
  const offers = new Map(input.offers.map((o) => [o.id, o]));
  return sheet.offers.map((s) => {
    const o = offers.get(s.offerId)!;
    const scores = Object.fromEntries(CRITERIA.map((c) => [c, s.lines.find((l) => l.criterion === c)?.normalised ?? null])) as Record<Criterion, number | null>;
    return {
      offerId: o.id,
      vendorName: o.vendorName,
      moduleName: o.moduleName,
      partNumber: o.partNumber,
      codeFamily: o.codeFamily,
      n: o.n,
      k: o.k,
      rate: o.rate,
      points: s.points.map((p) => {
        const claim = o.claims.find((c) => c.pointIndex === p.pointIndex);
        return { verdict: p.verdict, margin: formatMargin(claim), score: p.score };
      }),
      evidence: evidenceWord(o.claims),
      totalPrice: s.totalPrice,
      unitPrice: s.unitPriceUsed,
      leadTimeWeeks: o.envelope?.leadTimeWeeks ?? null,
      warrantyMonths: o.envelope?.warrantyMonths ?? null,
      scores,
      total: s.total,
      rank: s.rank,
      status: s.flags.join("; ") || (sheet.sealed ? "Envelope sealed" : "In the ranking"),
    };
  });
}

/**
 * A Comparison cell as the CSV file carries it: numbers as plain numbers (a point for decimals, no
 * currency sign or thousands separator, rounded to 4 decimals), an empty cell for no value, text as text.
 */
export function csvCell(value: unknown): string {
  if (value === null || value === undefined) return "";
  if (typeof value === "number") return Number.isFinite(value) ? String(Math.round(value * 1e4) / 1e4) : "";
  return String(value);
}

import type { OfferScore } from "@/lib/scoring/types";

/** What the memo, the Sign-off tab and the notices read of one offer in the score-sheet snapshot. */
export interface Standing {
  offerId: string;
  vendorName: string;
  total: number | null;
  rank: number | null;
  disqualified: boolean;
  flags: string[];
  /** Each criterion's 0..100 score and weight: never a price. */
  criteria: { criterion: string; score: number | null; weight: number }[];
}

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);
const num = (v: unknown) => (typeof v === "number" && Number.isFinite(v) ? v : null);

/**
 * The standings in a recommendation's score-sheet snapshot (lib/scoring's ScoreSheet, stored as
 * jsonb). Read defensively: a snapshot from an older shape yields what it can, never a throw.
 */
export function standingsOf(snapshot: unknown): Standing[] {
  if (!isRecord(snapshot) || !Array.isArray(snapshot.offers)) return [];
  return snapshot.offers.filter(isRecord).map((raw) => {
    const o = raw as Partial<OfferScore>;
    return {
      offerId: String(o.offerId ?? ""),
      vendorName: String(o.vendorName ?? "Unnamed vendor"),
      total: num(o.total),
      rank: num(o.rank),
      disqualified: o.disqualified === true,
      flags: Array.isArray(o.flags) ? o.flags.map(String) : [],
      criteria: (Array.isArray(o.lines) ? o.lines : []).filter(isRecord).map((l) => ({
        criterion: String(l.criterion ?? ""),
        score: num(l.normalised),
        weight: num(l.weight) ?? 0,
      })),
    };
  });
}

/** How many offers the ranking holds (ranked ones only). */
export const rankedCount = (standings: readonly Standing[]) => standings.filter((s) => s.rank !== null).length;

export const formatScore = (score: number | null) => (score === null ? "–" : score.toFixed(1));

// What the award and regret notices disclose, and the standstill period before the award is final. Pure.
import type { NoticeDisclosure } from "@/db/schema";

const DAY_MS = 86_400_000;

export const DISCLOSURE_WORDS: Record<NoticeDisclosure, string> = {
  rank: "Each vendor's own rank and the winner's name (recommended)",
  "rank-and-scores": "Also each vendor's own scores by criterion and the winner's total score",
};

/** What the form tells the buyer before they choose to disclose scores. */
export const SCORES_REVEAL =
  "Scores reveal more than they seem: the price score is 100 × lowest price ÷ own price, so a vendor that knows its own price can compute the winning price from its own price score.";

/** When the standstill period ends: the award's time plus the tender's days. */
export const standstillEnd = (awardedAt: Date, days: number) => new Date(awardedAt.getTime() + days * DAY_MS);

interface AwardState {
  state: string;
  awardedAt: Date | null;
  standstillDays: number;
}

/** Whether the award is final (awarded, and the standstill period is over). */
export const awardIsFinal = (t: AwardState, now: Date) => t.state === "awarded" && t.awardedAt !== null && now >= standstillEnd(t.awardedAt, t.standstillDays);

/**
 * Whether an objection still waits for the buying team: not answered, and the standstill period
 * of the award it objects to has not ended.
 */
export const objectionWaits = (o: { answeredAt: Date | null }, t: AwardState, now: Date): boolean =>
  o.answeredAt === null && t.state === "awarded" && t.awardedAt !== null && now < standstillEnd(t.awardedAt, t.standstillDays);

/** Why an objection cannot be lodged now, in words, or null. */
export function objectionProblem(t: AwardState, now: Date): string | null {
  if (t.state !== "awarded" || t.awardedAt === null) return "Objections are lodged against an award: this tender has not been awarded.";
  if (now >= standstillEnd(t.awardedAt, t.standstillDays)) {
    return `The standstill period of ${t.standstillDays} days has ended and the award is final: no objection can be lodged now.`;
  }
  return null;
}

import type { MarkKind } from "@/db/schema/evaluation";
import type { Verdict } from "@/db/schema/offers";

/** Every mark but a plain acceptance must say why: the vendor and the ledger read it. */
export const commentRequired = (mark: MarkKind): boolean => mark !== "accepted";

/** The marks that settle a claim; a request for evidence or clarification leaves it open. */
export const FINAL_MARKS: readonly MarkKind[] = ["accepted", "rejected-impossible"];
export const isFinalMark = (mark: MarkKind): boolean => FINAL_MARKS.includes(mark);

/** The shortest written justification for accepting a claim the engine proved impossible. */
export const JUSTIFICATION_MIN = 40;

/** An acceptance that overrides the engine's "impossible": shown as a flag wherever the claim is. */
export const acceptedAgainstImpossible = (c: { verdict: Verdict; mark: MarkKind | null }): boolean => c.verdict === "impossible" && c.mark === "accepted";

/** Why this mark may not be recorded on a claim with this verdict, or null. */
export function markProblem(mark: MarkKind, comment: string, verdict: Verdict): string | null {
  if (acceptedAgainstImpossible({ verdict, mark }) && comment.trim().length < JUSTIFICATION_MIN) {
    return `The engine found this claim impossible: to accept it anyway, write a justification of at least ${JUSTIFICATION_MIN} characters (what evidence outweighs the bound). It will be flagged on the Comparison, the Sign-off tab and the memo.`;
  }
  return null;
}

interface MarkLike {
  claimId: string;
  markedAt: Date | string;
}

/** A claim's current mark is its latest one; marks are never edited or deleted. */
export function latestMarks<M extends MarkLike>(marks: readonly M[]): Map<string, M> {
  const latest = new Map<string, M>();
  for (const mark of marks) {
    const held = latest.get(mark.claimId);
    if (!held || new Date(mark.markedAt).getTime() >= new Date(held.markedAt).getTime()) latest.set(mark.claimId, mark);
  }
  return latest;
}

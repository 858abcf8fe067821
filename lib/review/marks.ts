import type { MarkKind } from "@/db/schema/evaluation";

/** Every mark but a plain acceptance must say why: the vendor and the ledger read it. */
export const commentRequired = (mark: MarkKind): boolean => mark !== "accepted";

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

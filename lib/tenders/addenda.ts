// Addenda: answers that matter to every bidder, and the acknowledgement each vendor owes before submitting. Pure.

/** States in which an addendum may be published: while offers are made, and during technical evaluation. */
export const ADDENDUM_STATES = ["open", "technical"] as const;

export function publishProblem(state: string): string | null {
  return (ADDENDUM_STATES as readonly string[]).includes(state)
    ? null
    : "Addenda are published while the tender is open or in technical evaluation; this tender is past that.";
}

/** Addenda in the order published, numbered from 1 as vendors read them. */
export function numbered<A extends { publishedAt: Date }>(rows: A[]): (A & { number: number })[] {
  return [...rows].sort((a, b) => a.publishedAt.getTime() - b.publishedAt.getTime()).map((row, i) => ({ ...row, number: i + 1 }));
}

/** Why a vendor may not submit yet: addenda it has not acknowledged, named; or null. */
export function unacknowledgedProblem(pending: { number: number; title: string }[]): string | null {
  if (pending.length === 0) return null;
  const names = pending.map((a) => `addendum ${a.number} "${a.title}"`).join(", ");
  return `Acknowledge ${names} on the tender's Notices tab before you submit: the offer must take ${pending.length === 1 ? "it" : "them"} into account.`;
}

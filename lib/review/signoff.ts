import type { TenderState } from "@/policies/vocabulary";

export interface SignoffCheck {
  ok: boolean;
  /** Claims of current offers with no mark yet. */
  unmarked: number;
  total: number;
  /** Why the evaluation cannot be signed, in words; null when it can. */
  reason: string | null;
  /** The HTTP status that reason maps to: 409 for a wrong state or unfinished review. */
  status: 409 | null;
}

/** Only offers still standing are evaluated: superseded versions and withdrawn offers stay on record. */
export const isCurrentOffer = (offer: { status: string }) => offer.status === "submitted";

/**
 * Whether the technical evaluation can be signed: the tender is in technical evaluation, not yet
 * signed, and every claim of every current offer has a mark.
 */
export function checkSignoff(input: {
  tenderState: TenderState;
  alreadySigned: boolean;
  claimIds: readonly string[];
  markedClaimIds: ReadonlySet<string>;
}): SignoffCheck {
  const total = input.claimIds.length;
  const unmarked = input.claimIds.filter((id) => !input.markedClaimIds.has(id)).length;
  const refuse = (reason: string): SignoffCheck => ({ ok: false, unmarked, total, reason, status: 409 });
  if (input.alreadySigned) return refuse("The technical evaluation of this tender is already signed.");
  if (input.tenderState !== "technical") return refuse("Only a tender in technical evaluation can be signed off.");
  if (unmarked > 0) {
    return refuse(`${unmarked} of ${total} ${total === 1 ? "claim is" : "claims are"} not marked yet: mark every claim before signing.`);
  }
  return { ok: true, unmarked, total, reason: null, status: null };
}

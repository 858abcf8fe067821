import type { TenderState } from "@/policies/vocabulary";
import type { MarkKind } from "@/db/schema/evaluation";
import type { EvidenceSummary } from "./labels";
import { isFinalMark } from "./marks";

export interface SignoffClaim {
  id: string;
  /** The current (latest) mark, null when unmarked. */
  mark: MarkKind | null;
  /** The claim's lab evidence, counting only runs that count. */
  evidence: EvidenceSummary;
}

export interface SignoffCheck {
  ok: boolean;
  total: number;
  /** Claims with a final mark: accepted or rejected as impossible. */
  final: number;
  /** Questions to vendors that are neither answered nor closed with a reason. */
  openThreads: number;
  /** Accepted claims with no verifying lab run (counted on safety-relevant tenders only). */
  unverified: number;
  signaturesNeeded: number;
  signaturesGiven: number;
  /** Why the evaluation cannot be signed (now, by this person), in words; null when it can. */
  reason: string | null;
  /** The HTTP status that reason maps to: 409 for a wrong state or an unfinished review. */
  status: 409 | null;
}

/** Only offers still standing are evaluated: superseded versions and withdrawn offers stay on record. */
export const isCurrentOffer = (offer: { status: string }) => offer.status === "submitted";

/** A safety-relevant tender needs two distinct engineers' signatures; any other, one. */
export const signaturesNeeded = (safetyRelevant: boolean) => (safetyRelevant ? 2 : 1);

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/**
 * Whether the technical evaluation can be signed (by this signer): the tender is in technical
 * evaluation and not fully signed; every claim of every current offer has a final mark (accepted
 * or rejected as impossible); every question to a vendor is answered or closed with a reason; on
 * a safety-relevant tender every accepted claim has a lab run that verifies it, and the second
 * signature comes from another engineer than the first.
 */
export function checkSignoff(input: {
  tenderState: TenderState;
  safetyRelevant: boolean;
  /** Who has signed already (user ids). */
  signedBy: readonly string[];
  /** Who would sign now, if known. */
  signerId?: string;
  claims: readonly SignoffClaim[];
  openThreads: number;
}): SignoffCheck {
  const total = input.claims.length;
  const final = input.claims.filter((c) => c.mark !== null && isFinalMark(c.mark)).length;
  const unverified = input.safetyRelevant ? input.claims.filter((c) => c.mark === "accepted" && c.evidence !== "verified").length : 0;
  const needed = signaturesNeeded(input.safetyRelevant);
  const given = input.signedBy.length;
  const facts = { total, final, openThreads: input.openThreads, unverified, signaturesNeeded: needed, signaturesGiven: given };
  const refuse = (reason: string): SignoffCheck => ({ ok: false, ...facts, reason, status: 409 });
  if (given >= needed) return refuse("The technical evaluation of this tender is already signed.");
  if (input.tenderState !== "technical") return refuse("Only a tender in technical evaluation can be signed off.");
  if (input.signerId && input.signedBy.includes(input.signerId)) {
    return refuse("You have already signed: this safety-relevant tender needs a second engineer's signature.");
  }
  const reasons: string[] = [];
  if (final < total) {
    reasons.push(
      `${plural(total - final, "claim has", "claims have")} no final mark yet: accept each claim or reject it as impossible (a request for evidence or clarification is not final).`,
    );
  }
  if (input.openThreads > 0) {
    reasons.push(
      `${plural(input.openThreads, "question to a vendor is", "questions to vendors are")} neither answered nor closed: wait for the answer or close the question with a reason.`,
    );
  }
  if (unverified > 0) {
    reasons.push(
      `This tender is safety-relevant: ${plural(unverified, "accepted claim has", "accepted claims have")} no lab run that verifies it. Record a verifying run at the claim's channel or a harsher one.`,
    );
  }
  if (reasons.length > 0) return refuse(reasons.join(" "));
  return { ok: true, ...facts, reason: null, status: null };
}

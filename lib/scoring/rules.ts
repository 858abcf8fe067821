// The commercial evaluation's workflow checks, in words for the buyer. Each answers null when
// the step may go ahead; a sentence means 409 (the tender is not in the right state for it).
import type { TenderState } from "@/policies/vocabulary";
import { moveProblem, STATE_NAMES } from "@/lib/tenders/states";
import type { OfferScore } from "./types";

interface CommercialFacts {
  state: TenderState;
  technicalSignedAt: Date | string | null;
  envelopesOpenedAt: Date | string | null;
}

/** Envelopes open once, only after the technical evaluation is signed and the tender is in commercial evaluation. */
export function envelopeOpeningProblem(t: CommercialFacts): string | null {
  if (t.envelopesOpenedAt) return "The envelopes of this tender are already open.";
  if (!t.technicalSignedAt) return "The envelopes stay sealed until an engineer signs the technical evaluation.";
  if (t.state !== "commercial") return `The tender is ${STATE_NAMES[t.state]}: envelopes open only in commercial evaluation.`;
  return null;
}

/** Offers are compared once the tender has closed; before that there is nothing final to compare. */
export function comparisonProblem(state: TenderState): string | null {
  return state === "draft" || state === "open" ? `The tender is ${STATE_NAMES[state]}: offers are compared after it closes.` : null;
}

/** A recommendation needs the tender in commercial evaluation with its envelopes open, and an offer that may win. */
export function recommendationProblem(t: CommercialFacts, offer: OfferScore | undefined): string | null {
  const moving = moveProblem(t.state, "approval");
  if (moving) return moving;
  if (!t.envelopesOpenedAt) return "Open the envelopes before recommending an award.";
  if (!offer) return null; // an unknown offer is bad input, reported by the caller
  if (offer.disqualified) return `${offer.vendorName} is disqualified by a confirmed impossible claim and cannot be recommended.`;
  if (offer.needsConversion) return `${offer.vendorName} offered in another currency: it needs conversion before it can be recommended.`;
  return null;
}

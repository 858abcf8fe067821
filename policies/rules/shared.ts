import type { Actor } from "../actor";
import type { RuleBuilder } from "../types";
import { ENVELOPE_FIELDS, SEALED_STATES } from "../vocabulary";

/** Reading a record also lets one see it in a list or a queue. */
export const READ = ["read", "list"] as const;
export const envelopeFields = (): string[] => [...ENVELOPE_FIELDS];

/** Every active signed-in person: the public memo check, the bound explorer, their own record. */
export function everyoneRules({ can }: RuleBuilder, actor: Actor): void {
  can("verify", "MemoCheck");
  can("use", "Bounds");
  can("read", "User", { id: actor.id });
  can("read", "Organisation", { id: actor.organisationId });
}

/** Signed out: only the public memo check. */
export function signedOutRules({ can }: RuleBuilder): void {
  can("verify", "MemoCheck");
}

/** Engineers and approvers declare on a tender before they see its offers. */
export function declarationRules({ can }: RuleBuilder, actor: Actor): void {
  can("declare", "Tender", { state: { $ne: "draft" } });
  can("create", "Declaration", { userId: actor.id });
  can([...READ], "Declaration", { userId: actor.id });
}

/**
 * No internal role reads a sealed envelope embedded in an offer before the buyer opens the
 * tender's envelopes (which happens only after the technical sign-off).
 */
export function sealedUntilOpened({ cannot }: RuleBuilder): void {
  cannot([...READ], "Offer", envelopeFields(), { envelopeOpened: { $ne: true } }).because(
    "Commercial envelopes stay sealed until the buyer opens them after the technical sign-off",
  );
}

/** The records that make up a vendor's offer within one tender. */
export const OFFER_RECORDS = ["Offer", "Envelope", "Claim", "Document", "Mark", "Thread", "EvidenceRun"] as const;

/**
 * Until the tender closes, the buying side (every internal role) reaches no part of any offer,
 * technical or commercial. Built after every role so that no grant lifts it.
 */
export function sealedUntilClosing({ cannot }: RuleBuilder): void {
  cannot("manage", [...OFFER_RECORDS], { tenderState: { $in: [...SEALED_STATES] } }).because("Offers stay sealed to the buying side until the tender closes");
}

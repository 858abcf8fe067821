/**
 * The words of the permission table: who, what they do, and to what.
 * Every list is one exported constant so that the tests can walk all of it.
 */

export const ROLES = ["admin", "buyer", "engineer", "approver", "vendor"] as const;
export type Role = (typeof ROLES)[number];

/** The two sides of a tender: the buying organisation and the vendors it invites. */
export const ORGANISATION_KINDS = ["buyer", "vendor"] as const;
export type OrganisationKind = (typeof ORGANISATION_KINDS)[number];

export const ACTIONS = [
  "manage", // CASL's wildcard: admin on the people subjects only
  "read",
  "list",
  "create",
  "update",
  "delete",
  "open", // a tender: draft -> open
  "cancel",
  "submit",
  "withdraw",
  "declare", // conflict of interest, on a tender
  "mark", // an engineer's mark on a claim
  "record", // lab error counts
  "post", // a message in a clarification thread
  "sign", // the technical evaluation
  "openEnvelopes",
  "recommend",
  "approve",
  "return",
  "export",
  "verify", // a memo fingerprint
  "acknowledge", // a vendor confirms it has read an addendum
  "assignRoles",
  "deactivate",
  "use", // a tool: the bound explorer, the mailroom
] as const;
export type Action = (typeof ACTIONS)[number];

export const SUBJECTS = [
  "Organisation",
  "User",
  "ApprovalLimit",
  "Ledger",
  "Tender",
  "Offer",
  "Envelope",
  "Claim",
  "Document",
  "Mark",
  "Thread",
  "EvidenceRun",
  "Declaration",
  "TechnicalSignoff",
  "Score",
  "Recommendation",
  "Approval",
  "Memo",
  "MemoCheck",
  "Mailroom",
  "Bounds",
  "Backup",
  "Objection",
  "Addendum",
] as const;
export type SubjectType = (typeof SUBJECTS)[number];

export const TENDER_STATES = ["draft", "open", "technical", "commercial", "approval", "awarded", "cancelled"] as const;
export type TenderState = (typeof TENDER_STATES)[number];

/**
 * The tender state that the records of its offers carry (policies/records.ts): the tender's own
 * state, except that a tender cancelled before its closing time reads as "cancelled-sealed", since
 * its offers were never unsealed.
 */
export const RECORD_TENDER_STATES = [...TENDER_STATES, "cancelled-sealed"] as const;
export type RecordTenderState = (typeof RECORD_TENDER_STATES)[number];

/** States in which offers are sealed to the whole buying side: nothing of them is read before closing, nor ever if cancelled before it. */
export const SEALED_STATES = ["draft", "open", "cancelled-sealed"] as const;

/** What a tender tells the rules about its offers' seal. */
export interface SealFacts {
  state: TenderState;
  /** Set when a tender is cancelled before its closing time. */
  cancelledSealed: boolean;
}

/** The state the records of this tender's offers carry. */
export function recordTenderState(tender: SealFacts): RecordTenderState {
  return tender.state === "cancelled" && tender.cancelledSealed ? "cancelled-sealed" : tender.state;
}

/** Whether this tender's offers are sealed to the buying side. */
export function offersSealed(tender: SealFacts): boolean {
  return (SEALED_STATES as readonly string[]).includes(recordTenderState(tender));
}

/** Whether a tender cancelled now, from this state, keeps its offers sealed for good. */
export const cancelKeepsSeal = (state: TenderState): boolean => (SEALED_STATES as readonly string[]).includes(state);

/** States from which a tender may still be cancelled (anything before the award). */
export const CANCELLABLE_STATES = ["draft", "open", "technical", "commercial", "approval"] as const;

/**
 * The sealed commercial envelope. These names are the fields of the Envelope subject and,
 * when an Offer carries its envelope embedded, of the Offer subject too.
 */
export const ENVELOPE_FIELDS = ["unitPrice", "currency", "leadTimeWeeks", "warrantyMonths", "priceBreaks"] as const;
export type EnvelopeField = (typeof ENVELOPE_FIELDS)[number];

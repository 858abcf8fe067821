// How a ledger entry reads on the Ledger tab: which of its details the viewer may read (the rest is
// masked by the same policies as the records themselves), and a sentence for it. Pure.
import type { RecordTenderState, SubjectRecords, SubjectType } from "@/policies";
import type { LedgerRow } from "./chain";

/** A stored entry, as the chain keeps it. */
export type LedgerEntryIn = Pick<LedgerRow, "seq" | "at" | "actorId" | "actorLabel" | "action" | "subjectType" | "subjectId" | "data" | "hash">;

/** What a guard needs to know about the entry's tender and vendor to build the policy record. */
export interface EntryContext {
  tenderId: string;
  tenderState: RecordTenderState;
  tenderCreatedBy: string;
  envelopeOpened: boolean;
  invitedOrgIds: string[];
  /** The vendor organisation the entry's record belongs to, where it has one. */
  vendorOrgId: string;
}

type Guard = { [S in SubjectType]: { subject: S; record: (e: LedgerEntryIn, c: EntryContext) => SubjectRecords[S] } }[SubjectType];
export type MayRead = <S extends SubjectType>(subject: S, record: SubjectRecords[S]) => boolean;

const vendorPart = (e: LedgerEntryIn, c: EntryContext) => ({ tenderId: c.tenderId, vendorOrgId: c.vendorOrgId, tenderState: c.tenderState });
const numberOr = (value: unknown, fallback: number) => (typeof value === "number" ? value : fallback);

/** Each action's details belong to one record: reading them needs reading that record. */
const GUARDS: Record<string, Guard> = {
  "offer.submitted": { subject: "Offer", record: (e, c) => ({ ...vendorPart(e, c), id: e.subjectId ?? "", envelopeOpened: c.envelopeOpened }) },
  "offer.withdrawn": { subject: "Offer", record: (e, c) => ({ ...vendorPart(e, c), id: e.subjectId ?? "", envelopeOpened: c.envelopeOpened }) },
  "document.uploaded": { subject: "Document", record: (e, c) => ({ ...vendorPart(e, c), id: e.subjectId ?? "", offerId: String(e.data.offerId ?? "") }) },
  "claim.marked": { subject: "Mark", record: (e, c) => ({ ...vendorPart(e, c), claimId: e.subjectId ?? "" }) },
  "evidence.recorded": { subject: "EvidenceRun", record: (e, c) => ({ ...vendorPart(e, c), claimId: String(e.data.claimId ?? "") }) },
  "evidence.imported": { subject: "EvidenceRun", record: (e, c) => ({ ...vendorPart(e, c), claimId: "" }) },
  "thread.opened": { subject: "Thread", record: (e, c) => ({ ...vendorPart(e, c), id: e.subjectId ?? "" }) },
  "thread.message": { subject: "Thread", record: (e, c) => ({ ...vendorPart(e, c), id: e.subjectId ?? "" }) },
  "declaration.made": { subject: "Declaration", record: (e, c) => ({ tenderId: c.tenderId, userId: e.actorId ?? "" }) },
  "tender.technical-signed": { subject: "TechnicalSignoff", record: (_, c) => ({ tenderId: c.tenderId }) },
  "recommendation.submitted": {
    subject: "Recommendation",
    record: (e, c) => ({ tenderId: c.tenderId, preparedBy: e.actorId ?? "", value: numberOr(e.data.value, 0) }),
  },
  "tender.awarded": { subject: "Recommendation", record: (e, c) => ({ tenderId: c.tenderId, preparedBy: "", value: numberOr(e.data.value, 0) }) },
  "approval.given": {
    subject: "Approval",
    record: (e, c) => ({ tenderId: c.tenderId, recommendationPreparedBy: "", value: numberOr(e.data.value, 0), tenderCreatedBy: c.tenderCreatedBy }),
  },
  "recommendation.returned": {
    subject: "Approval",
    record: (_, c) => ({ tenderId: c.tenderId, recommendationPreparedBy: "", value: 0, tenderCreatedBy: c.tenderCreatedBy }),
  },
  "objection.lodged": { subject: "Objection", record: (e, c) => ({ tenderId: c.tenderId, vendorOrgId: c.vendorOrgId }) },
  "objection.answered": { subject: "Objection", record: (e, c) => ({ tenderId: c.tenderId, vendorOrgId: c.vendorOrgId }) },
  "addendum.published": { subject: "Addendum", record: (_, c) => ({ tenderId: c.tenderId, invitedOrgIds: c.invitedOrgIds }) },
  "addendum.acknowledged": { subject: "Addendum", record: (_, c) => ({ tenderId: c.tenderId, invitedOrgIds: c.invitedOrgIds }) },
};

/** Details that say nothing a reader of the tender's ledger may not know (the memo's fingerprint is public). */
const PUBLIC_DETAILS = new Set(["reference", "from", "to", "memo", "sha256", "version"]);

/** The entry's details split into what this viewer reads and the names of what is masked. */
export function readableDetails(entry: LedgerEntryIn, context: EntryContext, mayRead: MayRead): { data: Record<string, unknown>; masked: string[] } {
  const guard = GUARDS[entry.action];
  if (!guard || mayRead(guard.subject, guard.record(entry, context) as never)) return { data: entry.data, masked: [] };
  const data: Record<string, unknown> = {};
  const masked: string[] = [];
  for (const [key, value] of Object.entries(entry.data)) {
    if (PUBLIC_DETAILS.has(key)) data[key] = value;
    else masked.push(key);
  }
  return { data, masked };
}

// Who (%who) did what to which tender (%ref).
const SENTENCES: Record<string, string> = {
  "tender.created": "%who created the draft %ref.",
  "tender.updated": "%who edited the draft %ref.",
  "tender.opened": "%who opened %ref for offers.",
  "tender.closed": "%ref closed for offers at its closing time.",
  "offers.unsealed": "The offers to %ref were unsealed to the buying side at closing.",
  "tender.cancelled": "%who cancelled %ref.",
  "offer.submitted": "%who submitted an offer to %ref.",
  "offer.withdrawn": "%who withdrew an offer to %ref.",
  "document.uploaded": "%who uploaded a document to an offer in %ref.",
  "declaration.made": "%who declared on conflicts of interest in %ref.",
  "claim.marked": "%who marked a claim in %ref.",
  "evidence.recorded": "%who recorded a lab run in %ref.",
  "evidence.imported": "%who imported lab runs in %ref.",
  "thread.opened": "%who asked a vendor a clarification question in %ref.",
  "thread.message": "%who wrote in a clarification thread of %ref.",
  "tender.technical-signed": "%who signed the technical evaluation of %ref.",
  "envelopes.opened": "%who opened the commercial envelopes of %ref.",
  "recommendation.submitted": "%who recommended the award of %ref.",
  "approval.given": "%who approved the award recommendation of %ref.",
  "recommendation.returned": "%who returned the award recommendation of %ref.",
  "tender.awarded": "%ref was awarded on %who's approval.",
  "objection.lodged": "%who objected in writing to the award of %ref.",
  "objection.answered": "%who answered a vendor's objection to the award of %ref.",
  "addendum.published": "%who published an addendum to %ref.",
  "addendum.acknowledged": "%who acknowledged an addendum to %ref.",
};

/** What a cancellation did to the offers' seal (entries written before it was recorded say nothing). */
function cancelledSentence(data: Record<string, unknown>): string {
  if (data.offersSealed === true) return "%who cancelled %ref before its closing time; its offers stay sealed to the buying side.";
  if (data.offersSealed === false) return "%who cancelled %ref after its closing time; its offers stay as unsealed at closing.";
  return SENTENCES["tender.cancelled"];
}

/** "Ines Calloway opened RC-2027-001 for offers.": who did what to which tender. */
export function ledgerSentence(entry: Pick<LedgerEntryIn, "actorLabel" | "action"> & { data?: Record<string, unknown> }, reference: string): string {
  const who = entry.actorLabel === "system" ? "Ratecourt" : entry.actorLabel;
  const template =
    entry.action === "tender.cancelled" ? cancelledSentence(entry.data ?? {}) : (SENTENCES[entry.action] ?? `%who recorded "${entry.action}" on %ref.`);
  return template.replace("%who", who).replace("%ref", reference);
}

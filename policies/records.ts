import type { EnvelopeField, OrganisationKind, RecordTenderState, SubjectType, TenderState } from "./vocabulary";

/**
 * The fields each subject's conditions read. lib/server passes records with at least these
 * fields (more are welcome: they are ignored by the rules and kept or stripped by pickPermitted).
 * A missing field makes a condition fail, so a forgotten field denies rather than allows.
 */
export type EnvelopeValues = { [F in EnvelopeField]?: unknown };

export interface OrganisationRecord {
  id: string;
  kind: OrganisationKind;
}
export interface UserRecord {
  id: string;
  organisationId: string;
}
export type ApprovalLimitRecord = object;
export interface LedgerRecord {
  tenderId: string;
}

export interface TenderRecord {
  id: string;
  state: TenderState;
  createdBy: string;
  invitedOrgIds: string[];
}

/** An offer; when it carries its sealed envelope embedded, the ENVELOPE_FIELDS are guarded. */
export interface OfferRecord extends EnvelopeValues {
  id: string;
  tenderId: string;
  vendorOrgId: string;
  /** The state of the offer's tender: vendors write only while it is "open". */
  tenderState: RecordTenderState;
  /** Whether the buyer has opened this tender's envelopes. */
  envelopeOpened: boolean;
}

export interface EnvelopeRecord extends EnvelopeValues {
  offerId: string;
  tenderId: string;
  vendorOrgId: string;
  opened: boolean;
  tenderState?: RecordTenderState;
}

/**
 * The records of a vendor's offer other than the Offer itself carry their tender's state where it
 * is known: the buying side reads none of them while the tender is draft or open (sealed).
 */
export interface ClaimRecord {
  id: string;
  offerId: string;
  tenderId: string;
  vendorOrgId: string;
  tenderState?: RecordTenderState;
}

export interface DocumentRecord {
  id: string;
  offerId: string;
  tenderId: string;
  vendorOrgId: string;
  /** Needed to upload (create): vendors upload only while the tender is "open". */
  tenderState?: RecordTenderState;
}

export interface MarkRecord {
  claimId: string;
  tenderId: string;
  vendorOrgId: string;
  tenderState?: RecordTenderState;
}
/** A clarification thread between engineers and one vendor; its messages share its access. */
export interface ThreadRecord {
  id: string;
  tenderId: string;
  vendorOrgId: string;
  tenderState?: RecordTenderState;
}
export interface EvidenceRunRecord {
  claimId: string;
  tenderId: string;
  vendorOrgId: string;
  tenderState?: RecordTenderState;
}
export interface DeclarationRecord {
  tenderId: string;
  userId: string;
}
export interface TechnicalSignoffRecord {
  tenderId: string;
}
export interface ScoreRecord {
  tenderId: string;
}
export interface RecommendationRecord {
  tenderId: string;
  preparedBy: string;
  value: number;
}

export interface ApprovalRecord {
  tenderId: string;
  recommendationPreparedBy: string;
  /** The award value, in the tender currency, compared with the approver's limit. */
  value: number;
  tenderCreatedBy: string;
}

export interface MemoRecord {
  tenderId: string;
}
export type MemoCheckRecord = object;
export type MailroomRecord = object;
export type BoundsRecord = object;
export type BackupRecord = object;
/** A vendor's written objection to an award, during the standstill period. */
export interface ObjectionRecord {
  tenderId: string;
  vendorOrgId: string;
}
/** A clarification published to every invited vendor of a tender, without the asker's name. */
export interface AddendumRecord {
  tenderId: string;
  invitedOrgIds: string[];
}

export interface SubjectRecords {
  Organisation: OrganisationRecord;
  User: UserRecord;
  ApprovalLimit: ApprovalLimitRecord;
  Ledger: LedgerRecord;
  Tender: TenderRecord;
  Offer: OfferRecord;
  Envelope: EnvelopeRecord;
  Claim: ClaimRecord;
  Document: DocumentRecord;
  Mark: MarkRecord;
  Thread: ThreadRecord;
  EvidenceRun: EvidenceRunRecord;
  Declaration: DeclarationRecord;
  TechnicalSignoff: TechnicalSignoffRecord;
  Score: ScoreRecord;
  Recommendation: RecommendationRecord;
  Approval: ApprovalRecord;
  Memo: MemoRecord;
  MemoCheck: MemoCheckRecord;
  Mailroom: MailroomRecord;
  Bounds: BoundsRecord;
  Backup: BackupRecord;
  Objection: ObjectionRecord;
  Addendum: AddendumRecord;
}

// Compile-time check that every subject has a record shape and nothing else does.
type Exact<A, B> = [A] extends [B] ? ([B] extends [A] ? true : never) : never;
const subjectsCovered: Exact<keyof SubjectRecords, SubjectType> = true;
void subjectsCovered;

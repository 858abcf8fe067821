// The policy records of an offer and its documents (policies/records.ts), built from stored rows.
import { recordTenderState, type DocumentRecord, type OfferRecord, type RecordTenderState, type SealFacts } from "@/policies";

export interface OfferTenderState extends SealFacts {
  envelopesOpenedAt: Date | null;
}

/** An offer row as the Offer subject: its own fields plus the tender facts the rules read. */
export function offerRecord<R extends { id: string; tenderId: string; vendorOrgId: string }>(row: R, tender: OfferTenderState): R & OfferRecord {
  return { ...row, tenderState: recordTenderState(tender), envelopeOpened: tender.envelopesOpenedAt !== null };
}

export function documentRecord(
  row: { id: string; offerId: string | null; tenderId: string; vendorOrgId: string },
  tenderState?: RecordTenderState,
): DocumentRecord {
  return { id: row.id, offerId: row.offerId ?? "", tenderId: row.tenderId, vendorOrgId: row.vendorOrgId, ...(tenderState ? { tenderState } : {}) };
}

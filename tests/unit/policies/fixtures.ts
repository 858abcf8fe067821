import type { Actor, Role, SubjectRecords, SubjectType } from "@/policies";

export const T1 = "tender-1";
export const T2 = "tender-2";
export const VENDOR_A = "org-vendor-a";
export const VENDOR_B = "org-vendor-b";
export const BUYER_ORG = "org-buyer";
export const SOMEONE = "user-someone-else";
export const LIMIT = 500_000;

/** A signed-in person; engineers and approvers have declared on T1 without any conflict. */
export function actorFor(roles: Role | Role[], over: Partial<Actor> = {}): Actor {
  const list = Array.isArray(roles) ? roles : [roles];
  const vendor = list.includes("vendor");
  const declares = list.includes("engineer") || list.includes("approver");
  return {
    id: `user-${list.join("-")}`,
    organisationId: vendor ? VENDOR_A : BUYER_ORG,
    organisationKind: vendor ? "vendor" : "buyer",
    roles: list,
    active: true,
    approvalLimit: list.includes("approver") ? LIMIT : null,
    declarations: declares ? [{ tenderId: T1, conflictedVendorOrgIds: [] }] : [],
    ...over,
  };
}

const envelope = {
  unitPrice: 41.5,
  currency: "EUR",
  leadTimeWeeks: 8,
  warrantyMonths: 24,
  priceBreaks: [{ quantity: 5000, unitPrice: 39.9 }],
};

type Makers = { [S in SubjectType]: (over?: Partial<SubjectRecords[S]>) => SubjectRecords[S] };

/** Typical records: tender T1, open (its offer records as after closing), vendor A's offer; override what a case is about. */
export const make: Makers = {
  Organisation: (o) => ({ id: VENDOR_A, kind: "vendor", ...o }),
  User: (o) => ({ id: SOMEONE, organisationId: BUYER_ORG, ...o }),
  ApprovalLimit: (o) => ({ upTo: 100_000, signatures: 1, ...o }),
  Ledger: (o) => ({ tenderId: T1, ...o }),
  Tender: (o) => ({
    id: T1,
    state: "open",
    createdBy: "user-buyer",
    invitedOrgIds: [VENDOR_A, VENDOR_B],
    ...o,
  }),
  Offer: (o) => ({
    id: "offer-a",
    tenderId: T1,
    vendorOrgId: VENDOR_A,
    tenderState: "technical",
    envelopeOpened: false,
    module: "SubG-900",
    ...envelope,
    ...o,
  }),
  Envelope: (o) => ({ offerId: "offer-a", tenderId: T1, vendorOrgId: VENDOR_A, opened: true, ...envelope, ...o }),
  Claim: (o) => ({ id: "claim-a", offerId: "offer-a", tenderId: T1, vendorOrgId: VENDOR_A, ...o }),
  Document: (o) => ({ id: "doc-a", offerId: "offer-a", tenderId: T1, vendorOrgId: VENDOR_A, ...o }),
  Mark: (o) => ({ claimId: "claim-a", tenderId: T1, vendorOrgId: VENDOR_A, ...o }),
  Thread: (o) => ({ id: "thread-a", tenderId: T1, vendorOrgId: VENDOR_A, ...o }),
  EvidenceRun: (o) => ({ claimId: "claim-a", tenderId: T1, vendorOrgId: VENDOR_A, ...o }),
  Declaration: (o) => ({ tenderId: T1, userId: SOMEONE, ...o }),
  TechnicalSignoff: (o) => ({ tenderId: T1, ...o }),
  Score: (o) => ({ tenderId: T1, ...o }),
  Recommendation: (o) => ({ tenderId: T1, preparedBy: "user-buyer", value: 120_000, ...o }),
  Approval: (o) => ({
    tenderId: T1,
    recommendationPreparedBy: "user-buyer",
    value: 120_000,
    tenderCreatedBy: "user-buyer",
    ...o,
  }),
  Memo: (o) => ({ tenderId: T1, ...o }),
  MemoCheck: (o) => ({ ...o }),
  Mailroom: (o) => ({ ...o }),
  Objection: (o) => ({ tenderId: T1, vendorOrgId: VENDOR_A, ...o }),
  Addendum: (o) => ({ tenderId: T1, invitedOrgIds: [VENDOR_A, VENDOR_B], ...o }),
  Bounds: (o) => ({ ...o }),
  Backup: (o) => ({ ...o }),
};

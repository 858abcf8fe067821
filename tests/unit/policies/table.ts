/**
 * The expected permission table, as data: for each role, the cells (action x subject) it is
 * allowed, each with records it must reach and records of the same subject it must not
 * (another organisation, another tender, a wrong state). Every cell not listed is denied.
 */
import { ACTIONS, CANCELLABLE_STATES, TENDER_STATES, type Action, type Actor, type Role, type SubjectType } from "@/policies";
import { BUYER_ORG, LIMIT, make, SOMEONE, T2, VENDOR_A, VENDOR_B } from "./fixtures";

type Given = object | ((me: Actor) => object);
export interface Grant {
  allowed: Given[];
  denied: Given[];
}
type Entry = [actions: Action | readonly Action[], subject: SubjectType, allowed: Given[], denied?: Given[]];

const READ = ["read", "list"] as const;
const tendersIn = (states: readonly string[]) => states.map((state) => make.Tender({ state } as never));
const statesBut = (...keep: string[]) => TENDER_STATES.filter((state) => !keep.includes(state));
const own = {
  user: (me: Actor) => make.User({ id: me.id, organisationId: me.organisationId }),
  org: (me: Actor) => make.Organisation({ id: me.organisationId, kind: me.organisationKind }),
};
/**
 * For subjects scoped to one vendor within one tender, as the buying side meets them after closing:
 * both vendors of T1, and T2; and T1's records while the tender is still open (sealed).
 */
const OFFER_PARTS: SubjectType[] = ["Offer", "Envelope", "Claim", "Document", "Mark", "Thread", "EvidenceRun"];
const scoped = (subject: SubjectType) => {
  const maker = make[subject] as (o?: object) => object;
  const closed = { tenderState: "technical" };
  return {
    t1: [maker(closed), maker({ ...closed, vendorOrgId: VENDOR_B })],
    t2: [maker({ ...closed, tenderId: T2 })],
    sealed: OFFER_PARTS.includes(subject) ? [maker({ tenderState: "open" }), maker({ tenderState: "draft" }), maker({ tenderState: "cancelled-sealed" })] : [],
  };
};
const declaredOnT1 = (actions: Action | readonly Action[], subjects: SubjectType[]): Entry[] =>
  subjects.map((subject) => [actions, subject, scoped(subject).t1, [...scoped(subject).t2, ...scoped(subject).sealed]]);

const EVERYONE: Entry[] = [
  ["verify", "MemoCheck", [make.MemoCheck()]],
  ["use", "Bounds", [make.Bounds()]],
  ["read", "User", [own.user], [make.User()]],
  ["read", "Organisation", [own.org], [make.Organisation({ id: "org-elsewhere" })]],
];

const DECLARING: Entry[] = [
  ["declare", "Tender", tendersIn(statesBut("draft")), tendersIn(["draft"])],
  [["create", ...READ], "Declaration", [(me) => make.Declaration({ userId: me.id })], [make.Declaration()]],
];

const TABLE: Record<Role, Entry[]> = {
  admin: [
    [ACTIONS.filter((a) => a !== "delete"), "User", [make.User()]],
    [["assignRoles", "deactivate"], "User", [make.User()], [own.user]],
    [ACTIONS.filter((a) => a !== "delete"), "Organisation", [make.Organisation()]],
    [ACTIONS, "ApprovalLimit", [make.ApprovalLimit()]],
    [READ, "Ledger", [make.Ledger(), make.Ledger({ tenderId: T2 })]],
    ["verify", "Ledger", [make.Ledger()]],
    [READ, "Tender", tendersIn(TENDER_STATES)],
    ["use", "Mailroom", [make.Mailroom()]],
    ["create", "Backup", [make.Backup()]],
  ],

  buyer: [
    [READ, "Tender", tendersIn(TENDER_STATES)],
    [
      "create",
      "Tender",
      [(me) => make.Tender({ state: "draft", createdBy: me.id })],
      [make.Tender({ state: "draft", createdBy: SOMEONE }), (me) => make.Tender({ state: "open", createdBy: me.id })],
    ],
    [["update", "open"], "Tender", tendersIn(["draft"]), tendersIn(statesBut("draft"))],
    ["cancel", "Tender", tendersIn(CANCELLABLE_STATES), tendersIn(["awarded", "cancelled"])],
    [["openEnvelopes", "recommend"], "Tender", tendersIn(["commercial"]), tendersIn(statesBut("commercial"))],
    ...(["Offer", "Claim", "Document", "Mark", "EvidenceRun"] as const).map((subject): Entry => [
      READ,
      subject,
      [...scoped(subject).t1, ...scoped(subject).t2],
      scoped(subject).sealed,
    ]),
    ...(["TechnicalSignoff", "Score", "Recommendation", "Approval", "Ledger", "Memo"] as const).map((subject): Entry => [
      READ,
      subject,
      [make[subject](), make[subject]({ tenderId: T2 })],
    ]),
    [READ, "Declaration", [make.Declaration()]],
    [READ, "ApprovalLimit", [make.ApprovalLimit()]],
    [[...READ, "update"], "Objection", [make.Objection(), make.Objection({ vendorOrgId: VENDOR_B })]],
    [["create", ...READ], "Addendum", [make.Addendum(), make.Addendum({ tenderId: T2 })]],
    [READ, "Envelope", [make.Envelope(), make.Envelope({ vendorOrgId: VENDOR_B })], [make.Envelope({ opened: false }), make.Envelope({ tenderState: "open" })]],
    ["export", "Score", [make.Score()]],
    ["export", "Memo", [make.Memo()]],
    [["create", "update"], "Recommendation", [(me) => make.Recommendation({ preparedBy: me.id })], [make.Recommendation({ preparedBy: SOMEONE })]],
    ["withdraw", "Recommendation", [make.Recommendation(), make.Recommendation({ preparedBy: SOMEONE })]],
    [
      "read",
      "Organisation",
      [own.org, make.Organisation(), make.Organisation({ id: VENDOR_B })],
      [make.Organisation({ id: "org-other-buyer", kind: "buyer" })],
    ],
    ["list", "Organisation", [make.Organisation(), make.Organisation({ id: VENDOR_B })], [make.Organisation({ id: BUYER_ORG, kind: "buyer" })]],
  ],

  engineer: [
    [READ, "Tender", tendersIn(statesBut("draft")), tendersIn(["draft"])],
    ...DECLARING,
    ...declaredOnT1(READ, ["Offer", "Claim", "Document", "Mark", "Thread", "EvidenceRun", "TechnicalSignoff"]),
    ...declaredOnT1("mark", ["Claim"]),
    ...declaredOnT1("record", ["EvidenceRun"]),
    ...declaredOnT1(["create", "post", "update"], ["Thread"]),
    [["create", ...READ], "Addendum", [make.Addendum()], [make.Addendum({ tenderId: T2 })]],
    ["sign", "TechnicalSignoff", [make.TechnicalSignoff()], [make.TechnicalSignoff({ tenderId: T2 })]],
  ],

  approver: [
    [READ, "Tender", tendersIn(TENDER_STATES)],
    [READ, "ApprovalLimit", [make.ApprovalLimit()]],
    ...DECLARING,
    ...declaredOnT1(READ, ["Offer", "Claim", "Document", "Mark", "EvidenceRun"]),
    ...declaredOnT1(READ, ["TechnicalSignoff", "Score", "Recommendation", "Approval", "Memo", "Ledger"]),
    ...declaredOnT1("export", ["Memo"]),
    [READ, "Envelope", [make.Envelope(), make.Envelope({ vendorOrgId: VENDOR_B })], [make.Envelope({ opened: false }), make.Envelope({ tenderId: T2 })]],
    [
      ["approve", "return"],
      "Approval",
      [make.Approval(), make.Approval({ value: LIMIT })],
      [
        make.Approval({ value: LIMIT + 1 }),
        make.Approval({ tenderId: T2 }),
        (me) => make.Approval({ recommendationPreparedBy: me.id }),
        (me) => make.Approval({ tenderCreatedBy: me.id }),
      ],
    ],
  ],

  vendor: [
    [
      READ,
      "Tender",
      [make.Tender(), make.Tender({ state: "awarded", invitedOrgIds: [VENDOR_A] })],
      [make.Tender({ state: "draft" }), make.Tender({ invitedOrgIds: [VENDOR_B] })],
    ],
    ...(["Offer", "Claim", "Document", "Thread", "Mark"] as const).map((subject): Entry => {
      const maker = make[subject] as (o?: object) => object;
      return [READ, subject, [maker()], [maker({ vendorOrgId: VENDOR_B })]];
    }),
    // Their own envelope, sealed or not.
    [READ, "Envelope", [make.Envelope({ opened: false }), make.Envelope()], [make.Envelope({ vendorOrgId: VENDOR_B })]],
    [
      ["create", "update", "submit", "withdraw"],
      "Offer",
      [make.Offer({ tenderState: "open" })],
      [make.Offer({ vendorOrgId: VENDOR_B }), make.Offer({ tenderState: "technical" })],
    ],
    [
      "create",
      "Document",
      [make.Document({ tenderState: "open" })],
      [make.Document(), make.Document({ tenderState: "technical" }), make.Document({ vendorOrgId: VENDOR_B, tenderState: "open" })],
    ],
    ["post", "Thread", [make.Thread()], [make.Thread({ vendorOrgId: VENDOR_B })]],
    [[...READ, "acknowledge"], "Addendum", [make.Addendum()], [make.Addendum({ invitedOrgIds: [VENDOR_B] })]],
    [["create", ...READ], "Objection", [make.Objection()], [make.Objection({ vendorOrgId: VENDOR_B })]],
  ],
};

const key = (action: Action, subject: SubjectType) => `${action} ${subject}`;

/** The allowed cells of a role; a role's own entry for a cell replaces the everyone entry. */
export function expectedFor(role: Role): Map<string, Grant> {
  const cells = new Map<string, Grant>();
  for (const [actions, subject, allowed, denied = []] of [...EVERYONE, ...TABLE[role]]) {
    for (const action of typeof actions === "string" ? [actions] : actions) {
      cells.set(key(action, subject), { allowed, denied });
    }
  }
  return cells;
}

export const cellKey = key;
export const resolve = (given: Given, me: Actor): object => (typeof given === "function" ? given(me) : given);

import { count, sql } from "drizzle-orm";
import type { Db, Queryable } from "./client";
import { organisations, tenderInvitations, tenders, type RoleName } from "./schema";
import { insertUser } from "@/lib/server/people-store";
import { appendLedger } from "@/lib/server/ledger";

// Everything below is invented for the demonstration: no real company, person or figure.
export const DEMO_PASSWORD = "ratecourt-demo";

export const DEMO_ORGANISATIONS = {
  buyer: { name: "Tarnwell Water Authority", kind: "buyer", country: "GB" },
  kestrelink: { name: "Kestrelink Radio", kind: "vendor", country: "NL" },
  marram: { name: "Marram Telemetry", kind: "vendor", country: "DK" },
  oxbow: { name: "Oxbow Wireless", kind: "vendor", country: "IE" },
  quillfield: { name: "Quillfield RF", kind: "vendor", country: "DE" },
} as const;
type OrgKey = keyof typeof DEMO_ORGANISATIONS;

export const DEMO_USERS: {
  key: string;
  name: string;
  email: string;
  org: OrgKey;
  roles: RoleName[];
  approvalLimit?: number;
}[] = [
  { key: "admin", name: "Dana Whitlock", email: "admin@tarnwell.example", org: "buyer", roles: ["admin"] },
  { key: "buyer", name: "Ines Calloway", email: "buyer@tarnwell.example", org: "buyer", roles: ["buyer"] },
  { key: "engineer", name: "Ravi Okonjo", email: "engineer@tarnwell.example", org: "buyer", roles: ["engineer"] },
  {
    key: "approver",
    name: "Helen Strand",
    email: "approver@tarnwell.example",
    org: "buyer",
    roles: ["approver"],
    approvalLimit: 250_000,
  },
  {
    key: "director",
    name: "Tomas Veld",
    email: "director@tarnwell.example",
    org: "buyer",
    roles: ["approver", "engineer"],
    approvalLimit: 2_000_000,
  },
  { key: "kestrelink", name: "Pieter Aalders", email: "sales@kestrelink.example", org: "kestrelink", roles: ["vendor"] },
  { key: "marram", name: "Signe Holm", email: "offers@marram.example", org: "marram", roles: ["vendor"] },
  { key: "oxbow", name: "Aoife Brennan", email: "bids@oxbow.example", org: "oxbow", roles: ["vendor"] },
  { key: "quillfield", name: "Jonas Reuter", email: "tenders@quillfield.example", org: "quillfield", roles: ["vendor"] },
];

const DAY = 86_400_000;

/** Fills an empty database with the demo scenario; does nothing when organisations exist. */
export async function seedDemoData(db: Db): Promise<boolean> {
  return db.transaction(async (tx) => {
    // Serialise first starts of several processes on one server database.
    await tx.execute(sql`select pg_advisory_xact_lock(72011949)`);
    const [{ n }] = await tx.select({ n: count() }).from(organisations);
    if (n > 0) return false;
    await insertDemo(tx);
    return true;
  });
}

async function insertDemo(tx: Queryable) {
  const orgIds = {} as Record<OrgKey, string>;
  for (const [key, org] of Object.entries(DEMO_ORGANISATIONS) as [OrgKey, (typeof DEMO_ORGANISATIONS)[OrgKey]][]) {
    const [row] = await tx.insert(organisations).values(org).returning();
    orgIds[key] = row.id;
  }
  const userIds: Record<string, string> = {};
  for (const u of DEMO_USERS) {
    const row = await insertUser(tx, {
      name: u.name,
      email: u.email,
      password: DEMO_PASSWORD,
      organisationId: orgIds[u.org],
      roles: u.roles,
      approvalLimit: u.approvalLimit ?? null,
    });
    userIds[u.key] = row.id;
  }
  const system = null;
  await appendLedger(tx, { actor: system, action: "demo.seeded", subjectType: "System", data: { users: DEMO_USERS.length } });

  const buyer = { id: userIds.buyer, label: "Ines Calloway" };
  const now = Date.now();
  const [open] = await tx
    .insert(tenders)
    .values({
      reference: "RC-2027-001",
      title: "River-level gauge radios",
      description:
        "Sub-GHz telemetry radios for 4,000 river-level gauges. Hard-decision receivers; frames of at most 2,048 bits to keep latency low.",
      channelModel: "bsc",
      operatingPoints: [
        { label: "Clear weather", value: 1e-3 },
        { label: "Storm fade", value: 5e-3 },
      ],
      targetMetric: "bler",
      targetValue: 1e-4,
      maxFrameBits: 2048,
      quantity: 4000,
      currency: "EUR",
      weights: { technical: 40, evidence: 15, price: 30, leadTime: 10, warranty: 5 },
      impossibleRule: "disqualify",
      closesAt: new Date(now + 21 * DAY),
      closesZone: "Europe/London",
      openedAt: new Date(now - 3 * DAY),
      state: "open",
      createdBy: buyer.id,
    })
    .returning();
  await tx
    .insert(tenderInvitations)
    .values((["kestrelink", "marram", "oxbow", "quillfield"] as const).map((k) => ({ tenderId: open.id, organisationId: orgIds[k] })));
  await appendLedger(tx, { tenderId: open.id, actor: buyer, action: "tender.created", subjectType: "Tender", subjectId: open.id, data: { reference: open.reference } });
  await appendLedger(tx, { tenderId: open.id, actor: buyer, action: "tender.opened", subjectType: "Tender", subjectId: open.id, data: { invited: 4 } });

  const [draft] = await tx
    .insert(tenders)
    .values({
      reference: "RC-2027-002",
      title: "Rain-gauge uplink radios, phase 2",
      description: "Soft-decision uplink for hill-top rain gauges; two link-budget cases.",
      channelModel: "biawgn",
      operatingPoints: [
        { label: "Nominal link", value: 3 },
        { label: "Edge of coverage", value: 2 },
      ],
      targetMetric: "ber",
      targetValue: 1e-6,
      maxFrameBits: 4096,
      quantity: 1200,
      currency: "EUR",
      weights: { technical: 45, evidence: 10, price: 30, leadTime: 10, warranty: 5 },
      impossibleRule: "penalty",
      impossiblePenalty: 25,
      closesAt: new Date(now + 45 * DAY),
      closesZone: "Europe/London",
      createdBy: buyer.id,
    })
    .returning();
  await tx.insert(tenderInvitations).values([{ tenderId: draft.id, organisationId: orgIds.oxbow }, { tenderId: draft.id, organisationId: orgIds.quillfield }]);
  await appendLedger(tx, { tenderId: draft.id, actor: buyer, action: "tender.created", subjectType: "Tender", subjectId: draft.id, data: { reference: draft.reference } });
}

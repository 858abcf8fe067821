import { count, inArray, sql } from "drizzle-orm";
import type { Db, Queryable } from "./client";
import { ADVISORY_LOCKS } from "./locks";
import { organisations, tenderInvitations, tenders, users } from "./schema";
import { DEMO_ORGANISATIONS, DEMO_PASSWORD, DEMO_USERS, type DemoContext, type OrgKey } from "./seed-context";
import { insertUser } from "@/lib/server/people-store";
import { seedDemoOffers, seedDemoSensitivityOffers } from "./seed-offers";
import { seedDemoReview } from "./seed-review";
import { seedDemoApprovalBands } from "./seed-approvals";
import { appendLedger } from "@/lib/server/ledger";
import { checkpointNow } from "@/lib/server/ledger-anchors";

export { DEMO_ORGANISATIONS, DEMO_PASSWORD, DEMO_USERS, type DemoContext } from "./seed-context";

const DAY = 86_400_000;

/** Fills an empty database with the demo scenario; does nothing when organisations exist. */
export async function seedDemoData(db: Db): Promise<boolean> {
  const seeded = await db.transaction(async (tx) => {
    // Serialise first starts of several processes on one server database.
    await tx.execute(sql`select pg_advisory_xact_lock(${ADVISORY_LOCKS.demoSeed})`);
    const [{ n }] = await tx.select({ n: count() }).from(organisations);
    if (n > 0) return false;
    await insertDemo(tx);
    return true;
  });
  // One transaction wrote the whole demo ledger: sign its head once it is committed.
  if (seeded) await checkpointNow(db, "schedule");
  return seeded;
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

  const buyer = demoBuyer(userIds);
  const now = Date.now();

  const gauges = await insertTender(
    tx,
    buyer,
    GAUGES_VENDORS.map((v) => orgIds[v]),
    gaugesTenderValues(now),
  );

  const weirs = await insertTender(
    tx,
    buyer,
    GAUGES_VENDORS.map((v) => orgIds[v]),
    {
      reference: DEMO_REFERENCES.weirs,
      title: "Weir telemetry links",
      description: "Radios for flow gauges at weirs that feed the flood warnings: hard-decision, longer frames allowed. Safety-relevant.",
      channelModel: "bsc",
      operatingPoints: [{ label: "Typical path", value: 2e-3 }],
      targetMetric: "bler",
      targetValue: 1e-5,
      maxFrameBits: 8192,
      quantity: 600,
      currency: "EUR",
      weights: { technical: 40, evidence: 10, price: 35, leadTime: 10, warranty: 5 },
      impossibleRule: "penalty",
      impossiblePenalty: 20,
      safetyRelevant: true,
      openedAt: new Date(now - 5 * DAY),
      closesAt: new Date(now + 14 * DAY),
      closesZone: "Europe/London",
      state: "open",
    },
  );

  const rain = await insertTender(tx, buyer, [orgIds.oxbow, orgIds.quillfield], {
    reference: DEMO_REFERENCES.rain,
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
    state: "draft",
  });

  const gateways = await insertTender(
    tx,
    buyer,
    GAUGES_VENDORS.map((v) => orgIds[v]),
    {
      reference: DEMO_REFERENCES.gateways,
      title: "Flood-warning gateway receivers",
      description:
        "Receivers for the valley gateways that collect flood-warning packets from the gauges: 160-bit packets at 1,200 bit/s, stated as the input level each receiver needs.",
      channelModel: "biawgn",
      operatingPoints: [{ label: "Valley gateway", value: -130, sensitivity: { bitRate: 1200, payloadBits: 160, targetPer: 1e-2 } }],
      targetMetric: "bler",
      targetValue: 1e-2,
      maxFrameBits: null,
      assumedNoiseFigureDb: 6,
      quantity: 40,
      currency: "EUR",
      weights: { technical: 45, evidence: 10, price: 30, leadTime: 10, warranty: 5 },
      impossibleRule: "disqualify",
      openedAt: new Date(now - 3 * DAY),
      closesAt: new Date(now + 20 * DAY),
      closesZone: "Europe/London",
      state: "open",
    },
  );

  const ctx: DemoContext = { orgIds, userIds, tenderIds: { gauges, weirs, rain, gateways }, now };
  await seedDemoOffers(tx, ctx);
  await seedDemoSensitivityOffers(tx, ctx);
  await closeGauges(tx, gauges);
  await seedDemoReview(tx, ctx);
  await seedDemoApprovalBands(tx, ctx);
}

const GAUGES_VENDORS = ["kestrelink", "marram", "oxbow", "quillfield"] as const;
const demoBuyer = (userIds: Record<string, string>) => ({ id: userIds.buyer, label: DEMO_USERS.find((u) => u.key === "buyer")!.name });

/** The gauges tender closed after its offers came in. */
const closeGauges = (tx: Queryable, tenderId: string) =>
  appendLedger(tx, { tenderId, actor: null, action: "tender.closed", subjectType: "Tender", subjectId: tenderId, data: {} });

const DEMO_REFERENCES = { gauges: "RC-2027-001", rain: "RC-2027-002", weirs: "RC-2027-003", gateways: "RC-2027-004" } as const;

/** The demo's organisations, people and tenders as a seeded database holds them, for writers that come after the seed. */
export async function loadDemoContext(db: Queryable): Promise<DemoContext> {
  const orgNames: Record<string, string> = Object.fromEntries(Object.entries(DEMO_ORGANISATIONS).map(([key, org]) => [key, org.name]));
  const emails: Record<string, string> = Object.fromEntries(DEMO_USERS.map((u) => [u.key, u.email]));
  const [orgs, people, rows] = [
    await db
      .select({ id: organisations.id, key: organisations.name })
      .from(organisations)
      .where(inArray(organisations.name, Object.values(orgNames))),
    await db
      .select({ id: users.id, key: users.email })
      .from(users)
      .where(inArray(users.email, Object.values(emails))),
    await db
      .select({ id: tenders.id, key: tenders.reference })
      .from(tenders)
      .where(inArray(tenders.reference, Object.values(DEMO_REFERENCES))),
  ];
  /** Each key of `wanted` with the id of the row that its value names. */
  const ids = (wanted: Record<string, string>, found: { id: string; key: string }[]) =>
    Object.fromEntries(
      Object.entries(wanted).map(([key, name]) => {
        const row = found.find((r) => r.key === name);
        if (!row) throw new Error(`the demo's ${name} is missing: start from a freshly seeded database`);
        return [key, row.id];
      }),
    );
  return {
    orgIds: ids(orgNames, orgs) as DemoContext["orgIds"],
    userIds: ids(emails, people),
    tenderIds: ids(DEMO_REFERENCES, rows) as DemoContext["tenderIds"],
    now: Date.now(),
  };
}

/**
 * A copy of the gauges tender under a reference and title of its own, as the demo leaves the
 * original: the demo's four offers, closed, in technical evaluation, the director declared with
 * one lab run. The browser tests' own database starts each tender journey from one (tests/e2e/prepare.ts).
 */
export async function insertGaugesCopy(tx: Queryable, ctx: DemoContext, copy: { reference: string; title: string }): Promise<string> {
  const tenderId = await insertTender(
    tx,
    demoBuyer(ctx.userIds),
    GAUGES_VENDORS.map((v) => ctx.orgIds[v]),
    { ...gaugesTenderValues(ctx.now), ...copy },
  );
  await seedDemoOffers(tx, ctx, tenderId);
  await closeGauges(tx, tenderId);
  await seedDemoReview(tx, ctx, tenderId);
  return tenderId;
}

type TenderValues = Omit<typeof tenders.$inferInsert, "createdBy">;

/** The gauges tender (RC-2027-001) as the demo has it: in technical evaluation, closed two days ago. */
export function gaugesTenderValues(now: number): TenderValues {
  return {
    reference: DEMO_REFERENCES.gauges,
    title: "River-level gauge radios",
    description: "Sub-GHz telemetry radios for 4,000 river-level gauges. Hard-decision receivers; frames of at most 2,048 bits to keep latency low.",
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
    openedAt: new Date(now - 30 * DAY),
    closesAt: new Date(now - 2 * DAY),
    closesZone: "Europe/London",
    state: "technical",
  };
}

/** A demo tender with its invitations and the ledger entries its state implies. */
async function insertTender(tx: Queryable, buyer: { id: string; label: string }, invited: string[], values: TenderValues) {
  const [row] = await tx
    .insert(tenders)
    .values({ ...values, createdBy: buyer.id })
    .returning();
  await tx.insert(tenderInvitations).values(invited.map((organisationId) => ({ tenderId: row.id, organisationId })));
  const entry = (action: string, data: Record<string, unknown> = {}) =>
    appendLedger(tx, { tenderId: row.id, actor: buyer, action, subjectType: "Tender", subjectId: row.id, data });
  await entry("tender.created", { reference: row.reference });
  if (row.state !== "draft") await entry("tender.opened", { invited: invited.length });
  return row.id;
}

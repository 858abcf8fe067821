// A tender in approval, built by inserting rows directly: four vendors' offers with claims judged
// by the real engine, opened envelopes, a signed technical evaluation and a pending recommendation.
import { count, eq, inArray } from "drizzle-orm";
import type { Db } from "@/db/client";
import { approvalBands, claims, offers, organisations, recommendations, technicalSignoffs, tenderInvitations, tenders, users } from "@/db/schema";
import { seedDemoApprovalBands } from "@/db/seed-approvals";
import { evaluateClaim } from "@/lib/bounds";
import { formatMoney } from "@/lib/format";
import type { OfferScore, ScoreSheet } from "@/lib/scoring/types";

const WEIGHTS = { technical: 40, evidence: 15, price: 30, leadTime: 10, warranty: 5 };
const POINTS = [
  { label: "Clear weather", value: 1e-3 },
  { label: "Storm fade", value: 5e-3 },
];

/** Invented vendors' offers: one beyond capacity, one needing evidence, two honest. */
export const FIXTURE_OFFERS = [
  { org: "Kestrelink Radio", module: "KR-868 Gauge", n: 1536, k: 1024, unitPrice: 103, total: 82.4, rank: 1 as number | null },
  { org: "Quillfield RF", module: "QF-Tele 2", n: 1024, k: 768, unitPrice: 117.5, total: 71.0, rank: 2 },
  { org: "Oxbow Wireless", module: "OX-Link S", n: 2048, k: 1862, unitPrice: 96.25, total: 64.2, rank: 3 },
  { org: "Marram Telemetry", module: "MT-900", n: 2048, k: 2000, unitPrice: 88.9, total: null, rank: null },
] as const;

export async function idsByEmail(db: Db) {
  const rows = await db.select({ id: users.id, email: users.email }).from(users);
  const id = (email: string) => rows.find((r) => r.email === email)!.id;
  return {
    admin: id("admin@tarnwell.example"),
    buyer: id("buyer@tarnwell.example"),
    engineer: id("engineer@tarnwell.example"),
    approver: id("approver@tarnwell.example"),
    director: id("director@tarnwell.example"),
  };
}

/** The demo bands, once per database (the lead wires them into the seed; tests do not rely on that). */
export async function ensureDemoBands(db: Db) {
  const [{ n }] = await db.select({ n: count() }).from(approvalBands);
  if (n === 0) await seedDemoApprovalBands(db, { userIds: await idsByEmail(db) } as never);
}

function sheetFor(quantity: number, offerIds: string[]): ScoreSheet {
  const line = (criterion: OfferScore["lines"][number]["criterion"], normalised: number | null, rawText: string) => ({
    criterion,
    raw: null,
    rawText,
    normalised,
    weight: WEIGHTS[criterion],
    contribution: normalised === null ? null : (normalised * WEIGHTS[criterion]) / 100,
  });
  return {
    tenderReference: "fixture",
    quantity,
    currency: "EUR",
    weights: WEIGHTS,
    weightSum: 100,
    rule: "disqualify",
    penaltyPoints: 0,
    sealed: false,
    offers: FIXTURE_OFFERS.map((o, i) => ({
      offerId: offerIds[i],
      vendorName: o.org,
      lines: [
        line("technical", o.total === null ? 0 : o.total + 5, "by operating point"),
        line("evidence", 50, "0 verified, 0 contradicted of 2 claims"),
        // The real sheet carries every price in words: the regret notices must not leak them.
        line("price", o.total === null ? null : 70 + i, `${formatMoney(o.unitPrice * quantity, "EUR")} (${quantity} × ${formatMoney(o.unitPrice, "EUR")})`),
        line("leadTime", 80, "8 weeks"),
        line("warranty", 60, "24 months"),
      ],
      points: [],
      totalPrice: o.unitPrice * quantity,
      unitPriceUsed: o.unitPrice,
      subtotal: o.total,
      penalty: 0,
      total: o.total,
      rank: o.rank,
      confirmedImpossible: o.rank === null ? ["Claim at Storm fade: impossible, and rejected as impossible by an engineer."] : [],
      disqualified: o.rank === null,
      needsConversion: false,
      flags: o.rank === null ? ["Disqualified: confirmed impossible claim"] : [],
    })),
  };
}

export interface ApprovalFixture {
  tenderId: string;
  reference: string;
  title: string;
  recommendationId: string;
  offerIds: string[];
  orgIds: string[];
  value: number;
}

let sequence = 100;

/** A tender in approval with a pending recommendation of the winner (Kestrelink) at the given value. */
export async function createApprovalFixture(db: Db, options: { value: number; storeRule?: boolean }): Promise<ApprovalFixture> {
  await ensureDemoBands(db);
  const ids = await idsByEmail(db);
  const orgRows = await db
    .select()
    .from(organisations)
    .where(
      inArray(
        organisations.name,
        FIXTURE_OFFERS.map((o) => o.org),
      ),
    );
  const orgIds = FIXTURE_OFFERS.map((o) => orgRows.find((r) => r.name === o.org)!.id);
  const reference = `RC-2099-${++sequence}`;
  const title = `Fixture gauge radios ${sequence}`;
  const now = Date.now();
  const [tender] = await db
    .insert(tenders)
    .values({
      reference,
      title,
      description: "Radios for an invented fixture.",
      state: "approval",
      channelModel: "bsc",
      operatingPoints: POINTS,
      targetMetric: "bler",
      targetValue: 1e-4,
      maxFrameBits: 2048,
      quantity: 4000,
      currency: "EUR",
      weights: WEIGHTS,
      closesAt: new Date(now - 9 * 86_400_000),
      closesZone: "Europe/London",
      openedAt: new Date(now - 40 * 86_400_000),
      technicalSignedAt: new Date(now - 5 * 86_400_000),
      envelopesOpenedAt: new Date(now - 4 * 86_400_000),
      createdBy: ids.buyer,
    })
    .returning();
  await db.insert(tenderInvitations).values(orgIds.map((organisationId) => ({ tenderId: tender.id, organisationId })));
  await db.insert(technicalSignoffs).values({ tenderId: tender.id, signedBy: ids.engineer, statement: "Every claim marked." });
  const vendorUsers = await db.select({ id: users.id, organisationId: users.organisationId }).from(users).where(inArray(users.organisationId, orgIds));
  const offerIds: string[] = [];
  for (const [i, o] of FIXTURE_OFFERS.entries()) {
    const [offer] = await db
      .insert(offers)
      .values({
        tenderId: tender.id,
        vendorOrgId: orgIds[i],
        version: 1,
        moduleName: o.module,
        partNumber: `P-${i + 1}`,
        codeFamily: "LDPC",
        decision: "hard",
        n: o.n,
        k: o.k,
        rate: o.k / o.n,
        unitPrice: o.unitPrice,
        currency: "EUR",
        leadTimeWeeks: 8,
        warrantyMonths: 24,
        submittedBy: vendorUsers.find((u) => u.organisationId === orgIds[i])!.id,
      })
      .returning();
    offerIds.push(offer.id);
    for (const [pointIndex, point] of POINTS.entries()) {
      const result = evaluateClaim({ channel: { model: "bsc", p: point.value }, code: { n: o.n, k: o.k }, target: { metric: "bler", value: 1e-4 } });
      await db.insert(claims).values({
        offerId: offer.id,
        tenderId: tender.id,
        vendorOrgId: orgIds[i],
        pointIndex,
        pointLabel: point.label,
        channelValue: point.value,
        metric: "bler",
        value: 1e-4,
        verdict: result.verdict,
        result: result as unknown as Record<string, unknown>,
        engineVersion: result.engineVersion,
      });
    }
  }
  const recommendationId = await insertRecommendation(db, {
    tenderId: tender.id,
    offerId: offerIds[0],
    value: options.value,
    preparedBy: ids.buyer,
    offerIds,
    storeRule: options.storeRule,
  });
  return { tenderId: tender.id, reference, title, recommendationId, offerIds, orgIds, value: options.value };
}

/** The buyer's (re)submission: a new pending recommendation, the tender back in approval. */
export async function insertRecommendation(
  db: Db,
  r: { tenderId: string; offerId: string; value: number; preparedBy: string; offerIds: string[]; storeRule?: boolean; justification?: string },
) {
  const [rec] = await db
    .insert(recommendations)
    .values({
      tenderId: r.tenderId,
      offerId: r.offerId,
      quantity: 4000,
      value: r.value,
      currency: "EUR",
      justification: r.justification ?? "Best total score; honest claims at both operating points.",
      status: "pending",
      scoreSheet: sheetFor(4000, r.offerIds) as unknown as Record<string, unknown>,
      preparedBy: r.preparedBy,
      ...(r.storeRule ? { approvalsNeeded: r.value >= 250_000 ? 2 : 1, minApproverLimit: r.value >= 50_000 ? 250_000 : 50_000 } : {}),
    })
    .returning();
  await db.update(tenders).set({ state: "approval" }).where(eq(tenders.id, r.tenderId));
  return rec.id;
}

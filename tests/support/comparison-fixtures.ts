// Tenders in commercial evaluation, inserted row by row: offers with claims computed by the real
// engine, marks and lab runs, so the comparison tests need nobody else's workflow code.
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { claims, evidenceRuns, marks, offers, organisations, technicalSignoffs, tenderInvitations, tenders, users } from "@/db/schema";
import type { EvidenceStatus, MarkKind } from "@/db/schema/evaluation";
import type { PriceBreak } from "@/db/schema/offers";
import type { ScoringWeights, TenderState } from "@/db/schema/tenders";
import { assessEvidence, evaluateClaim } from "@/lib/bounds";

export interface FixtureClaim {
  /** Claimed BLER at this operating point. */
  value: number;
  mark?: MarkKind;
  evidence?: EvidenceStatus;
}

export interface FixtureOffer {
  vendor: string;
  unitPrice: number;
  currency?: string;
  leadTimeWeeks: number;
  warrantyMonths: number;
  priceBreaks?: PriceBreak[];
  n: number;
  k: number;
  /** One per operating point, in order. */
  claims: FixtureClaim[];
}

export interface FixtureOptions {
  reference?: string;
  state?: TenderState;
  signed?: boolean;
  opened?: boolean;
  rule?: "disqualify" | "penalty";
  penalty?: number;
  quantity?: number;
  weights?: ScoringWeights;
  points?: { label: string; value: number }[];
  targetValue?: number;
  offers: FixtureOffer[];
}

export interface Fixture {
  tenderId: string;
  offerIds: string[];
  /** claimIds[offer][point] */
  claimIds: string[][];
  vendorOrgIds: string[];
}

let serial = 0;
const userId = async (db: Db, email: string) => (await db.select({ id: users.id }).from(users).where(eq(users.email, email)))[0].id;

/** A run whose Clopper-Pearson assessment gives the wanted status against claimed rate q. */
function runFor(status: EvidenceStatus, q: number) {
  const counts =
    status === "verified"
      ? { errors: 0, trials: Math.ceil(4 / q) }
      : status === "contradicted"
        ? { errors: 100, trials: Math.ceil(10 / q) }
        : { errors: 0, trials: 10 };
  const result = assessEvidence({ ...counts, claimed: q, confidence: 0.95 });
  if (result.status !== status) throw new Error(`fixture run is ${result.status}, wanted ${status}`);
  return { ...counts, result };
}

export const DEFAULT_WEIGHTS: ScoringWeights = { technical: 40, evidence: 15, price: 30, leadTime: 10, warranty: 5 };

export async function createCommercialTender(db: Db, options: FixtureOptions): Promise<Fixture> {
  serial += 1;
  const reference = options.reference ?? `RC-TEST-${String(serial).padStart(3, "0")}-${Math.random().toString(36).slice(2, 6)}`;
  const buyerId = await userId(db, "buyer@tarnwell.example");
  const engineerId = await userId(db, "engineer@tarnwell.example");
  const points = options.points ?? [
    { label: "Clear weather", value: 1e-3 },
    { label: "Storm fade", value: 5e-3 },
  ];
  const signed = options.signed ?? true;
  const state = options.state ?? (signed ? "commercial" : "technical");
  const now = Date.now();
  const [tender] = await db
    .insert(tenders)
    .values({
      reference,
      title: `Fixture tender ${reference}`,
      state,
      channelModel: "bsc",
      operatingPoints: points,
      targetMetric: "bler",
      targetValue: options.targetValue ?? 1e-4,
      maxFrameBits: 2048,
      quantity: options.quantity ?? 4000,
      currency: "EUR",
      weights: options.weights ?? DEFAULT_WEIGHTS,
      impossibleRule: options.rule ?? "disqualify",
      impossiblePenalty: options.penalty ?? 0,
      openedAt: new Date(now - 30 * 86_400_000),
      closesAt: new Date(now - 2 * 86_400_000),
      technicalSignedAt: signed ? new Date(now - 3_600_000) : null,
      envelopesOpenedAt: options.opened ? new Date(now - 60_000) : null,
      createdBy: buyerId,
    })
    .returning();
  if (signed) await db.insert(technicalSignoffs).values({ tenderId: tender.id, signedBy: engineerId, statement: "Every claim marked." });

  const fixture: Fixture = { tenderId: tender.id, offerIds: [], claimIds: [], vendorOrgIds: [] };
  for (const spec of options.offers) {
    const [org] = await db
      .insert(organisations)
      .values({ name: `${spec.vendor} (${reference})`, kind: "vendor" })
      .returning();
    const vendorUser = await db
      .insert(users)
      .values({ name: `${spec.vendor} sales`, email: `sales-${org.id}@vendor.example`, organisationId: org.id })
      .returning();
    await db.insert(tenderInvitations).values({ tenderId: tender.id, organisationId: org.id });
    const [offer] = await db
      .insert(offers)
      .values({
        tenderId: tender.id,
        vendorOrgId: org.id,
        version: 1,
        moduleName: `${spec.vendor} M-${spec.n}`,
        partNumber: `${spec.vendor.slice(0, 3).toUpperCase()}-${spec.n}-${spec.k}`,
        codeFamily: "LDPC",
        decision: "hard",
        n: spec.n,
        k: spec.k,
        rate: spec.k / spec.n,
        unitPrice: spec.unitPrice,
        currency: spec.currency ?? "EUR",
        leadTimeWeeks: spec.leadTimeWeeks,
        warrantyMonths: spec.warrantyMonths,
        priceBreaks: spec.priceBreaks ?? [],
        submittedBy: vendorUser[0].id,
      })
      .returning();
    const ids: string[] = [];
    for (const [i, c] of spec.claims.entries()) {
      const point = points[i];
      const result = evaluateClaim({ channel: { model: "bsc", p: point.value }, code: { n: spec.n, k: spec.k }, target: { metric: "bler", value: c.value } });
      const [claim] = await db
        .insert(claims)
        .values({
          offerId: offer.id,
          tenderId: tender.id,
          vendorOrgId: org.id,
          pointIndex: i,
          pointLabel: point.label,
          channelValue: point.value,
          metric: "bler",
          value: c.value,
          verdict: result.verdict,
          result: result as unknown as Record<string, unknown>,
          engineVersion: result.engineVersion,
        })
        .returning();
      ids.push(claim.id);
      const base = { claimId: claim.id, tenderId: tender.id, vendorOrgId: org.id };
      await db
        .insert(marks)
        .values({ ...base, mark: c.mark ?? "accepted", comment: c.mark && c.mark !== "accepted" ? "Fixture mark." : "", markedBy: engineerId });
      if (c.evidence) {
        const run = runFor(c.evidence, c.value);
        await db.insert(evidenceRuns).values({
          ...base,
          channelValue: point.value,
          unit: "frames",
          trials: run.trials,
          errors: run.errors,
          confidence: 0.95,
          lower: run.result.lower,
          upper: run.result.upper,
          status: run.result.status,
          errorFreeTrialsNeeded: run.result.errorFreeTrialsNeeded,
          recordedBy: engineerId,
        });
      }
    }
    fixture.offerIds.push(offer.id);
    fixture.claimIds.push(ids);
    fixture.vendorOrgIds.push(org.id);
  }
  return fixture;
}

/** A quick honest offer: plausible at both demo points, accepted, with the given envelope. */
export const honest = (vendor: string, unitPrice: number, leadTimeWeeks: number, warrantyMonths: number, extra: Partial<FixtureOffer> = {}): FixtureOffer => ({
  vendor,
  unitPrice,
  leadTimeWeeks,
  warrantyMonths,
  n: 1944,
  k: 1620,
  claims: [{ value: 1e-5 }, { value: 1e-5 }],
  ...extra,
});

/** An offer whose storm-fade claim is beyond the converse bound, marked rejected as impossible. */
export const impossible = (vendor: string, unitPrice: number, leadTimeWeeks: number, warrantyMonths: number): FixtureOffer => ({
  vendor,
  unitPrice,
  leadTimeWeeks,
  warrantyMonths,
  n: 2048,
  k: 1900,
  claims: [{ value: 1e-6 }, { value: 1e-6, mark: "rejected-impossible" }],
});

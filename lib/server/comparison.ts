import "server-only";
import { and, asc, eq, inArray, isNotNull, isNull, sql } from "drizzle-orm";
import { asSubject } from "@/policies";
import { getDb, type Queryable } from "@/db/client";
import { claims, evidenceRuns, marks, offers, organisations, tenders } from "@/db/schema";
import type { MarkKind } from "@/db/schema/evaluation";
import { latestMarks } from "@/lib/review/marks";
import { summariseEvidence } from "@/lib/review/evidence";
import {
  buildScoreSheet,
  comparisonProblem,
  envelopeOpeningProblem,
  scoringMargins,
  type Envelope,
  type ScoreSheet,
  type ScoringInput,
  type ScoringOffer,
} from "@/lib/scoring";
import { ConflictError, ForbiddenError } from "./errors";
import { appendLedger } from "./ledger";
import { offerFor } from "./review";
import { authorize, ledgerActor, type Viewer } from "./session";
import { getTender, tenderSubject, type TenderRow } from "./tenders";

/** The claims of some offers with what scoring needs, their current marks and lab-run summaries. */
async function loadClaims(db: Queryable, viewer: Viewer, offerIds: string[]) {
  if (offerIds.length === 0) return [];
  // Only the margins and k of the stored engine result: the findings are long and not needed here.
  const rows = await db
    .select({
      id: claims.id,
      offerId: claims.offerId,
      tenderId: claims.tenderId,
      vendorOrgId: claims.vendorOrgId,
      pointIndex: claims.pointIndex,
      metric: claims.metric,
      value: claims.value,
      ncgOutputBer: claims.ncgOutputBer,
      verdict: claims.verdict,
      margins: sql<Parameters<typeof scoringMargins>[0]>`${claims.result}->'margins'`,
      k: sql<number | null>`(${claims.result}->>'k')::int`,
    })
    .from(claims)
    .where(inArray(claims.offerId, offerIds))
    .orderBy(asc(claims.pointIndex));
  const visible = rows.filter((c) => viewer.ability.can("read", asSubject("Claim", c)));
  const ids = visible.map((c) => c.id);
  const readsMarks = viewer.ability.can("read", "Mark");
  const readsRuns = viewer.ability.can("read", "EvidenceRun");
  const [markRows, runRows] = await Promise.all([
    readsMarks && ids.length ? db.select({ claimId: marks.claimId, mark: marks.mark, markedAt: marks.markedAt }).from(marks).where(inArray(marks.claimId, ids)) : [],
    readsRuns && ids.length ? db.select({ claimId: evidenceRuns.claimId, status: evidenceRuns.status }).from(evidenceRuns).where(inArray(evidenceRuns.claimId, ids)) : [],
  ]);
  const latest = latestMarks(markRows);
  const runs = new Map<string, (typeof runRows)[number]["status"][]>();
  for (const r of runRows) runs.set(r.claimId, [...(runs.get(r.claimId) ?? []), r.status]);
  return visible.map((c) => {
    const subject = { claimId: c.id, tenderId: c.tenderId, vendorOrgId: c.vendorOrgId };
    const mark = latest.get(c.id);
    return {
      offerId: c.offerId,
      claim: {
        id: c.id,
        pointIndex: c.pointIndex,
        metric: c.metric,
        value: c.value,
        ncgOutputBer: c.ncgOutputBer,
        verdict: c.verdict,
        k: c.k,
        ...scoringMargins(c.margins),
        mark: mark && viewer.ability.can("read", asSubject("Mark", subject)) ? (mark.mark as MarkKind) : null,
        evidence: viewer.ability.can("read", asSubject("EvidenceRun", subject)) ? summariseEvidence(runs.get(c.id) ?? []) : ("none" as const),
      },
    };
  });
}

/**
 * What scoring needs about a tender's current offers, with only what this viewer may read: offers
 * hidden by a declared conflict are left out, and the envelope is null until the policies let the
 * viewer read it (for buyers: once the envelopes are opened).
 */
export async function loadScoringInput(db: Queryable, viewer: Viewer, tender: TenderRow): Promise<ScoringInput> {
  const rows = await db
    .select({ offer: offers, vendorName: organisations.name })
    .from(offers)
    .innerJoin(organisations, eq(organisations.id, offers.vendorOrgId))
    .where(and(eq(offers.tenderId, tender.id), eq(offers.status, "submitted")))
    .orderBy(asc(organisations.name));
  const envelopeOpened = tender.envelopesOpenedAt !== null;
  const readable = rows.filter(({ offer }) =>
    viewer.ability.can("read", asSubject("Offer", { id: offer.id, tenderId: offer.tenderId, vendorOrgId: offer.vendorOrgId, tenderState: tender.state, envelopeOpened })),
  );
  const claimRows = await loadClaims(db, viewer, readable.map((r) => r.offer.id));
  const scoringOffers = readable.map(({ offer, vendorName }): ScoringOffer => {
    const visible = offerFor(viewer, offer, tender);
    const envelope: Envelope | null =
      visible.unitPrice !== undefined && visible.currency !== undefined && visible.leadTimeWeeks !== undefined && visible.warrantyMonths !== undefined
        ? { unitPrice: visible.unitPrice, currency: visible.currency, leadTimeWeeks: visible.leadTimeWeeks, warrantyMonths: visible.warrantyMonths, priceBreaks: visible.priceBreaks ?? [] }
        : null;
    return {
      id: offer.id,
      vendorOrgId: offer.vendorOrgId,
      vendorName,
      moduleName: offer.moduleName,
      partNumber: offer.partNumber,
      codeFamily: offer.codeFamily,
      decision: offer.decision,
      n: offer.n,
      k: offer.k,
      rate: offer.rate ?? (offer.n && offer.k ? offer.k / offer.n : null),
      envelope,
      claims: claimRows.filter((c) => c.offerId === offer.id).map((c) => c.claim),
    };
  });
  const { reference, channelModel, operatingPoints, targetMetric, targetValue, quantity, currency, weights, impossibleRule, impossiblePenalty } = tender;
  return {
    tender: { reference, channelModel, operatingPoints, targetMetric, targetValue, quantity, currency, weights, impossibleRule, impossiblePenalty },
    offers: scoringOffers,
  };
}

export interface Comparison {
  tender: Pick<TenderRow, "id" | "reference" | "title" | "state" | "technicalSignedAt" | "envelopesOpenedAt">;
  envelopesOpened: boolean;
  input: ScoringInput;
  sheet: ScoreSheet;
  computedAt: string;
  can: { openEnvelopes: boolean; recommend: boolean; export: boolean };
}

/**
 * The Comparison of a tender's current offers, recomputed on every read so that a new mark or
 * lab run shows at once. Buyers, and approvers declared on the tender, read it; before the
 * envelopes are opened it carries no price, lead time or warranty (and so no totals or ranks).
 */
export async function getComparison(viewer: Viewer, tenderId: string): Promise<Comparison> {
  const tender = await getTender(viewer, tenderId);
  authorize(viewer, "read", asSubject("Score", { tenderId }), "Only the buying team and approvers declared on this tender read the comparison.");
  const problem = comparisonProblem(tender.state);
  if (problem) throw new ConflictError(problem);
  const input = await loadScoringInput(await getDb(), viewer, tender);
  const { id, reference, title, state, technicalSignedAt, envelopesOpenedAt } = tender;
  return {
    tender: { id, reference, title, state, technicalSignedAt, envelopesOpenedAt },
    envelopesOpened: envelopesOpenedAt !== null,
    input,
    sheet: buildScoreSheet(input),
    computedAt: new Date().toISOString(),
    can: {
      openEnvelopes: viewer.ability.can("openEnvelopes", tenderSubject(tender)) && envelopeOpeningProblem(tender) === null,
      recommend: viewer.ability.can("recommend", tenderSubject(tender)) && envelopesOpenedAt !== null,
      export: viewer.ability.can("export", asSubject("Score", { tenderId })),
    },
  };
}

/**
 * Opens the sealed envelopes of a tender: a buyer only, once the technical evaluation is signed
 * and the tender is in commercial evaluation. Recorded in the ledger in the same transaction.
 */
export async function openEnvelopes(viewer: Viewer, tenderId: string) {
  const tender = await getTender(viewer, tenderId);
  if (!viewer.ability.can("openEnvelopes", "Tender")) throw new ForbiddenError("Only a buyer opens the commercial envelopes.");
  const problem = envelopeOpeningProblem(tender);
  if (problem) throw new ConflictError(problem);
  authorize(viewer, "openEnvelopes", tenderSubject(tender));
  const db = await getDb();
  const openedAt = new Date();
  return db.transaction(async (tx) => {
    // The conditions in the update itself: two buyers clicking at once open the envelopes once.
    const [row] = await tx
      .update(tenders)
      .set({ envelopesOpenedAt: openedAt })
      .where(and(eq(tenders.id, tenderId), eq(tenders.state, "commercial"), isNotNull(tenders.technicalSignedAt), isNull(tenders.envelopesOpenedAt)))
      .returning({ id: tenders.id });
    if (!row) throw new ConflictError("The tender changed meanwhile: reload and try again.");
    const [{ count }] = await tx
      .select({ count: sql<number>`count(*)::int` })
      .from(offers)
      .where(and(eq(offers.tenderId, tenderId), eq(offers.status, "submitted")));
    await appendLedger(tx, {
      tenderId,
      actor: ledgerActor(viewer),
      action: "envelopes.opened",
      subjectType: "Tender",
      subjectId: tenderId,
      data: { reference: tender.reference, offers: count },
    });
    return { tenderId, envelopesOpenedAt: openedAt.toISOString() };
  });
}

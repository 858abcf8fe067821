import "server-only";
import { sensitivityScoring } from "@/lib/offers/radio";
import { and, asc, desc, eq, inArray, isNotNull, isNull, sql } from "drizzle-orm";
import { asSubject, recordTenderState } from "@/policies";
import { getDb, type Queryable } from "./database";
import { claims, evidenceRuns, marks, offers, organisations, tenders } from "@/db/schema";
import type { MarkKind } from "@/db/schema/evaluation";
import { summariseRuns } from "@/lib/review/evidence";
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
import { getTender, getTenderWithHead, tenderSubject, type TenderRow, type TenderWithInvites } from "./tenders";

type Margins = ReturnType<typeof scoringMargins> & { k: number | null };

/**
 * The engine's margins per stored claim. A claim row never changes once evaluated (a new engine
 * run sets a new evaluatedAt), so reading them once per process is safe, and it spares reading the
 * long stored result (with its findings) on every comparison.
 */
const marginCache = new Map<string, Margins>();
// As text: a cache key needs no Date, and parsing 500 timestamps per read is measurable.
const evaluatedAtText = sql<string>`${claims.evaluatedAt}::text`;
const MARGIN_CACHE_LIMIT = 200_000;

async function marginsOf(db: Queryable, rows: { id: string; evaluatedAt: string }[]): Promise<Map<string, Margins>> {
  const key = (r: { id: string; evaluatedAt: string }) => `${r.id}@${r.evaluatedAt}`;
  const missing = rows.filter((r) => !marginCache.has(key(r)));
  if (missing.length > 0) {
    const read = await db
      .select({
        id: claims.id,
        evaluatedAt: evaluatedAtText,
        margins: sql<Parameters<typeof scoringMargins>[0]>`${claims.result}->'margins'`,
        // k may be fractional (n times a stated rate), so it is read as a double.
        k: sql<number | null>`(${claims.result}->>'k')::float8`,
      })
      .from(claims)
      .where(
        inArray(
          claims.id,
          missing.map((r) => r.id),
        ),
      );
    if (marginCache.size + read.length > MARGIN_CACHE_LIMIT) marginCache.clear();
    for (const r of read) marginCache.set(key(r), { ...scoringMargins(r.margins), k: r.k });
  }
  return new Map(rows.map((r) => [r.id, marginCache.get(key(r))!]));
}

/** Memoises an ability check per vendor organisation: the conditions read only the tender and the vendor. */
function perVendor(check: (vendorOrgId: string) => boolean) {
  const seen = new Map<string, boolean>();
  return (vendorOrgId: string) => {
    if (!seen.has(vendorOrgId)) seen.set(vendorOrgId, check(vendorOrgId));
    return seen.get(vendorOrgId)!;
  };
}

/** The claims of a tender's current offers with what scoring needs, their current marks and lab-run summaries (only runs that count). */
async function loadClaims(db: Queryable, viewer: Viewer, tender: Pick<TenderRow, "id" | "channelModel">, offerIds: ReadonlySet<string>) {
  const tenderId = tender.id;
  if (offerIds.size === 0) return [];
  const { ability } = viewer;
  const on = (vendorOrgId: string) => ({ claimId: "", tenderId, vendorOrgId });
  const readsClaim = perVendor((v) => ability.can("read", asSubject("Claim", { id: "", offerId: "", tenderId, vendorOrgId: v })));
  const readsMark = perVendor((v) => ability.can("read", asSubject("Mark", on(v))));
  const readsRuns = perVendor((v) => ability.can("read", asSubject("EvidenceRun", on(v))));
  const [rows, markRows, runRows] = await Promise.all([
    db
      .select({
        id: claims.id,
        offerId: claims.offerId,
        vendorOrgId: claims.vendorOrgId,
        pointIndex: claims.pointIndex,
        metric: claims.metric,
        value: claims.value,
        ncgOutputBer: claims.ncgOutputBer,
        verdict: claims.verdict,
        channelValue: claims.channelValue,
        radio: claims.radio,
        evaluatedAt: evaluatedAtText,
      })
      .from(claims)
      .where(eq(claims.tenderId, tenderId))
      .orderBy(asc(claims.pointIndex)),
    // The current mark of each claim is its latest (as lib/review/marks' latestMarks), picked by the database here.
    ability.can("read", "Mark")
      ? db
          .selectDistinctOn([marks.claimId], { claimId: marks.claimId, mark: marks.mark })
          .from(marks)
          .where(eq(marks.tenderId, tenderId))
          .orderBy(marks.claimId, desc(marks.markedAt), desc(marks.id))
      : [],
    ability.can("read", "EvidenceRun")
      ? db
          .select({ claimId: evidenceRuns.claimId, channelValue: evidenceRuns.channelValue, status: evidenceRuns.status })
          .from(evidenceRuns)
          .where(eq(evidenceRuns.tenderId, tenderId))
      : [],
  ]);
  const visible = rows.filter((c) => offerIds.has(c.offerId) && readsClaim(c.vendorOrgId));
  const margins = await marginsOf(db, visible);
  const latest = new Map(markRows.map((m) => [m.claimId, m]));
  const runs = new Map<string, (typeof runRows)[number][]>();
  for (const r of runRows) runs.set(r.claimId, [...(runs.get(r.claimId) ?? []), r]);
  return visible.map((c) => {
    const mark = readsMark(c.vendorOrgId) ? latest.get(c.id) : undefined;
    return {
      offerId: c.offerId,
      claim: {
        id: c.id,
        pointIndex: c.pointIndex,
        metric: c.metric,
        value: c.value,
        ncgOutputBer: c.ncgOutputBer,
        verdict: c.verdict,
        ...margins.get(c.id)!,
        // A sensitivity claim is scored on its worst point's margin in dB (line or curve).
        ...(c.radio
          ? { channelMargin: c.radio.worst.marginDb, channelKind: "dB" as const, rateGapFraction: null, sensitivity: sensitivityScoring(c.radio, c.value) }
          : {}),
        mark: mark ? (mark.mark as MarkKind) : null,
        evidence: readsRuns(c.vendorOrgId) ? summariseRuns(tender.channelModel, c.channelValue, runs.get(c.id) ?? []) : ("none" as const),
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
    viewer.ability.can(
      "read",
      asSubject("Offer", { id: offer.id, tenderId: offer.tenderId, vendorOrgId: offer.vendorOrgId, tenderState: recordTenderState(tender), envelopeOpened }),
    ),
  );
  const claimRows = await loadClaims(db, viewer, tender, new Set(readable.map((r) => r.offer.id)));
  const scoringOffers = readable.map(({ offer, vendorName }): ScoringOffer => {
    const visible = offerFor(viewer, offer, tender);
    const envelope: Envelope | null =
      visible.unitPrice !== undefined && visible.currency !== undefined && visible.leadTimeWeeks !== undefined && visible.warrantyMonths !== undefined
        ? {
            unitPrice: visible.unitPrice,
            currency: visible.currency,
            leadTimeWeeks: visible.leadTimeWeeks,
            warrantyMonths: visible.warrantyMonths,
            priceBreaks: visible.priceBreaks ?? [],
          }
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
 * Every change that can move a score (an offer, a mark, a lab run, a declaration, the envelopes,
 * a state change) writes a ledger entry for its tender, so the tender's ledger head names the
 * state of its inputs. A comparison built for one head and one viewer's reading rights is reused,
 * with its JSON, until the head moves: a mark shows at the next read, and twenty concurrent reads
 * compute once.
 */
interface Cached {
  comparison: Comparison;
  /** The answer's bytes, encoded once per version. */
  body?: Uint8Array;
}
const cache = new Map<string, Promise<Cached>>();
const CACHE_LIMIT = 500;

async function cachedComparison(viewer: Viewer, tenderId: string): Promise<Cached> {
  // The tender and its ledger head in one read: the head names the state of every scoring input.
  const { tender, head } = await getTenderWithHead(viewer, tenderId);
  authorize(viewer, "read", asSubject("Score", { tenderId }), "Only the buying team and approvers declared on this tender read the comparison.");
  const problem = comparisonProblem(tender.state);
  if (problem) throw new ConflictError(problem);
  const db = await getDb();
  const { id, roles, declarations } = viewer.actor;
  const key = JSON.stringify([tenderId, head, tender.state, tender.envelopesOpenedAt, id, roles, declarations]);
  let entry = cache.get(key);
  if (!entry) {
    if (cache.size >= CACHE_LIMIT) cache.clear();
    entry = buildComparison(db, viewer, tender).then((comparison) => ({ comparison }));
    entry.catch(() => cache.delete(key));
    cache.set(key, entry);
  }
  return entry;
}

async function buildComparison(db: Queryable, viewer: Viewer, tender: TenderWithInvites): Promise<Comparison> {
  const input = await loadScoringInput(db, viewer, tender);
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
      export: viewer.ability.can("export", asSubject("Score", { tenderId: tender.id })),
    },
  };
}

/**
 * The Comparison of a tender's current offers, recomputed whenever its inputs change. Buyers, and
 * approvers declared on the tender, read it; before the envelopes are opened it carries no price,
 * lead time or warranty (and so no totals or ranks).
 */
export async function getComparison(viewer: Viewer, tenderId: string): Promise<Comparison> {
  return (await cachedComparison(viewer, tenderId)).comparison;
}

/** The same, serialised and encoded once per version: what the route sends. */
export async function getComparisonBody(viewer: Viewer, tenderId: string): Promise<Uint8Array> {
  const entry = await cachedComparison(viewer, tenderId);
  return (entry.body ??= new TextEncoder().encode(JSON.stringify(entry.comparison)));
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

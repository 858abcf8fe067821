import "server-only";
import { and, asc, eq, inArray } from "drizzle-orm";
import { asSubject, pickPermitted, recordTenderState, tenderAccess, type ClaimRecord, type RecordTenderState } from "@/policies";
import { getDb, type Queryable } from "@/db/client";
import { claims, documents, evidenceRuns, marks, offers, organisations, tenders } from "@/db/schema";
import type { ChannelModel } from "@/db/schema/tenders";
import { latestMarks } from "@/lib/review/marks";
import { summariseRuns } from "@/lib/review/evidence";
import type { EvidenceSummary } from "@/lib/review/labels";
import type { ClaimQueueFilters } from "@/lib/validation/review";
import { ForbiddenError, NotFoundError } from "./errors";
import type { Viewer } from "./session";
import { getTender, listTenders } from "./tenders";

/** A claim as the Claim subject; with its tender's state, so that a sealed tender's claims stay unread. */
export const claimSubject = (c: ClaimRecord, tenderState?: RecordTenderState) =>
  asSubject("Claim", { id: c.id, offerId: c.offerId, tenderId: c.tenderId, vendorOrgId: c.vendorOrgId, tenderState });

const isDeclared = (viewer: Viewer, tenderId: string) => tenderAccess(viewer.actor.declarations).declared.includes(tenderId);

const declaresFirst = (viewer: Viewer) => viewer.actor.roles.some((r) => r === "engineer" || r === "approver");

/** Why a claim is out of reach: hidden by a declared conflict (404), or no declaration yet (403). */
function refusal(viewer: Viewer, tenderId: string, vendorOrgId: string): Error {
  if (tenderAccess(viewer.actor.declarations).conflicts.get(tenderId)?.includes(vendorOrgId)) return new NotFoundError("No such claim.");
  if (declaresFirst(viewer) && !isDeclared(viewer, tenderId)) {
    return new ForbiddenError("Declare any conflict of interest on this tender before you see its offers and claims.");
  }
  return new ForbiddenError("This claim is not yours to see.");
}

const claimColumns = { claim: claims, offer: offers, vendorName: organisations.name, tender: tenders };
/** Claims with their offer, vendor name and tender: the one join the review reads through. */
export const claimJoin = (db: Queryable) =>
  db
    .select(claimColumns)
    .from(claims)
    .innerJoin(offers, eq(offers.id, claims.offerId))
    .innerJoin(organisations, eq(organisations.id, claims.vendorOrgId))
    .innerJoin(tenders, eq(tenders.id, claims.tenderId));
export type LoadedClaim = Awaited<ReturnType<typeof loadClaim>>;

/** One claim with its offer, vendor and tender, once the viewer may read it; 404 if it does not exist. */
export async function loadClaim(viewer: Viewer, claimId: string) {
  const db = await getDb();
  const [row] = await claimJoin(db).where(eq(claims.id, claimId));
  if (!row) throw new NotFoundError("No such claim.");
  if (!viewer.ability.can("read", claimSubject(row.claim, recordTenderState(row.tender)))) throw refusal(viewer, row.claim.tenderId, row.claim.vendorOrgId);
  return row;
}

/** The offer as this viewer may read it: envelope fields stripped unless the policies allow them. */
export function offerFor(viewer: Viewer, offer: typeof offers.$inferSelect, tender: typeof tenders.$inferSelect) {
  const record = { ...offer, tenderState: recordTenderState(tender), envelopeOpened: tender.envelopesOpenedAt !== null };
  const { tenderState: _s, envelopeOpened: _o, ...visible } = pickPermitted(viewer.ability, "read", "Offer", record);
  return visible;
}

/** Current mark and evidence status per claim (only runs that count); the evidence only where the viewer reads lab runs. */
async function reviewState(db: Queryable, viewer: Viewer, claimRows: { claim: ClaimRecord & { channelValue: number }; tender: { channelModel: ChannelModel } }[]) {
  const ids = claimRows.map((r) => r.claim.id);
  const markRows = ids.length ? await db.select().from(marks).where(inArray(marks.claimId, ids)) : [];
  const runRows = ids.length ? await db.select().from(evidenceRuns).where(inArray(evidenceRuns.claimId, ids)) : [];
  const latest = latestMarks(markRows);
  const evidence = new Map<string, EvidenceSummary | null>();
  for (const { claim: c, tender } of claimRows) {
    const seesRuns = viewer.ability.can("read", asSubject("EvidenceRun", { claimId: c.id, tenderId: c.tenderId, vendorOrgId: c.vendorOrgId }));
    evidence.set(c.id, seesRuns ? summariseRuns(tender.channelModel, c.channelValue, runRows.filter((r) => r.claimId === c.id)) : null);
  }
  return { latest, evidence };
}

export interface QueueRow {
  id: string;
  /** A sensitivity claim's level (dBm), and its worst margin in dB (line or curve); null otherwise. */
  sensitivityDbm: number | null;
  worstMarginDb: number | null;
  tenderId: string;
  tenderReference: string;
  channelModel: "bsc" | "bec" | "biawgn";
  vendorOrgId: string;
  vendorName: string;
  moduleName: string;
  pointLabel: string;
  channelValue: number;
  metric: string;
  value: number;
  verdict: "impossible" | "needs-evidence" | "plausible";
  mark: string | null;
  markedAt: string | null;
  evidence: EvidenceSummary | null;
}

/**
 * The Review bench queue: claims of current offers the viewer may read, in tenders under technical
 * evaluation (or in the one tender asked for), with their current mark and evidence status.
 */
export async function listClaimQueue(viewer: Viewer, filters: Partial<ClaimQueueFilters>): Promise<QueueRow[]> {
  if (filters.tenderId) await getTender(viewer, filters.tenderId);
  if (!viewer.ability.can("list", "Claim")) {
    // Engineers and approvers reach claims only through declarations: until then their queue is empty.
    if (!declaresFirst(viewer)) throw new ForbiddenError("Claims are read by the evaluation team and by the vendor who made them.");
    if (filters.tenderId) throw refusal(viewer, filters.tenderId, "");
    return [];
  }
  const db = await getDb();
  const rows = await claimJoin(db)
    .where(
      and(
        eq(offers.status, "submitted"),
        filters.tenderId ? eq(claims.tenderId, filters.tenderId) : eq(tenders.state, "technical"),
      ),
    )
    .orderBy(asc(tenders.reference), asc(organisations.name), asc(claims.pointIndex));
  const visible = rows.filter((r) => viewer.ability.can("list", claimSubject(r.claim, recordTenderState(r.tender))));
  if (filters.tenderId && rows.length > 0 && visible.length === 0 && !isDeclared(viewer, filters.tenderId)) {
    throw refusal(viewer, filters.tenderId, "");
  }
  const { latest, evidence } = await reviewState(db, viewer, visible);
  const vendor = filters.vendor?.toLowerCase();
  return visible
    .map(({ claim, offer, vendorName, tender }): QueueRow => {
      const mark = latest.get(claim.id);
      return {
        id: claim.id,
        sensitivityDbm: claim.radio?.sensitivityDbm ?? null,
        worstMarginDb: claim.radio?.worst.marginDb ?? null,
        tenderId: tender.id,
        tenderReference: tender.reference,
        channelModel: tender.channelModel,
        vendorOrgId: claim.vendorOrgId,
        vendorName,
        moduleName: offer.moduleName,
        pointLabel: claim.pointLabel,
        channelValue: claim.channelValue,
        metric: claim.metric,
        value: claim.value,
        verdict: claim.verdict,
        mark: mark?.mark ?? null,
        markedAt: mark ? mark.markedAt.toISOString() : null,
        evidence: evidence.get(claim.id) ?? null,
      };
    })
    .filter((r) => !vendor || r.vendorOrgId === filters.vendor || r.vendorName.toLowerCase().includes(vendor))
    .filter((r) => !filters.verdict || r.verdict === filters.verdict)
    .filter((r) => !filters.mark || (filters.mark === "unmarked" ? r.mark === null : r.mark === filters.mark));
}

/** Tenders in technical evaluation, and whether this viewer has declared on each. */
export async function listTendersForReview(viewer: Viewer) {
  const visible = viewer.ability.can("read", "Tender") ? await listTenders(viewer) : [];
  const access = tenderAccess(viewer.actor.declarations);
  return visible
    .filter((t) => t.state === "technical")
    .map((t) => ({
      id: t.id,
      reference: t.reference,
      title: t.title,
      declared: access.declared.includes(t.id),
      conflicts: access.conflicts.get(t.id)?.length ?? 0,
    }));
}

/** Everything the claim page shows, each part authorised on its own. */
export async function getClaimDetail(viewer: Viewer, claimId: string) {
  const row = await loadClaim(viewer, claimId);
  const { claim, tender } = row;
  const db = await getDb();
  const ref = { claimId: claim.id, tenderId: claim.tenderId, vendorOrgId: claim.vendorOrgId };
  const docs = await db.select().from(documents).where(eq(documents.offerId, claim.offerId)).orderBy(asc(documents.uploadedAt));
  const markRows = await db.select().from(marks).where(eq(marks.claimId, claim.id)).orderBy(asc(marks.markedAt));
  const { evidence } = await reviewState(db, viewer, [row]);
  const can = (action: "mark" | "record" | "create", type: "Claim" | "EvidenceRun" | "Thread") =>
    type === "Claim"
      ? viewer.ability.can(action, claimSubject(claim, recordTenderState(tender)))
      : type === "EvidenceRun"
        ? viewer.ability.can(action, asSubject("EvidenceRun", ref))
        : viewer.ability.can(action, asSubject("Thread", { id: "", tenderId: claim.tenderId, vendorOrgId: claim.vendorOrgId }));
  const inTechnical = tender.state === "technical";
  return {
    claim,
    vendorName: row.vendorName,
    offer: offerFor(viewer, row.offer, tender),
    tender: { id: tender.id, reference: tender.reference, title: tender.title, state: tender.state, channelModel: tender.channelModel, safetyRelevant: tender.safetyRelevant },
    documents: docs
      .filter((d) => viewer.ability.can("read", asSubject("Document", { id: d.id, offerId: d.offerId ?? "", tenderId: d.tenderId, vendorOrgId: d.vendorOrgId })))
      .map(({ storageKey: _key, ...d }) => d),
    marks: viewer.ability.can("read", asSubject("Mark", ref)) ? markRows : [],
    evidenceStatus: evidence.get(claim.id) ?? null,
    may: {
      mark: inTechnical && can("mark", "Claim"),
      record: inTechnical && can("record", "EvidenceRun"),
      openThread: inTechnical && can("create", "Thread"),
    },
  };
}
export type ClaimDetail = Awaited<ReturnType<typeof getClaimDetail>>;

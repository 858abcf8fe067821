import "server-only";
import { and, asc, count, eq, ilike, inArray, or, sql } from "drizzle-orm";
import { asSubject, pickPermitted, recordTenderState, tenderAccess, type ClaimRecord, type RecordTenderState } from "@/policies";
import { getDb, type Queryable } from "./database";
import { claims, documents, evidenceRuns, marks, offers, organisations, tenders } from "@/db/schema";
import type { ChannelModel, Verdict } from "@/lib/bounds/vocabulary";
import { latestMarks } from "@/lib/review/marks";
import { summariseRuns } from "@/lib/review/evidence";
import type { EvidenceSummary } from "@/lib/review/labels";
import type { ClaimQueueFilters } from "@/lib/validation/review";
import { pageInfo, pageWindow, type PageInfo, type PagingInput } from "@/lib/validation/paging";
import { accessibleWhere, computedField, containing, recordTenderStateSql, type FieldMap } from "./access-sql";
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
async function reviewState(
  db: Queryable,
  viewer: Viewer,
  claimRows: { claim: ClaimRecord & { channelValue: number }; tender: { channelModel: ChannelModel } }[],
  read = { marks: true },
) {
  const ids = claimRows.map((r) => r.claim.id);
  const markRows = ids.length && read.marks ? await db.select().from(marks).where(inArray(marks.claimId, ids)) : [];
  const runRows = ids.length ? await db.select().from(evidenceRuns).where(inArray(evidenceRuns.claimId, ids)) : [];
  const latest = latestMarks(markRows);
  const evidence = new Map<string, EvidenceSummary | null>();
  for (const { claim: c, tender } of claimRows) {
    const seesRuns = viewer.ability.can("read", asSubject("EvidenceRun", { claimId: c.id, tenderId: c.tenderId, vendorOrgId: c.vendorOrgId }));
    evidence.set(
      c.id,
      seesRuns
        ? summariseRuns(
            tender.channelModel,
            c.channelValue,
            runRows.filter((r) => r.claimId === c.id),
          )
        : null,
    );
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
  channelModel: ChannelModel;
  vendorOrgId: string;
  vendorName: string;
  moduleName: string;
  pointLabel: string;
  channelValue: number;
  metric: string;
  value: number;
  verdict: Verdict;
  mark: string | null;
  markedAt: string | null;
  evidence: EvidenceSummary | null;
}

/** The Claim policy fields in SQL (over claimJoin). */
const CLAIM_FIELDS: FieldMap = {
  id: claims.id,
  offerId: claims.offerId,
  tenderId: claims.tenderId,
  vendorOrgId: claims.vendorOrgId,
  tenderState: computedField(recordTenderStateSql),
};

/** A claim's current mark is its latest (ties: the later id), picked by the database so that it can filter and page. */
const currentMark = sql<
  string | null
>`(select ${marks.mark} from ${marks} where ${marks.claimId} = ${claims.id} order by ${marks.markedAt} desc, ${marks.id} desc limit 1)`;
const currentMarkAt = sql<
  string | null
>`(select ${marks.markedAt}::text from ${marks} where ${marks.claimId} = ${claims.id} order by ${marks.markedAt} desc, ${marks.id} desc limit 1)`;

export interface ClaimQueuePage extends PageInfo {
  claims: QueueRow[];
  /** The vendors with claims in this queue (before the vendor, verdict and mark filters), for the vendor filter. */
  vendors: { id: string; name: string }[];
}

/**
 * One page of the Review bench queue: claims of current offers the viewer may read, in tenders
 * under technical evaluation (or in the one tender asked for), with their current mark and
 * evidence status. The policies, filters, order and paging all run in the database.
 */
export async function listClaimQueue(viewer: Viewer, query: Partial<ClaimQueueFilters> & PagingInput): Promise<ClaimQueuePage> {
  const empty = (): ClaimQueuePage => ({ claims: [], vendors: [], ...pageInfo(pageWindow(0, query)) });
  if (query.tenderId) await getTender(viewer, query.tenderId);
  if (!viewer.ability.can("list", "Claim")) {
    // Engineers and approvers reach claims only through declarations: until then their queue is empty.
    if (!declaresFirst(viewer)) throw new ForbiddenError("Claims are read by the evaluation team and by the vendor who made them.");
    if (query.tenderId) throw refusal(viewer, query.tenderId, "");
    return empty();
  }
  const db = await getDb();
  const scope = and(eq(offers.status, "submitted"), query.tenderId ? eq(claims.tenderId, query.tenderId) : eq(tenders.state, "technical"));
  const base = and(scope, accessibleWhere(viewer.ability, "list", "Claim", CLAIM_FIELDS));
  const vendor = query.vendor;
  const where = and(
    base,
    vendor ? or(eq(claims.vendorOrgId, vendor), ilike(organisations.name, containing(vendor))) : undefined,
    query.verdict ? eq(claims.verdict, query.verdict) : undefined,
    query.mark === "unmarked" ? sql`${currentMark} is null` : query.mark ? sql`${currentMark} = ${query.mark}` : undefined,
  );
  const joins = { offer: eq(offers.id, claims.offerId), vendor: eq(organisations.id, claims.vendorOrgId), tender: eq(tenders.id, claims.tenderId) };
  const [[{ n }], vendors] = await Promise.all([
    db.select({ n: count() }).from(claims).innerJoin(offers, joins.offer).innerJoin(organisations, joins.vendor).innerJoin(tenders, joins.tender).where(where),
    db
      .select({ id: claims.vendorOrgId, name: organisations.name })
      .from(claims)
      .innerJoin(offers, joins.offer)
      .innerJoin(organisations, joins.vendor)
      .innerJoin(tenders, joins.tender)
      .where(base)
      .groupBy(claims.vendorOrgId, organisations.name)
      .orderBy(asc(organisations.name)),
  ]);
  if (query.tenderId && vendors.length === 0 && !isDeclared(viewer, query.tenderId)) {
    const [any] = await db.select({ id: claims.id }).from(claims).innerJoin(offers, joins.offer).innerJoin(tenders, joins.tender).where(scope).limit(1);
    if (any) throw refusal(viewer, query.tenderId, "");
  }
  const window = pageWindow(n, query);
  const rows =
    n === 0
      ? []
      : await db
          .select({ ...claimColumns, mark: currentMark, markedAt: currentMarkAt })
          .from(claims)
          .innerJoin(offers, joins.offer)
          .innerJoin(organisations, joins.vendor)
          .innerJoin(tenders, joins.tender)
          .where(where)
          .orderBy(asc(tenders.reference), asc(organisations.name), asc(claims.pointIndex), asc(claims.id))
          .limit(window.pageSize)
          .offset(window.offset);
  // CASL checks each row again: a gap in the SQL form of the rules could only hide a claim, never show one.
  const visible = rows.filter((r) => viewer.ability.can("list", claimSubject(r.claim, recordTenderState(r.tender))));
  const { evidence } = await reviewState(db, viewer, visible, { marks: false });
  return {
    claims: visible.map(({ claim, offer, vendorName, tender, mark, markedAt }): QueueRow => ({
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
      mark,
      markedAt: markedAt ? new Date(markedAt).toISOString() : null,
      evidence: evidence.get(claim.id) ?? null,
    })),
    vendors,
    ...pageInfo(window),
  };
}

/** Tenders in technical evaluation, and whether this viewer has declared on each. */
export async function listTendersForReview(viewer: Viewer) {
  const visible = viewer.ability.can("read", "Tender") ? await listTenders(viewer, eq(tenders.state, "technical")) : [];
  const access = tenderAccess(viewer.actor.declarations);
  return visible.map((t) => ({
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
    tender: {
      id: tender.id,
      reference: tender.reference,
      title: tender.title,
      state: tender.state,
      channelModel: tender.channelModel,
      safetyRelevant: tender.safetyRelevant,
    },
    documents: docs
      .filter((d) =>
        viewer.ability.can("read", asSubject("Document", { id: d.id, offerId: d.offerId ?? "", tenderId: d.tenderId, vendorOrgId: d.vendorOrgId })),
      )
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

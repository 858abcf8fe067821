import "server-only";
import { and, asc, count, desc, eq, inArray, lte, sql, type SQL } from "drizzle-orm";
import { asSubject } from "@/policies";
import { getDb, type Queryable } from "@/db/client";
import { offers, organisations, tenderInvitations, tenders } from "@/db/schema";
import { appendLedger } from "./ledger";
import { authorize, type Viewer } from "./session";
import { NotFoundError } from "./errors";

export type TenderRow = typeof tenders.$inferSelect;
export type TenderWithInvites = TenderRow & { invitedOrgIds: string[] };
/** A tender as it leaves the server: invitations only of organisations the viewer may read. */
export type TenderView = TenderWithInvites & { invited: { id: string; name: string }[] };

const invitedOrgIds = sql<string[]>`coalesce((select array_agg(${tenderInvitations.organisationId} order by ${tenderInvitations.organisationId}) from ${tenderInvitations} where ${tenderInvitations.tenderId} = ${tenders.id}), '{}')`;

/** Tenders with their invited organisations, in one query (every tender page and route starts here). */
export async function tendersWhere(db: Queryable, where?: SQL): Promise<TenderWithInvites[]> {
  const rows = await db
    .select({ tender: tenders, invitedOrgIds })
    .from(tenders)
    .where(where)
    .orderBy(desc(tenders.createdAt), asc(tenders.reference));
  return rows.map((r) => ({ ...r.tender, invitedOrgIds: r.invitedOrgIds }));
}

export const tenderSubject = (t: TenderWithInvites) =>
  asSubject("Tender", { id: t.id, state: t.state, createdBy: t.createdBy, invitedOrgIds: t.invitedOrgIds });

/**
 * Closing on read: every open tender whose closing time has come moves to technical evaluation,
 * with ledger entries by the system for the closing and for the unsealing of its offers. Cheap when nothing is due (one indexed query). Call it
 * before anything that depends on a tender being open (reads, and accepting an offer).
 */
export async function closeDueTenders(db: Queryable, now = new Date()): Promise<number> {
  const due = and(eq(tenders.state, "open"), lte(tenders.closesAt, now));
  const [any] = await db.select({ id: tenders.id }).from(tenders).where(due).limit(1);
  if (!any) return 0;
  return db.transaction(async (tx) => {
    // The state test in the update itself means two requests never close one tender twice.
    const closed = await tx.update(tenders).set({ state: "technical" }).where(due).returning();
    for (const t of closed) {
      const entry = { tenderId: t.id, actor: null, subjectType: "Tender", subjectId: t.id };
      await appendLedger(tx, {
        ...entry,
        action: "tender.closed",
        data: { reference: t.reference, closesAt: t.closesAt.toISOString(), closesZone: t.closesZone, to: "technical" },
      });
      // From here the buying side reads the technical offers; the commercial envelopes stay shut until opened.
      const current = await tx.select({ n: count() }).from(offers).where(and(eq(offers.tenderId, t.id), eq(offers.status, "submitted")));
      await appendLedger(tx, { ...entry, action: "offers.unsealed", data: { reference: t.reference, offers: current[0].n, envelopes: "sealed until opened" } });
    }
    return closed.length;
  });
}

/** The tenders this viewer may read, newest first. */
export async function listTenders(viewer: Viewer): Promise<TenderWithInvites[]> {
  authorize(viewer, "read", "Tender");
  const db = await getDb();
  await closeDueTenders(db);
  const rows = await tendersWhere(db);
  return rows.filter((t) => viewer.ability.can("read", tenderSubject(t)));
}

/** One tender; 404 when it does not exist, 403 when this viewer may not see it. */
export async function getTender(viewer: Viewer, id: string): Promise<TenderWithInvites> {
  const db = await getDb();
  await closeDueTenders(db);
  const [tender] = await tendersWhere(db, eq(tenders.id, id));
  if (!tender) throw new NotFoundError("No such tender.");
  authorize(viewer, "read", tenderSubject(tender), "You are not invited to this tender.");
  return tender;
}

/** Strips the invitations down to the organisations this viewer may read: a vendor sees only its own. */
async function viewsOf(viewer: Viewer, list: TenderWithInvites[]): Promise<TenderView[]> {
  const ids = [...new Set(list.flatMap((t) => t.invitedOrgIds))];
  const db = await getDb();
  const orgs = ids.length ? await db.select().from(organisations).where(inArray(organisations.id, ids)) : [];
  const readable = new Map(
    orgs
      .filter((o) => viewer.ability.can("read", asSubject("Organisation", { id: o.id, kind: o.kind })))
      .map((o) => [o.id, o.name]),
  );
  return list.map((t) => {
    const invited = t.invitedOrgIds
      .filter((id) => readable.has(id))
      .map((id) => ({ id, name: readable.get(id)! }))
      .sort((a, b) => a.name.localeCompare(b.name));
    return { ...t, invitedOrgIds: invited.map((o) => o.id), invited };
  });
}

/** listTenders, fit to send out (API, pages that show invitations). */
export async function listTenderViews(viewer: Viewer): Promise<TenderView[]> {
  return viewsOf(viewer, await listTenders(viewer));
}

/** getTender, fit to send out. */
export async function getTenderView(viewer: Viewer, id: string): Promise<TenderView> {
  const [view] = await viewsOf(viewer, [await getTender(viewer, id)]);
  return view;
}

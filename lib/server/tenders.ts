import "server-only";
import { and, asc, count, desc, eq, ilike, inArray, lte, or, sql, type SQL } from "drizzle-orm";
import { asSubject } from "@/policies";
import { getDb, type Queryable } from "./database";
import { ledgerEntries, offers, organisations, tenderInvitations, tenders } from "@/db/schema";
import { appendLedger } from "./ledger";
import { authorize, type Viewer } from "./session";
import { NotFoundError } from "./errors";
import { accessibleWhere, containing, type FieldMap } from "./access-sql";
import { pageInfo, pageWindow, type PageInfo, type PagingInput } from "@/lib/validation/paging";
import type { TenderListFilters } from "@/lib/validation/tender";

export type TenderRow = typeof tenders.$inferSelect;
export type TenderWithInvites = TenderRow & { invitedOrgIds: string[] };
/** A tender as it leaves the server: invitations only of organisations the viewer may read. */
export type TenderView = TenderWithInvites & { invited: { id: string; name: string }[] };

const invitedOrgIds = sql<
  string[]
>`coalesce((select array_agg(${tenderInvitations.organisationId} order by ${tenderInvitations.organisationId}) from ${tenderInvitations} where ${tenderInvitations.tenderId} = ${tenders.id}), '{}')`;

/** Tenders with their invited organisations, in one query (every tender page and route starts here). */
export async function tendersWhere(db: Queryable, where?: SQL, window?: { limit: number; offset: number }): Promise<TenderWithInvites[]> {
  const query = db.select({ tender: tenders, invitedOrgIds }).from(tenders).where(where).orderBy(desc(tenders.createdAt), asc(tenders.reference));
  const rows = window ? await query.limit(window.limit).offset(window.offset) : await query;
  return rows.map((r) => ({ ...r.tender, invitedOrgIds: r.invitedOrgIds }));
}

/** The Tender policy fields in SQL: the invitation list lives in its own table. */
const TENDER_FIELDS: FieldMap = {
  id: tenders.id,
  state: tenders.state,
  createdBy: tenders.createdBy,
  invitedOrgIds: (operator, value) => {
    if (operator !== "eq") throw new Error(`The policy operator "${operator}" on invitedOrgIds has no SQL form here.`);
    return sql`exists (select 1 from ${tenderInvitations} where ${tenderInvitations.tenderId} = ${tenders.id} and ${tenderInvitations.organisationId} = ${value})`;
  },
};

/** The tenders this viewer may read, as SQL (the same rules as tenderSubject checks). */
export const readableTenders = (viewer: Viewer) => accessibleWhere(viewer.ability, "read", "Tender", TENDER_FIELDS);

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
      const current = await tx
        .select({ n: count() })
        .from(offers)
        .where(and(eq(offers.tenderId, t.id), eq(offers.status, "submitted")));
      await appendLedger(tx, { ...entry, action: "offers.unsealed", data: { reference: t.reference, offers: current[0].n, envelopes: "sealed until opened" } });
    }
    return closed.length;
  });
}

/** The tenders this viewer may read (and that match `where`), newest first; unpaged, so callers narrow it. */
export async function listTenders(viewer: Viewer, where?: SQL): Promise<TenderWithInvites[]> {
  authorize(viewer, "read", "Tender");
  const db = await getDb();
  await closeDueTenders(db);
  const rows = await tendersWhere(db, and(readableTenders(viewer), where));
  return rows.filter((t) => viewer.ability.can("read", tenderSubject(t)));
}

/**
 * One page of the tenders this viewer may read, newest first, filtered by state and by text in the
 * reference or title: the policies, filters and paging all run in the database.
 */
export async function listTenderPage(viewer: Viewer, query: PagingInput & TenderListFilters): Promise<{ tenders: TenderWithInvites[]; paging: PageInfo }> {
  authorize(viewer, "read", "Tender");
  const db = await getDb();
  await closeDueTenders(db);
  const where = and(
    readableTenders(viewer),
    query.state ? eq(tenders.state, query.state) : undefined,
    query.q ? or(ilike(tenders.reference, containing(query.q)), ilike(tenders.title, containing(query.q))) : undefined,
  );
  const [{ n }] = await db.select({ n: count() }).from(tenders).where(where);
  const window = pageWindow(n, query);
  const rows = n === 0 ? [] : await tendersWhere(db, where, { limit: window.pageSize, offset: window.offset });
  // The database applied the rules; each row is checked again by CASL itself, so a gap in the SQL form can only hide, never show.
  return { tenders: rows.filter((t) => viewer.ability.can("read", tenderSubject(t))), paging: pageInfo(window) };
}

/** One tender; 404 when it does not exist, 403 when this viewer may not see it. */
export async function getTender(viewer: Viewer, id: string): Promise<TenderWithInvites> {
  return (await getTenderWithHead(viewer, id)).tender;
}

/** Whether any open tender's closing time has come: closeDueTenders' first test, as a column. */
const anyDue = (now: Date) =>
  sql<boolean>`exists (select 1 from ${tenders} as due where due.state = 'open' and due.closes_at <= ${now.toISOString()}::timestamptz)`;
/** The sequence number of a tender's newest ledger entry (0 before any), read from the (tender_id, seq) index. */
const ledgerHeadOf = sql<number>`(select coalesce(max(${ledgerEntries.seq}), 0) from ${ledgerEntries} where ${ledgerEntries.tenderId} = ${tenders.id})`;

/**
 * getTender, with the seq of the tender's newest ledger entry (what caches of its derived views
 * key on). One round trip in the usual case: the tender, its invitations, its ledger head and
 * whether any tender is due to close; only when one is does it close them and read again.
 */
export async function getTenderWithHead(viewer: Viewer, id: string): Promise<{ tender: TenderWithInvites; head: number }> {
  const db = await getDb();
  const now = new Date();
  const read = () =>
    db
      .select({ tender: tenders, invitedOrgIds, head: ledgerHeadOf, due: anyDue(now) })
      .from(tenders)
      .where(eq(tenders.id, id));
  let [row] = await read();
  if (row?.due) {
    await closeDueTenders(db, now);
    [row] = await read();
  }
  if (!row) throw new NotFoundError("No such tender.");
  const tender = { ...row.tender, invitedOrgIds: row.invitedOrgIds };
  authorize(viewer, "read", tenderSubject(tender), "You are not invited to this tender.");
  return { tender, head: Number(row.head) };
}

/** Strips the invitations down to the organisations this viewer may read: a vendor sees only its own. */
async function viewsOf(viewer: Viewer, list: TenderWithInvites[]): Promise<TenderView[]> {
  const ids = [...new Set(list.flatMap((t) => t.invitedOrgIds))];
  const db = await getDb();
  const orgs = ids.length ? await db.select().from(organisations).where(inArray(organisations.id, ids)) : [];
  const readable = new Map(orgs.filter((o) => viewer.ability.can("read", asSubject("Organisation", { id: o.id, kind: o.kind }))).map((o) => [o.id, o.name]));
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

/** listTenderPage, fit to send out: the API's answer. */
export async function listTenderViewPage(viewer: Viewer, query: PagingInput & TenderListFilters): Promise<{ tenders: TenderView[] } & PageInfo> {
  const { tenders: list, paging } = await listTenderPage(viewer, query);
  return { tenders: await viewsOf(viewer, list), ...paging };
}

/** getTender, fit to send out. */
export async function getTenderView(viewer: Viewer, id: string): Promise<TenderView> {
  const [view] = await viewsOf(viewer, [await getTender(viewer, id)]);
  return view;
}

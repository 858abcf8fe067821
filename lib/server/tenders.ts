import "server-only";
import { asc, desc, eq, inArray } from "drizzle-orm";
import { asSubject } from "@/policies";
import { getDb, type Queryable } from "@/db/client";
import { tenderInvitations, tenders } from "@/db/schema";
import { listLedger } from "./ledger";
import { authorize, type Viewer } from "./session";
import { NotFoundError } from "./errors";

export type TenderRow = typeof tenders.$inferSelect;
export type TenderWithInvites = TenderRow & { invitedOrgIds: string[] };

async function withInvites(db: Queryable, rows: TenderRow[]): Promise<TenderWithInvites[]> {
  if (rows.length === 0) return [];
  const invites = await db
    .select()
    .from(tenderInvitations)
    .where(inArray(tenderInvitations.tenderId, rows.map((r) => r.id)));
  return rows.map((row) => ({
    ...row,
    invitedOrgIds: invites.filter((i) => i.tenderId === row.id).map((i) => i.organisationId),
  }));
}

export const tenderSubject = (t: TenderWithInvites) =>
  asSubject("Tender", { id: t.id, state: t.state, createdBy: t.createdBy, invitedOrgIds: t.invitedOrgIds });

/** The tenders this viewer may read, newest first. */
export async function listTenders(viewer: Viewer): Promise<TenderWithInvites[]> {
  authorize(viewer, "read", "Tender");
  const db = await getDb();
  const rows = await withInvites(db, await db.select().from(tenders).orderBy(desc(tenders.createdAt), asc(tenders.reference)));
  return rows.filter((t) => viewer.ability.can("read", tenderSubject(t)));
}

/** One tender; 404 when it does not exist, 403 when this viewer may not see it. */
export async function getTender(viewer: Viewer, id: string): Promise<TenderWithInvites> {
  const db = await getDb();
  const [row] = await db.select().from(tenders).where(eq(tenders.id, id));
  if (!row) throw new NotFoundError("No such tender.");
  const [tender] = await withInvites(db, [row]);
  authorize(viewer, "read", tenderSubject(tender), "You are not invited to this tender.");
  return tender;
}

export async function getTenderLedger(viewer: Viewer, tenderId: string) {
  await getTender(viewer, tenderId);
  authorize(viewer, "read", asSubject("Ledger", { tenderId }), "Only the buying team reads a tender's ledger.");
  return listLedger(await getDb(), tenderId);
}

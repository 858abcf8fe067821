import "server-only";
import { and, eq, inArray, like, sql } from "drizzle-orm";
import { asSubject, cancelKeepsSeal } from "@/policies";
import { getDb, type Queryable } from "./database";
import { ADVISORY_LOCKS } from "@/db/locks";
import { organisations, tenderInvitations, tenders } from "@/db/schema";
import { changedFields, draftInput, draftValues } from "@/lib/tenders/draft";
import { cancellationNotice, invitationNotice } from "@/lib/tenders/notices";
import { nextReference } from "@/lib/tenders/reference";
import { editProblem, moveProblem, openingProblems } from "@/lib/tenders/states";
import { tenderInputSchema, type CancelTenderInput, type TenderInput, type TenderPatch } from "@/lib/validation/tender";
import { describeZodError, fieldErrorsOf } from "@/lib/validation/messages";
import { appUrl } from "./auth";
import { appendLedger } from "./ledger";
import { addressesOf, addressesWithRole, notify } from "./notify";
import { withLedgerHead } from "./ledger-anchors";
import { authorize, ledgerActor, type Viewer } from "./session";
import { getTender, tenderSubject, tendersWhere, type TenderWithInvites } from "./tenders";
import { ConflictError, InputError } from "./errors";

/** Invitations go to vendor organisations only; their names, sorted, for the ledger. */
async function checkInvitations(db: Queryable, ids: string[]): Promise<string[]> {
  if (ids.length === 0) return [];
  const found = await db.select().from(organisations).where(inArray(organisations.id, ids));
  const vendors = new Map(found.filter((o) => o.kind === "vendor").map((o) => [o.id, o.name]));
  if (ids.some((id) => !vendors.has(id))) {
    throw new InputError("Only vendor organisations can be invited.", { invitedOrgIds: ["Choose vendor organisations only."] });
  }
  return [...vendors.values()].sort();
}

async function reload(db: Queryable, id: string): Promise<TenderWithInvites> {
  return (await tendersWhere(db, eq(tenders.id, id)))[0];
}

type TenderAction = "update" | "open" | "cancel";
const VERBS: Record<TenderAction, string> = { update: "edits", open: "opens", cancel: "cancels" };

/**
 * The order of the checks for a change to a tender: seen at all (404/403), the role (403), the
 * state (409, with the rule's words), then the record itself (403).
 */
async function tenderFor(viewer: Viewer, id: string, action: TenderAction, problemOf: (t: TenderWithInvites) => string | null) {
  const tender = await getTender(viewer, id);
  authorize(viewer, action, "Tender", `Only the buying team ${VERBS[action]} tenders.`);
  const problem = problemOf(tender);
  if (problem) throw new ConflictError(problem);
  authorize(viewer, action, tenderSubject(tender));
  return tender;
}

/** A new draft, numbered RC-<year>-<sequence>, created by the buyer. */
export async function createTender(viewer: Viewer, input: TenderInput): Promise<TenderWithInvites> {
  authorize(viewer, "create", asSubject("Tender", { id: "", state: "draft", createdBy: viewer.actor.id, invitedOrgIds: input.invitedOrgIds }));
  const db = await getDb();
  const invited = await checkInvitations(db, input.invitedOrgIds);
  const id = await db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(${ADVISORY_LOCKS.tenderReference})`);
    const year = new Date().getUTCFullYear();
    const taken = await tx
      .select({ reference: tenders.reference })
      .from(tenders)
      .where(like(tenders.reference, `RC-${year}-%`));
    const reference = nextReference(
      taken.map((t) => t.reference),
      year,
    );
    const [row] = await tx
      .insert(tenders)
      .values({ ...draftValues(input), reference, state: "draft", createdBy: viewer.actor.id })
      .returning();
    if (input.invitedOrgIds.length) {
      await tx.insert(tenderInvitations).values(input.invitedOrgIds.map((organisationId) => ({ tenderId: row.id, organisationId })));
    }
    await appendLedger(tx, {
      tenderId: row.id,
      actor: ledgerActor(viewer),
      action: "tender.created",
      subjectType: "Tender",
      subjectId: row.id,
      data: { reference, title: row.title, invited, invitedOrgIds: [...input.invitedOrgIds].sort() },
    });
    return row.id;
  });
  return reload(db, id);
}

/** Changes a draft (409 once open); the merged draft is checked whole, so a partial change cannot break it. */
export async function updateTender(viewer: Viewer, id: string, patch: TenderPatch): Promise<TenderWithInvites> {
  const tender = await tenderFor(viewer, id, "update", (t) => editProblem(t.state));

  const before = draftInput(tender);
  const parsed = tenderInputSchema.safeParse({ ...before, ...patch });
  if (!parsed.success) throw new InputError(describeZodError(parsed.error), fieldErrorsOf(parsed.error));
  const after = parsed.data;
  const db = await getDb();
  await checkInvitations(db, after.invitedOrgIds);
  const changes = changedFields(before, after);
  if (Object.keys(changes).length === 0) return tender;

  await db.transaction(async (tx) => {
    const updated = await tx
      .update(tenders)
      .set(draftValues(after))
      .where(and(eq(tenders.id, id), eq(tenders.state, "draft")))
      .returning({ id: tenders.id });
    if (updated.length === 0) throw new ConflictError("The tender left the draft state meanwhile: nothing was changed.");
    if (changes.invitedOrgIds) {
      await tx.delete(tenderInvitations).where(eq(tenderInvitations.tenderId, id));
      if (after.invitedOrgIds.length) {
        await tx.insert(tenderInvitations).values(after.invitedOrgIds.map((organisationId) => ({ tenderId: id, organisationId })));
      }
    }
    await appendLedger(tx, {
      tenderId: id,
      actor: ledgerActor(viewer),
      action: "tender.updated",
      subjectType: "Tender",
      subjectId: id,
      data: { reference: tender.reference, fields: Object.keys(changes).sort(), changes },
    });
  });
  return reload(db, id);
}

/** Draft -> open: locks requirements and weights, and invites the vendors by e-mail. */
export async function openTender(viewer: Viewer, id: string): Promise<TenderWithInvites> {
  const tender = await tenderFor(viewer, id, "open", (t) => {
    const problems = openingProblems(t, new Date());
    return problems.length ? `The tender cannot open yet. ${problems.join(" ")}` : null;
  });

  const db = await getDb();
  const invited = await checkInvitations(db, tender.invitedOrgIds);
  const opened = await db.transaction(async (tx) => {
    const [row] = await tx
      .update(tenders)
      .set({ state: "open", openedAt: new Date() })
      .where(and(eq(tenders.id, id), eq(tenders.state, "draft")))
      .returning();
    if (!row) throw new ConflictError("The tender is no longer a draft.");
    await appendLedger(tx, {
      tenderId: id,
      actor: ledgerActor(viewer),
      action: "tender.opened",
      subjectType: "Tender",
      subjectId: id,
      data: {
        reference: row.reference,
        invited,
        invitedOrgIds: [...tender.invitedOrgIds].sort(),
        closesAt: row.closesAt.toISOString(),
        closesZone: row.closesZone,
        weights: row.weights,
      },
    });
    return row;
  });

  const addresses = await addressesOf(db, tender.invitedOrgIds);
  const notice = invitationNotice(opened, appUrl());
  notify(
    await withLedgerHead(
      db,
      addresses.map((address) => ({ to: [address], ...notice })),
    ),
  );
  return reload(db, id);
}

/** Any state before the award -> cancelled, with the reason told to the vendors and the buying team. */
export async function cancelTender(viewer: Viewer, id: string, input: CancelTenderInput): Promise<TenderWithInvites> {
  const tender = await tenderFor(viewer, id, "cancel", (t) => moveProblem(t.state, "cancelled"));

  const db = await getDb();
  // Closing on read has already run: a tender still open here never reached its closing time.
  const offersStaySealed = cancelKeepsSeal(tender.state);
  const cancelled = await db.transaction(async (tx) => {
    const [row] = await tx
      .update(tenders)
      .set({ state: "cancelled", cancelReason: input.reason, cancelledSealed: offersStaySealed })
      .where(and(eq(tenders.id, id), eq(tenders.state, tender.state)))
      .returning();
    if (!row) throw new ConflictError("The tender changed state meanwhile: try again.");
    await appendLedger(tx, {
      tenderId: id,
      actor: ledgerActor(viewer),
      action: "tender.cancelled",
      subjectType: "Tender",
      subjectId: id,
      data: { reference: row.reference, from: tender.state, reason: input.reason, offersSealed: offersStaySealed },
    });
    return row;
  });

  // Vendors heard of the tender only if it was opened; a cancelled draft concerns the buying team alone.
  const vendors = tender.state === "draft" ? [] : await addressesOf(db, tender.invitedOrgIds);
  const team = await addressesWithRole(db, "buyer");
  const notice = cancellationNotice(cancelled, input.reason, appUrl());
  notify(
    await withLedgerHead(
      db,
      [...new Set([...vendors, ...team])].map((address) => ({ to: [address], ...notice })),
    ),
  );
  return reload(db, id);
}

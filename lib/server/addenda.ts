import "server-only";
import { and, eq } from "drizzle-orm";
import { asSubject } from "@/policies";
import { getDb, type Queryable } from "./database";
import { addenda, addendumAcknowledgements, organisations, threads } from "@/db/schema";
import { numbered, publishProblem, unacknowledgedProblem } from "@/lib/tenders/addenda";
import type { AddendumInput } from "@/lib/validation/notices";
import { ConflictError, InputError, NotFoundError } from "./errors";
import { appendLedger } from "./ledger";
import { addressesOf, notify } from "./notify";
import { authorize, ledgerActor, type Viewer } from "./session";
import { getTender, type TenderWithInvites } from "./tenders";

const addendumSubject = (tender: TenderWithInvites) => asSubject("Addendum", { tenderId: tender.id, invitedOrgIds: tender.invitedOrgIds });

async function addendaOf(db: Queryable, tenderId: string) {
  const rows = await db.select().from(addenda).where(eq(addenda.tenderId, tenderId));
  const acks = await db
    .select({
      addendumId: addendumAcknowledgements.addendumId,
      vendorOrgId: addendumAcknowledgements.vendorOrgId,
      vendorName: organisations.name,
      at: addendumAcknowledgements.acknowledgedAt,
    })
    .from(addendumAcknowledgements)
    .innerJoin(addenda, eq(addenda.id, addendumAcknowledgements.addendumId))
    .innerJoin(organisations, eq(organisations.id, addendumAcknowledgements.vendorOrgId))
    .where(eq(addenda.tenderId, tenderId));
  return numbered(rows).map((a) => ({ ...a, acks: acks.filter((k) => k.addendumId === a.id) }));
}

/** The addenda of a tender; a vendor sees whether its organisation acknowledged each, the buying side who did. */
export async function listAddenda(viewer: Viewer, tenderId: string) {
  const tender = await getTender(viewer, tenderId);
  authorize(viewer, "list", addendumSubject(tender), "Addenda are read by the invited vendors and the evaluation team.");
  const vendor = viewer.actor.organisationKind === "vendor";
  const list = await addendaOf(await getDb(), tenderId);
  return {
    mayPublish: viewer.ability.can("create", addendumSubject(tender)) && publishProblem(tender.state) === null,
    addenda: list.map((a) => ({
      id: a.id,
      number: a.number,
      title: a.title,
      body: a.body,
      publishedAt: a.publishedAt,
      // The thread it answers would name the asker: the buying side only.
      ...(vendor
        ? { acknowledgedAt: a.acks.find((k) => k.vendorOrgId === viewer.actor.organisationId)?.at ?? null }
        : { threadId: a.threadId, acknowledgedBy: a.acks.map((k) => k.vendorName).sort() }),
    })),
  };
}

/** The buyer or a declared engineer publishes an addendum to every invited vendor, without the asker's name. */
export async function publishAddendum(viewer: Viewer, tenderId: string, input: AddendumInput) {
  const tender = await getTender(viewer, tenderId);
  authorize(viewer, "create", "Addendum", "Only the buyer or an engineer declared on the tender publishes addenda.");
  const problem = publishProblem(tender.state);
  if (problem) throw new ConflictError(problem);
  authorize(viewer, "create", addendumSubject(tender), "Declare on this tender before you publish an addendum to it.");
  const db = await getDb();
  if (input.threadId) {
    const [thread] = await db
      .select({ id: threads.id })
      .from(threads)
      .where(and(eq(threads.id, input.threadId), eq(threads.tenderId, tenderId)));
    if (!thread) throw new InputError("That clarification thread is not one of this tender's.", { threadId: ["Choose a thread of this tender, or none."] });
  }
  const row = await db.transaction(async (tx) => {
    const [inserted] = await tx
      .insert(addenda)
      .values({ tenderId, threadId: input.threadId ?? null, title: input.title, body: input.body, publishedBy: viewer.actor.id })
      .returning();
    await appendLedger(tx, {
      tenderId,
      actor: ledgerActor(viewer),
      action: "addendum.published",
      subjectType: "Addendum",
      subjectId: inserted.id,
      data: { title: input.title, threadId: input.threadId ?? null, invited: tender.invitedOrgIds.length },
    });
    return inserted;
  });
  const ask = tender.state === "open" ? "Acknowledge it on the Notices tab before you submit or resubmit your offer" : "Read it on the Notices tab";
  const notice = {
    subject: `${tender.reference}: addendum "${input.title}"`,
    text: `An addendum to tender ${tender.reference} "${tender.title}" was published to every invited vendor:\n\n${input.title}\n\n${input.body}\n\n${ask}: /tenders/${tenderId}/notices`,
  };
  // One e-mail per address, so that no bidder learns who else was invited.
  notify((await addressesOf(db, tender.invitedOrgIds, "vendor")).map((address) => ({ to: [address], ...notice })));
  return { id: row.id, publishedAt: row.publishedAt };
}

/** A vendor acknowledges an addendum for its organisation; acknowledging again changes nothing. */
export async function acknowledgeAddendum(viewer: Viewer, addendumId: string) {
  const db = await getDb();
  const [row] = await db.select().from(addenda).where(eq(addenda.id, addendumId));
  if (!row) throw new NotFoundError("No such addendum.");
  const tender = await getTender(viewer, row.tenderId);
  authorize(viewer, "acknowledge", addendumSubject(tender), "Only an invited vendor acknowledges an addendum.");
  const vendorOrgId = viewer.actor.organisationId;
  await db.transaction(async (tx) => {
    const added = await tx
      .insert(addendumAcknowledgements)
      .values({ addendumId, vendorOrgId, acknowledgedBy: viewer.actor.id })
      .onConflictDoNothing()
      .returning();
    if (added.length === 0) return;
    await appendLedger(tx, {
      tenderId: row.tenderId,
      actor: ledgerActor(viewer),
      action: "addendum.acknowledged",
      subjectType: "Addendum",
      subjectId: addendumId,
      data: { title: row.title, vendor: viewer.organisationName, vendorOrgId },
    });
  });
  return { addendumId, acknowledged: true };
}

/** Refuses (409) a submission while the vendor has addenda of the tender it has not acknowledged. */
export async function requireAddendaAcknowledged(db: Queryable, tenderId: string, vendorOrgId: string): Promise<void> {
  const list = await addendaOf(db, tenderId);
  const problem = unacknowledgedProblem(list.filter((a) => !a.acks.some((k) => k.vendorOrgId === vendorOrgId)));
  if (problem) throw new ConflictError(problem);
}

export type AddendaView = Awaited<ReturnType<typeof listAddenda>>;

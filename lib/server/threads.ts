import "server-only";
import { and, asc, eq, inArray, isNull } from "drizzle-orm";
import { asSubject, recordTenderState, type RecordTenderState } from "@/policies";
import { getDb, type Queryable } from "./database";
import { claims, tenders, threadMessages, threads } from "@/db/schema";
import { publishProblem } from "@/lib/tenders/addenda";
import type { CloseThreadInput, MessageInput, ThreadInput } from "@/lib/validation/review";
import { ConflictError, ForbiddenError, NotFoundError } from "./errors";
import { appendLedger } from "./ledger";
import { addressesOf, notify, readersWithRole, type Notice } from "./notify";
import { withLedgerHead } from "./ledger-anchors";
import { loadClaim } from "./review";
import { authorize, ledgerActor, type Viewer } from "./session";

type ThreadRow = typeof threads.$inferSelect;
type ClaimRow = typeof claims.$inferSelect;
type TenderRow = typeof tenders.$inferSelect;

const threadSubject = (t: Pick<ThreadRow, "id" | "tenderId" | "vendorOrgId"> & { tenderState?: RecordTenderState }) =>
  asSubject("Thread", { id: t.id, tenderId: t.tenderId, vendorOrgId: t.vendorOrgId, tenderState: t.tenderState });
/** Evaluators sign with their name; the vendor sees who asked. */
const authorLabel = (viewer: Viewer) => `${viewer.name}, ${viewer.organisationName}`;
/** Questions are asked during technical evaluation; answers may follow until the award. */
const CLOSED_STATES = ["awarded", "cancelled"];

/** Whether the viewer may publish this thread's answer to every bidder as an addendum (see lib/server/addenda.ts). */
const mayPublishFrom = (viewer: Viewer, tender: TenderRow) =>
  publishProblem(tender.state) === null && viewer.ability.can("create", asSubject("Addendum", { tenderId: tender.id, invitedOrgIds: [] }));

/** Inserts a thread with its first message and the ledger entry; call inside the caller's transaction. */
export async function insertThread(tx: Queryable, viewer: Viewer, claim: ClaimRow, input: ThreadInput) {
  const [thread] = await tx
    .insert(threads)
    .values({ tenderId: claim.tenderId, vendorOrgId: claim.vendorOrgId, claimId: claim.id, subject: input.subject, createdBy: viewer.actor.id })
    .returning();
  await tx.insert(threadMessages).values({ threadId: thread.id, authorId: viewer.actor.id, authorLabel: authorLabel(viewer), body: input.body });
  await appendLedger(tx, {
    tenderId: claim.tenderId,
    actor: ledgerActor(viewer),
    action: "thread.opened",
    subjectType: "Thread",
    subjectId: thread.id,
    data: { subject: input.subject, claimId: claim.id, point: claim.pointLabel },
  });
  return thread;
}

/**
 * The e-mail for a new message: to the vendor's users, or, when the vendor answers, to the engineers
 * who may read this thread (declared on the tender, no conflict with this vendor).
 */
export async function threadNotice(
  db: Queryable,
  tender: TenderRow,
  thread: ThreadRow,
  viewer: Viewer,
  body: string,
  audience: "vendor" | "engineers",
): Promise<Notice> {
  const toVendor = audience === "vendor";
  const link = toVendor || !thread.claimId ? `/tenders/${tender.id}/review` : `/review/claims/${thread.claimId}`;
  const subject = threadSubject({ ...thread, tenderState: recordTenderState(tender) });
  return {
    to: toVendor ? await addressesOf(db, [thread.vendorOrgId]) : await readersWithRole(db, "engineer", (ability) => ability.can("read", subject)),
    subject: `${tender.reference}: ${toVendor ? "question from the evaluators" : "vendor answer"}: ${thread.subject}`,
    text: `${authorLabel(viewer)} wrote on "${thread.subject}" (${tender.reference} ${tender.title}):\n\n${body}\n\nReply in Ratecourt: ${link}`,
  };
}

/** An engineer opens a clarification thread on a claim without marking it. */
export async function openThread(viewer: Viewer, claimId: string, input: ThreadInput) {
  const { claim, tender } = await loadClaim(viewer, claimId);
  authorize(
    viewer,
    "create",
    threadSubject({ id: "", tenderId: claim.tenderId, vendorOrgId: claim.vendorOrgId }),
    "Only an engineer who has declared on this tender asks vendors questions.",
  );
  if (tender.state !== "technical") throw new ConflictError("Questions are asked only during technical evaluation.");
  const db = await getDb();
  const thread = await db.transaction((tx) => insertThread(tx, viewer, claim, input));
  notify(await withLedgerHead(db, await threadNotice(db, tender, thread, viewer, input.body, "vendor")));
  return thread;
}

async function loadThread(viewer: Viewer, threadId: string) {
  const db = await getDb();
  const [row] = await db
    .select({ thread: threads, tender: tenders })
    .from(threads)
    .innerJoin(tenders, eq(tenders.id, threads.tenderId))
    .where(eq(threads.id, threadId));
  if (!row) throw new NotFoundError("No such thread.");
  if (!viewer.ability.can("read", threadSubject(row.thread))) {
    // Another vendor's thread, or one hidden by a declared conflict, does not exist for this viewer.
    if (viewer.actor.organisationKind === "vendor" || viewer.ability.can("list", "Thread")) throw new NotFoundError("No such thread.");
    throw new ForbiddenError("Clarification threads are between the engineers and the vendor.");
  }
  return row;
}

/** Whether this viewer may write in the thread, and close it (an evaluator, while it is open). */
function mayOn(viewer: Viewer, thread: ThreadRow, tender: TenderRow) {
  const live = !CLOSED_STATES.includes(tender.state);
  return {
    mayPost: live && viewer.ability.can("post", threadSubject(thread)),
    mayClose: live && thread.closedAt === null && viewer.ability.can("update", threadSubject(thread)),
  };
}

const messagesOf = async (db: Queryable, ids: string[]) =>
  ids.length ? db.select().from(threadMessages).where(inArray(threadMessages.threadId, ids)).orderBy(asc(threadMessages.createdAt)) : [];

/** One thread with its messages, oldest first. */
export async function getThread(viewer: Viewer, threadId: string) {
  const { thread, tender } = await loadThread(viewer, threadId);
  const db = await getDb();
  return {
    ...thread,
    tenderReference: tender.reference,
    messages: await messagesOf(db, [thread.id]),
    ...mayOn(viewer, thread, tender),
    mayPublishAddendum: mayPublishFrom(viewer, tender),
  };
}
export type ThreadDetail = Awaited<ReturnType<typeof getThread>>;

/** The threads of a tender or of one claim that this viewer may read, each with its messages. */
export async function listThreads(viewer: Viewer, where: { tenderId?: string; claimId?: string }): Promise<ThreadDetail[]> {
  authorize(viewer, "list", "Thread", "Clarification threads are between the engineers and the vendor.");
  const db = await getDb();
  const rows = await db
    .select({ thread: threads, tender: tenders })
    .from(threads)
    .innerJoin(tenders, eq(tenders.id, threads.tenderId))
    .where(and(where.tenderId ? eq(threads.tenderId, where.tenderId) : undefined, where.claimId ? eq(threads.claimId, where.claimId) : undefined))
    .orderBy(asc(threads.createdAt));
  const visible = rows.filter((r) => viewer.ability.can("list", threadSubject(r.thread)));
  const messages = await messagesOf(
    db,
    visible.map((r) => r.thread.id),
  );
  return visible.map(({ thread, tender }) => ({
    ...thread,
    tenderReference: tender.reference,
    messages: messages.filter((m) => m.threadId === thread.id),
    ...mayOn(viewer, thread, tender),
    mayPublishAddendum: mayPublishFrom(viewer, tender),
  }));
}

/** A message from either side; the other side gets an e-mail after the commit. */
export async function postMessage(viewer: Viewer, threadId: string, input: MessageInput) {
  const { thread, tender } = await loadThread(viewer, threadId);
  authorize(viewer, "post", threadSubject(thread), "You may read this thread but not write in it.");
  if (CLOSED_STATES.includes(tender.state)) throw new ConflictError("The tender is closed: its threads take no more messages.");
  const db = await getDb();
  const fromVendor = viewer.actor.organisationKind === "vendor";
  const message = await db.transaction(async (tx) => {
    const [row] = await tx
      .insert(threadMessages)
      .values({ threadId, authorId: viewer.actor.id, authorLabel: authorLabel(viewer), body: input.body })
      .returning();
    await appendLedger(tx, {
      tenderId: thread.tenderId,
      actor: ledgerActor(viewer),
      action: "thread.message",
      subjectType: "Thread",
      subjectId: threadId,
      data: { from: fromVendor ? "vendor" : "evaluators", length: input.body.length },
    });
    return row;
  });
  notify(await withLedgerHead(db, await threadNotice(db, tender, thread, viewer, input.body, fromVendor ? "engineers" : "vendor")));
  return message;
}

/**
 * An evaluator closes a question with a reason (answered elsewhere, no longer needed): the
 * technical sign-off waits for every question to be answered or closed. The vendor reads the reason.
 */
export async function closeThread(viewer: Viewer, threadId: string, input: CloseThreadInput) {
  const { thread, tender } = await loadThread(viewer, threadId);
  authorize(viewer, "update", threadSubject(thread), "Only an engineer who has declared on this tender closes its questions.");
  if (CLOSED_STATES.includes(tender.state)) throw new ConflictError("The tender is closed: its threads stay as they are.");
  if (thread.closedAt) throw new ConflictError("This question is already closed.");
  const db = await getDb();
  const closed = await db.transaction(async (tx) => {
    const [row] = await tx
      .update(threads)
      .set({ closedAt: new Date(), closedBy: viewer.actor.id, closeReason: input.reason })
      .where(and(eq(threads.id, threadId), isNull(threads.closedAt)))
      .returning();
    if (!row) throw new ConflictError("This question was closed meanwhile.");
    await appendLedger(tx, {
      tenderId: thread.tenderId,
      actor: ledgerActor(viewer),
      action: "thread.closed",
      subjectType: "Thread",
      subjectId: threadId,
      data: { reason: input.reason },
    });
    return row;
  });
  notify(await threadNotice(db, tender, thread, viewer, `The question was closed: ${input.reason}`, "vendor"));
  return closed;
}

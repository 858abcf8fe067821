import "server-only";
import { asc, eq } from "drizzle-orm";
import { asSubject } from "@/policies";
import { getDb } from "./database";
import { marks } from "@/db/schema";
import type { MarkInput } from "@/lib/validation/review";
import { markProblem } from "@/lib/review/marks";
import { ConflictError, InputError } from "./errors";
import { appendLedger } from "./ledger";
import { notify } from "./notify";
import { withLedgerHead } from "./ledger-anchors";
import { claimSubject, loadClaim } from "./review";
import { authorize, ledgerActor, type Viewer } from "./session";
import { insertThread, threadNotice } from "./threads";

/** Every mark of a claim, oldest first; a claim's current mark is its latest. */
export async function listMarks(viewer: Viewer, claimId: string) {
  const { claim } = await loadClaim(viewer, claimId);
  authorize(viewer, "read", asSubject("Mark", { claimId, tenderId: claim.tenderId, vendorOrgId: claim.vendorOrgId }));
  const db = await getDb();
  return db.select().from(marks).where(eq(marks.claimId, claimId)).orderBy(asc(marks.markedAt));
}

/**
 * An engineer marks a claim during technical evaluation. Accepting a claim the engine proved
 * impossible needs a written justification. A clarification request opens a thread with the
 * vendor in the same transaction, its first message being the comment.
 */
export async function createMark(viewer: Viewer, claimId: string, input: MarkInput) {
  const { claim, tender, vendorName } = await loadClaim(viewer, claimId);
  authorize(viewer, "mark", claimSubject(claim), "Only an engineer who has declared on this tender marks its claims.");
  if (tender.state !== "technical") throw new ConflictError("Claims are marked only while the tender is in technical evaluation.");
  const problem = markProblem(input.mark, input.comment, claim.verdict);
  if (problem) throw new InputError(problem, { comment: [problem] });
  const clarify = input.mark === "clarification-requested";
  if (clarify) authorize(viewer, "create", asSubject("Thread", { id: "", tenderId: claim.tenderId, vendorOrgId: claim.vendorOrgId }));
  const db = await getDb();
  const outcome = await db.transaction(async (tx) => {
    const [mark] = await tx
      .insert(marks)
      .values({ claimId, tenderId: claim.tenderId, vendorOrgId: claim.vendorOrgId, mark: input.mark, comment: input.comment, markedBy: viewer.actor.id })
      .returning();
    await appendLedger(tx, {
      tenderId: claim.tenderId,
      actor: ledgerActor(viewer),
      action: "claim.marked",
      subjectType: "Claim",
      subjectId: claimId,
      data: { mark: input.mark, comment: input.comment, vendor: vendorName, point: claim.pointLabel },
    });
    const thread = clarify ? await insertThread(tx, viewer, claim, { subject: input.subject!, body: input.comment }) : null;
    return { mark, thread };
  });
  if (outcome.thread) notify(await withLedgerHead(db, await threadNotice(db, tender, outcome.thread, viewer, input.comment, "vendor")));
  return { ...outcome.mark, threadId: outcome.thread?.id ?? null };
}

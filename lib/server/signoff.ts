import "server-only";
import { and, asc, eq, inArray, isNull } from "drizzle-orm";
import { asSubject } from "@/policies";
import { getDb, type Queryable } from "./database";
import { claims, evidenceRuns, marks, offers, organisations, technicalSignoffs, tenders, threadMessages, threads, users } from "@/db/schema";
import { summariseRuns } from "@/lib/review/evidence";
import { latestMarks } from "@/lib/review/marks";
import { checkSignoff, signaturesNeeded, type SignoffClaim } from "@/lib/review/signoff";
import { withSafetyCaution } from "@/lib/tenders/safety";
import type { SignoffInput } from "@/lib/validation/review";
import { ConflictError } from "./errors";
import { appendLedger } from "./ledger";
import { addressesWithRole, notify } from "./notify";
import { withLedgerHead } from "./ledger-anchors";
import { authorize, ledgerActor, type Viewer } from "./session";
import { getTender, type TenderRow } from "./tenders";

/** Claims of current offers with their current mark and counted lab evidence: what the sign-off waits for. */
async function reviewedClaims(db: Queryable, tender: Pick<TenderRow, "id" | "channelModel">): Promise<SignoffClaim[]> {
  const rows = await db
    .select({ id: claims.id, channelValue: claims.channelValue })
    .from(claims)
    .innerJoin(offers, eq(offers.id, claims.offerId))
    .where(and(eq(claims.tenderId, tender.id), eq(offers.status, "submitted")));
  const ids = rows.map((r) => r.id);
  if (ids.length === 0) return [];
  const latest = latestMarks(await db.select().from(marks).where(inArray(marks.claimId, ids)));
  const runs = await db
    .select({ claimId: evidenceRuns.claimId, channelValue: evidenceRuns.channelValue, status: evidenceRuns.status })
    .from(evidenceRuns)
    .where(inArray(evidenceRuns.claimId, ids));
  return rows.map((c) => ({
    id: c.id,
    mark: latest.get(c.id)?.mark ?? null,
    evidence: summariseRuns(
      tender.channelModel,
      c.channelValue,
      runs.filter((r) => r.claimId === c.id),
    ),
  }));
}

/** Questions to vendors still waiting: not closed, and the last word is the evaluators'. */
export async function countOpenThreads(db: Queryable, tenderId: string): Promise<number> {
  const open = await db
    .select({ id: threads.id })
    .from(threads)
    .where(and(eq(threads.tenderId, tenderId), isNull(threads.closedAt)));
  if (open.length === 0) return 0;
  const messages = await db
    .select({ threadId: threadMessages.threadId, kind: organisations.kind })
    .from(threadMessages)
    .innerJoin(users, eq(users.id, threadMessages.authorId))
    .innerJoin(organisations, eq(organisations.id, users.organisationId))
    .where(
      inArray(
        threadMessages.threadId,
        open.map((t) => t.id),
      ),
    )
    .orderBy(asc(threadMessages.createdAt), asc(threadMessages.id));
  const lastWord = new Map(messages.map((m) => [m.threadId, m.kind]));
  return open.filter((t) => lastWord.get(t.id) !== "vendor").length;
}

async function progress(db: Queryable, tender: Pick<TenderRow, "id" | "channelModel">) {
  const [claimList, openThreads] = await Promise.all([reviewedClaims(db, tender), countOpenThreads(db, tender.id)]);
  return { claims: claimList, openThreads };
}

/** The signatures so far, with the signers' names, oldest first. */
async function signatures(db: Queryable, tenderId: string) {
  return db
    .select({ signedBy: technicalSignoffs.signedBy, name: users.name, statement: technicalSignoffs.statement, signedAt: technicalSignoffs.signedAt })
    .from(technicalSignoffs)
    .innerJoin(users, eq(users.id, technicalSignoffs.signedBy))
    .where(eq(technicalSignoffs.tenderId, tenderId))
    .orderBy(asc(technicalSignoffs.signedAt));
}
export type Signature = Awaited<ReturnType<typeof signatures>>[number];

/** The signatures, if any, and whether this viewer could sign now (with the reason if not). */
export async function getSignoffState(viewer: Viewer, tenderId: string) {
  const tender = await getTender(viewer, tenderId);
  const subject = asSubject("TechnicalSignoff", { tenderId });
  authorize(viewer, "read", subject, "Declare on this tender before you see its technical sign-off.");
  const db = await getDb();
  const signed = await signatures(db, tenderId);
  const check = checkSignoff({
    tenderState: tender.state,
    safetyRelevant: tender.safetyRelevant,
    signedBy: signed.map((s) => s.signedBy),
    signerId: viewer.actor.id,
    ...(await progress(db, tender)),
  });
  return {
    signatures: signed,
    complete: signed.length >= signaturesNeeded(tender.safetyRelevant),
    safetyRelevant: tender.safetyRelevant,
    check,
    maySign: viewer.ability.can("sign", subject),
  };
}

/**
 * Signs the technical evaluation: stores the signature with its statement; with the last signature
 * needed (one, or two distinct engineers on a safety-relevant tender) it moves the tender from
 * technical to commercial evaluation, with its ledger entry in the same transaction, then tells the buyers.
 */
export async function signTechnical(viewer: Viewer, tenderId: string, input: SignoffInput) {
  const tender = await getTender(viewer, tenderId);
  authorize(viewer, "sign", asSubject("TechnicalSignoff", { tenderId }), "Only an engineer with no conflict on this tender signs its technical evaluation.");
  const db = await getDb();
  const signedAt = new Date();
  const outcome = await db.transaction(async (tx) => {
    const [locked] = await tx.select({ state: tenders.state }).from(tenders).where(eq(tenders.id, tenderId)).for("update");
    const signedBy = (await tx.select({ signedBy: technicalSignoffs.signedBy }).from(technicalSignoffs).where(eq(technicalSignoffs.tenderId, tenderId))).map(
      (s) => s.signedBy,
    );
    const check = checkSignoff({
      tenderState: locked.state,
      safetyRelevant: tender.safetyRelevant,
      signedBy,
      signerId: viewer.actor.id,
      ...(await progress(tx, tender)),
    });
    if (!check.ok) throw new ConflictError(check.reason!);
    const [row] = await tx.insert(technicalSignoffs).values({ tenderId, signedBy: viewer.actor.id, statement: input.statement, signedAt }).returning();
    const complete = signedBy.length + 1 >= check.signaturesNeeded;
    if (complete) await tx.update(tenders).set({ state: "commercial", technicalSignedAt: signedAt }).where(eq(tenders.id, tenderId));
    await appendLedger(tx, {
      tenderId,
      actor: ledgerActor(viewer),
      action: complete ? "tender.technical-signed" : "tender.technical-signature",
      subjectType: "Tender",
      subjectId: tenderId,
      data: {
        ...(complete ? { from: "technical", to: "commercial" } : {}),
        claims: check.total,
        signature: signedBy.length + 1,
        of: check.signaturesNeeded,
        statement: input.statement,
      },
    });
    return { row, complete };
  });
  if (outcome.complete) {
    notify(
      await withLedgerHead(
        db,
        withSafetyCaution(tender, [
          {
            to: await addressesWithRole(db, "buyer"),
            subject: `${tender.reference}: technical evaluation signed`,
            text: `${viewer.name} signed the technical evaluation of ${tender.reference} ${tender.title}. The commercial envelopes can now be opened.\n\nStatement: ${input.statement}\n\n/tenders/${tenderId}`,
          },
        ]),
      ),
    );
  }
  return { ...outcome.row, complete: outcome.complete };
}

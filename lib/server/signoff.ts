import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { asSubject } from "@/policies";
import { getDb, type Queryable } from "@/db/client";
import { claims, marks, offers, technicalSignoffs, tenders } from "@/db/schema";
import { checkSignoff } from "@/lib/review/signoff";
import type { SignoffInput } from "@/lib/validation/review";
import { ConflictError } from "./errors";
import { appendLedger } from "./ledger";
import { addressesWithRole, notify } from "./notify";
import { withLedgerHead } from "./ledger-anchors";
import { authorize, ledgerActor, type Viewer } from "./session";
import { getTender } from "./tenders";

/** Claims of current offers, and which of them carry a mark: what the sign-off waits for. */
async function reviewProgress(db: Queryable, tenderId: string) {
  const rows = await db
    .select({ id: claims.id })
    .from(claims)
    .innerJoin(offers, eq(offers.id, claims.offerId))
    .where(and(eq(claims.tenderId, tenderId), eq(offers.status, "submitted")));
  const ids = rows.map((r) => r.id);
  const marked = ids.length ? await db.selectDistinct({ claimId: marks.claimId }).from(marks).where(inArray(marks.claimId, ids)) : [];
  return { claimIds: ids, markedClaimIds: new Set(marked.map((m) => m.claimId)) };
}

/** The sign-off, if any, and whether this viewer could sign now (with the reason if not). */
export async function getSignoffState(viewer: Viewer, tenderId: string) {
  const tender = await getTender(viewer, tenderId);
  const subject = asSubject("TechnicalSignoff", { tenderId });
  authorize(viewer, "read", subject, "Declare on this tender before you see its technical sign-off.");
  const db = await getDb();
  const [signoff] = await db.select().from(technicalSignoffs).where(eq(technicalSignoffs.tenderId, tenderId));
  const check = checkSignoff({ tenderState: tender.state, alreadySigned: Boolean(signoff), ...(await reviewProgress(db, tenderId)) });
  return { signoff: signoff ?? null, check, maySign: viewer.ability.can("sign", subject) };
}

/**
 * Signs the technical evaluation: stores the statement, moves the tender from technical to
 * commercial evaluation with its ledger entry in the same transaction, then tells the buyers.
 */
export async function signTechnical(viewer: Viewer, tenderId: string, input: SignoffInput) {
  const tender = await getTender(viewer, tenderId);
  authorize(viewer, "sign", asSubject("TechnicalSignoff", { tenderId }), "Only an engineer with no conflict on this tender signs its technical evaluation.");
  const db = await getDb();
  const signedAt = new Date();
  const signoff = await db.transaction(async (tx) => {
    const [locked] = await tx.select({ state: tenders.state }).from(tenders).where(eq(tenders.id, tenderId)).for("update");
    const [already] = await tx.select({ tenderId: technicalSignoffs.tenderId }).from(technicalSignoffs).where(eq(technicalSignoffs.tenderId, tenderId));
    const check = checkSignoff({ tenderState: locked.state, alreadySigned: Boolean(already), ...(await reviewProgress(tx, tenderId)) });
    if (!check.ok) throw new ConflictError(check.reason!);
    const [row] = await tx.insert(technicalSignoffs).values({ tenderId, signedBy: viewer.actor.id, statement: input.statement, signedAt }).returning();
    await tx.update(tenders).set({ state: "commercial", technicalSignedAt: signedAt }).where(eq(tenders.id, tenderId));
    await appendLedger(tx, {
      tenderId,
      actor: ledgerActor(viewer),
      action: "tender.technical-signed",
      subjectType: "Tender",
      subjectId: tenderId,
      data: { from: "technical", to: "commercial", claims: check.total, statement: input.statement },
    });
    return row;
  });
  notify(await withLedgerHead(db, {
    to: await addressesWithRole(db, "buyer"),
    subject: `${tender.reference}: technical evaluation signed`,
    text: `${viewer.name} signed the technical evaluation of ${tender.reference} ${tender.title}. The commercial envelopes can now be opened.\n\nStatement: ${input.statement}\n\n/tenders/${tenderId}`,
  }));
  return signoff;
}

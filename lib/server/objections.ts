import "server-only";
import { and, asc, eq, inArray, isNull } from "drizzle-orm";
import { asSubject } from "@/policies";
import { getDb } from "./database";
import { objections, organisations, tenders } from "@/db/schema";
import { closingWords } from "@/lib/tenders/notices";
import { awardIsFinal, objectionProblem, objectionWaits, standstillEnd } from "@/lib/tenders/disclosure";
import type { ObjectionAnswerInput, ObjectionInput } from "@/lib/validation/notices";
import { ConflictError, NotFoundError } from "./errors";
import { appendLedger } from "./ledger";
import { addressesOf, notify, readersWithRole } from "./notify";
import { authorize, ledgerActor, type Viewer } from "./session";
import { getTender, type TenderRow } from "./tenders";

const objectionSubject = (tenderId: string, vendorOrgId: string) => asSubject("Objection", { tenderId, vendorOrgId });

/** Where the tender stands in its standstill period, in words a page can show. */
export function standstillOf(tender: TenderRow, now = new Date()) {
  if (tender.state !== "awarded" || !tender.awardedAt) return null;
  const ends = standstillEnd(tender.awardedAt, tender.standstillDays);
  return { days: tender.standstillDays, ends, endsWords: closingWords(ends, tender.closesZone), final: awardIsFinal(tender, now) };
}

/** The objections to a tender's award the viewer may read: all of them for the buyer, its own for a vendor. */
export async function listObjections(viewer: Viewer, tenderId: string) {
  const tender = await getTender(viewer, tenderId);
  authorize(viewer, "list", "Objection", "Objections are read by the buying team and the vendor who lodged them.");
  const db = await getDb();
  const rows = await db
    .select({ objection: objections, vendorName: organisations.name })
    .from(objections)
    .innerJoin(organisations, eq(organisations.id, objections.vendorOrgId))
    .where(eq(objections.tenderId, tenderId))
    .orderBy(asc(objections.lodgedAt));
  return {
    standstill: standstillOf(tender),
    mayLodge: viewer.ability.can("create", objectionSubject(tenderId, viewer.actor.organisationId)) && objectionProblem(tender, new Date()) === null,
    objections: rows
      .filter((r) => viewer.ability.can("read", objectionSubject(tenderId, r.objection.vendorOrgId)))
      .map((r) => ({
        id: r.objection.id,
        vendorName: r.vendorName,
        body: r.objection.body,
        lodgedAt: r.objection.lodgedAt,
        answer: r.objection.answer,
        answeredAt: r.objection.answeredAt,
        mayAnswer: r.objection.answeredAt === null && viewer.ability.can("update", objectionSubject(tenderId, r.objection.vendorOrgId)),
      })),
  };
}

/**
 * The unanswered objections still in their standstill period, counted by tender, among the tenders
 * given (the Desk's: the buyer's own tenders, or every tender for an admin).
 */
export async function waitingObjections(tenderIds: string[], now = new Date()): Promise<Map<string, number>> {
  const waiting = new Map<string, number>();
  if (tenderIds.length === 0) return waiting;
  const db = await getDb();
  const rows = await db
    .select({
      answeredAt: objections.answeredAt,
      tender: { id: tenders.id, state: tenders.state, awardedAt: tenders.awardedAt, standstillDays: tenders.standstillDays },
    })
    .from(objections)
    .innerJoin(tenders, eq(tenders.id, objections.tenderId))
    .where(and(inArray(objections.tenderId, tenderIds), isNull(objections.answeredAt)));
  for (const r of rows) if (objectionWaits(r, r.tender, now)) waiting.set(r.tender.id, (waiting.get(r.tender.id) ?? 0) + 1);
  return waiting;
}

/** The buying team answers an objection in writing, once; the vendor is told and the ledger records it. */
export async function answerObjection(viewer: Viewer, objectionId: string, input: ObjectionAnswerInput, now = new Date()) {
  const db = await getDb();
  const [found] = await db.select().from(objections).where(eq(objections.id, objectionId));
  if (!found) throw new NotFoundError("No such objection.");
  const tender = await getTender(viewer, found.tenderId);
  authorize(viewer, "update", objectionSubject(found.tenderId, found.vendorOrgId), "Only a buyer answers an objection to an award.");
  const row = await db.transaction(async (tx) => {
    const [answered] = await tx
      .update(objections)
      .set({ answer: input.answer, answeredBy: viewer.actor.id, answeredAt: now })
      .where(and(eq(objections.id, objectionId), isNull(objections.answeredAt)))
      .returning();
    if (!answered) throw new ConflictError("This objection has already been answered: read the answer on the Notices tab.");
    await appendLedger(tx, {
      tenderId: found.tenderId,
      actor: ledgerActor(viewer),
      action: "objection.answered",
      subjectType: "Objection",
      subjectId: objectionId,
      data: { vendorOrgId: found.vendorOrgId, length: input.answer.length },
    });
    return answered;
  });
  notify({
    to: await addressesOf(db, [found.vendorOrgId]),
    subject: `${tender.reference}: answer to your objection`,
    text: `The purchasing team answered your objection to the award of ${tender.reference} ${tender.title}:\n\n${input.answer}\n\n/tenders/${tender.id}/notices`,
  });
  return { id: row.id, answeredAt: row.answeredAt };
}

/** A vendor objects in writing during the standstill period; the buying team is told and the ledger records it. */
export async function lodgeObjection(viewer: Viewer, tenderId: string, input: ObjectionInput, now = new Date()) {
  const tender = await getTender(viewer, tenderId);
  authorize(viewer, "create", "Objection", "Only a vendor invited to the tender lodges an objection to its award.");
  const problem = objectionProblem(tender, now);
  if (problem) throw new ConflictError(problem);
  const vendorOrgId = viewer.actor.organisationId;
  authorize(viewer, "create", objectionSubject(tenderId, vendorOrgId));
  const db = await getDb();
  const row = await db.transaction(async (tx) => {
    const [inserted] = await tx.insert(objections).values({ tenderId, vendorOrgId, body: input.body, lodgedBy: viewer.actor.id, lodgedAt: now }).returning();
    await appendLedger(tx, {
      tenderId,
      actor: ledgerActor(viewer),
      action: "objection.lodged",
      subjectType: "Objection",
      subjectId: inserted.id,
      data: { vendor: viewer.organisationName, vendorOrgId, length: input.body.length },
    });
    return inserted;
  });
  const subject = objectionSubject(tenderId, vendorOrgId);
  notify([
    {
      to: await readersWithRole(db, "buyer", (ability) => ability.can("read", subject)),
      subject: `${tender.reference}: objection to the award from ${viewer.organisationName}`,
      text: `${viewer.name} of ${viewer.organisationName} objects to the award of ${tender.reference} ${tender.title}:\n\n${input.body}\n\nRead it and answer from the tender: /tenders/${tenderId}/notices`,
    },
    {
      to: await addressesOf(db, [vendorOrgId]),
      subject: `${tender.reference}: your objection was received`,
      text: `Your objection to the award of ${tender.reference} ${tender.title} was received and recorded. The purchasing team will answer it.\n\n/tenders/${tenderId}/notices`,
    },
  ]);
  return { id: row.id, lodgedAt: row.lodgedAt };
}

import "server-only";
import { asc, eq } from "drizzle-orm";
import { asSubject } from "@/policies";
import { getDb } from "@/db/client";
import { objections, organisations } from "@/db/schema";
import { closingWords } from "@/lib/tenders/notices";
import { awardIsFinal, objectionProblem, standstillEnd } from "@/lib/tenders/disclosure";
import type { ObjectionInput } from "@/lib/validation/notices";
import { ConflictError } from "./errors";
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
      .map((r) => ({ id: r.objection.id, vendorName: r.vendorName, body: r.objection.body, lodgedAt: r.objection.lodgedAt })),
  };
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

import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { asSubject } from "@/policies";
import { getDb } from "./database";
import { declarations, organisations } from "@/db/schema";
import type { DeclarationInput } from "@/lib/validation/review";
import { ConflictError, InputError } from "./errors";
import { appendLedger } from "./ledger";
import { authorize, ledgerActor, type Viewer } from "./session";
import { getTender, tenderSubject } from "./tenders";

const DECLARERS_ONLY = "Engineers and approvers declare on tenders past their draft.";

/** The viewer's own declaration on a tender they may read, or null; 403 for those who never declare. */
export async function getDeclaration(viewer: Viewer, tenderId: string) {
  await getTender(viewer, tenderId);
  authorize(viewer, "read", asSubject("Declaration", { tenderId, userId: viewer.actor.id }), "Only engineers and approvers declare on tenders.");
  const db = await getDb();
  const [row] = await db
    .select()
    .from(declarations)
    .where(and(eq(declarations.tenderId, tenderId), eq(declarations.userId, viewer.actor.id)));
  return row ?? null;
}

/** The invited vendors, by name, that a declaration may name: only for those who may declare on the tender. */
export async function listDeclarableVendors(viewer: Viewer, tenderId: string) {
  const tender = await getTender(viewer, tenderId);
  authorize(viewer, "declare", tenderSubject(tender), DECLARERS_ONLY);
  if (tender.invitedOrgIds.length === 0) return [];
  const db = await getDb();
  return db
    .select({ id: organisations.id, name: organisations.name })
    .from(organisations)
    .where(inArray(organisations.id, tender.invitedOrgIds))
    .orderBy(organisations.name);
}

/**
 * Records a conflict-of-interest declaration: once per person and tender, never changed. Until it
 * exists the person sees no offer of the tender; a named vendor stays hidden from them after it.
 */
export async function createDeclaration(viewer: Viewer, tenderId: string, input: DeclarationInput) {
  const tender = await getTender(viewer, tenderId);
  authorize(viewer, "declare", tenderSubject(tender), DECLARERS_ONLY);
  authorize(viewer, "create", asSubject("Declaration", { tenderId, userId: viewer.actor.id }));
  const named = [...new Set(input.conflictedOrgIds)];
  const strangers = named.filter((id) => !tender.invitedOrgIds.includes(id));
  if (strangers.length > 0) {
    throw new InputError("Name only vendors invited to this tender.", { conflictedOrgIds: ["Not an invited vendor."] });
  }
  const db = await getDb();
  const vendors = await listDeclarableVendors(viewer, tenderId);
  return db.transaction(async (tx) => {
    const [existing] = await tx
      .select({ id: declarations.id })
      .from(declarations)
      .where(and(eq(declarations.tenderId, tenderId), eq(declarations.userId, viewer.actor.id)));
    if (existing) throw new ConflictError("You have already declared on this tender; a declaration cannot be changed.");
    const [row] = await tx.insert(declarations).values({ tenderId, userId: viewer.actor.id, conflictedOrgIds: named, statement: input.statement }).returning();
    await appendLedger(tx, {
      tenderId,
      actor: ledgerActor(viewer),
      action: "declaration.made",
      subjectType: "Declaration",
      subjectId: row.id,
      data: { conflicts: vendors.filter((v) => named.includes(v.id)).map((v) => v.name), statement: input.statement },
    });
    return row;
  });
}

import "server-only";
import { and, asc, eq, inArray } from "drizzle-orm";
import { asSubject, offersSealed, pickPermitted, recordTenderState } from "@/policies";
import { getDb, type Queryable } from "./database";
import { claims, offers, organisations } from "@/db/schema";
import type { ClaimResult } from "@/lib/bounds";
import {
  currentVersion,
  documentRecord,
  evaluatedClaim,
  keyFinding,
  offerRecord,
  prepareOffer,
  submissionRefusal,
  verdictSummary,
  type EvaluatedClaim,
  type OfferTenderState,
  type PreparedClaim,
} from "@/lib/offers";
import { isEngineDeadline, runEngine } from "@/lib/runtime/engine-pool";
import type { OfferInput } from "@/lib/validation/offer";
import { requireAddendaAcknowledged } from "./addenda";
import { documentsFor, documentView, type DocumentRow } from "./documents";
import { unfinishedMessage } from "./engine";
import { ConflictError, InputError, NotFoundError } from "./errors";
import { appendLedger } from "./ledger";
import { addressesOf, notify } from "./notify";
import { withLedgerHead } from "./ledger-anchors";
import { authorize, ledgerActor, type Viewer } from "./session";
import { getTender, type TenderWithInvites } from "./tenders";
import { writeOfferVersion, type OfferRow } from "./offer-versions";

export type { OfferRow };

export type ClaimRow = typeof claims.$inferSelect;

const offerSubject = (row: OfferRow, tender: OfferTenderState) => asSubject("Offer", offerRecord(row, tender));

/** One offer as this viewer may see it: envelope fields stripped by the policies, claims and documents filtered. */
function viewOf(viewer: Viewer, tender: TenderWithInvites, row: OfferRow, vendorName: string, claimRows: ClaimRow[], docs: DocumentRow[]) {
  const can = viewer.ability.can.bind(viewer.ability);
  const own = (r: { vendorOrgId: string }) => r.vendorOrgId === row.vendorOrgId;
  return {
    // The record is authorised before it gets here; the policies then decide field by field.
    ...pickPermitted(viewer.ability, "read", "Offer", offerRecord(row, tender)),
    id: row.id,
    version: row.version,
    status: row.status,
    vendorName,
    claims: claimRows
      .filter((c) => c.offerId === row.id && can("read", asSubject("Claim", { ...c, tenderState: recordTenderState(tender) })))
      .sort((a, b) => a.pointIndex - b.pointIndex)
      .map((c) => ({ ...c, keyFinding: keyFinding(c.result as unknown as ClaimResult) })),
    documents: docs.filter((d) => own(d) && can("read", asSubject("Document", documentRecord(d, recordTenderState(tender))))).map(documentView),
  };
}
export type OfferView = ReturnType<typeof viewOf>;

async function assemble(viewer: Viewer, tender: TenderWithInvites, rows: OfferRow[]): Promise<OfferView[]> {
  if (rows.length === 0) return [];
  const db = await getDb();
  const vendorIds = [...new Set(rows.map((r) => r.vendorOrgId))];
  const [orgRows, claimRows, docs] = await Promise.all([
    db.select({ id: organisations.id, name: organisations.name }).from(organisations).where(inArray(organisations.id, vendorIds)),
    db
      .select()
      .from(claims)
      .where(
        inArray(
          claims.offerId,
          rows.map((r) => r.id),
        ),
      ),
    documentsFor(db, tender.id, vendorIds),
  ]);
  const names = new Map(orgRows.map((o) => [o.id, o.name]));
  return rows.map((row) => viewOf(viewer, tender, row, names.get(row.vendorOrgId) ?? "", claimRows, docs));
}

async function versionsOf(db: Queryable, tenderId: string, vendorOrgId: string): Promise<OfferRow[]> {
  return db
    .select()
    .from(offers)
    .where(and(eq(offers.tenderId, tenderId), eq(offers.vendorOrgId, vendorOrgId)))
    .orderBy(asc(offers.version));
}

/** The current version of each vendor's offer that the viewer may read, with claims, verdicts and documents. */
export async function listOffers(viewer: Viewer, tenderId: string): Promise<OfferView[]> {
  const tender = await getTender(viewer, tenderId);
  authorize(viewer, "list", "Offer", "Your role does not read offers.");
  const db = await getDb();
  const rows = await db.select().from(offers).where(eq(offers.tenderId, tenderId)).orderBy(asc(offers.submittedAt));
  const byVendor = new Map<string, OfferRow[]>();
  for (const r of rows) byVendor.set(r.vendorOrgId, [...(byVendor.get(r.vendorOrgId) ?? []), r]);
  const current = [...byVendor.values()].map((versions) => currentVersion(versions)).filter((r): r is OfferRow => r !== null);
  return assemble(
    viewer,
    tender,
    current.filter((r) => viewer.ability.can("read", offerSubject(r, tender))),
  );
}

async function loadOffer(viewer: Viewer, offerId: string) {
  const db = await getDb();
  const [row] = await db.select().from(offers).where(eq(offers.id, offerId));
  if (!row) throw new NotFoundError("No such offer.");
  const tender = await getTender(viewer, row.tenderId);
  // A sealed offer says so (the policy's reason); anything else is simply not the viewer's.
  const sealed = viewer.actor.organisationKind === "buyer" && offersSealed(tender);
  authorize(viewer, "read", offerSubject(row, tender), sealed ? undefined : "This offer is not yours to read.");
  return { row, tender };
}

/** One version of an offer, with the list of versions the viewer may read (the vendor's history). */
export async function getOffer(viewer: Viewer, offerId: string) {
  const { row, tender } = await loadOffer(viewer, offerId);
  const [view] = await assemble(viewer, tender, [row]);
  const versions = (await versionsOf(await getDb(), row.tenderId, row.vendorOrgId))
    .filter((v) => viewer.ability.can("read", offerSubject(v, tender)))
    .map((v) => ({ id: v.id, version: v.version, status: v.status, submittedAt: v.submittedAt, withdrawnAt: v.withdrawnAt }));
  return { ...view, versions };
}

/** The viewer's own organisation's current offer on a tender (for the Offer form), or null. */
export async function getOwnOffer(viewer: Viewer, tenderId: string): Promise<OfferView | null> {
  const tender = await getTender(viewer, tenderId);
  const current = currentVersion(await versionsOf(await getDb(), tenderId, viewer.actor.organisationId));
  if (!current || !viewer.ability.can("read", offerSubject(current, tender))) return null;
  const [view] = await assemble(viewer, tender, [current]);
  return view;
}

/**
 * Each claim in the worker pool, all within the request's deadline. A claim the engine does not
 * finish in time is kept, with the reason and without a verdict of its own (it needs evidence).
 */
async function evaluateClaimsOf(prepared: PreparedClaim[]): Promise<EvaluatedClaim[]> {
  return Promise.all(
    prepared.map(async (item) => {
      // A sensitivity claim's curve points go with its line, in one job.
      const curve = item.radio?.curve ?? [];
      try {
        const [result, ...curveResults] = await runEngine("claims", [item.input, ...curve]);
        return evaluatedClaim(item, result, curveResults);
      } catch (error) {
        if (!isEngineDeadline(error)) throw error;
        const what = `the claim at ${item.point.label}${curve.length ? ` and its ${curve.length} curve points` : ""}`;
        const unfinished = { engineError: `${unfinishedMessage(error, what)} It is stored without a verdict of its own and needs evidence.` };
        return evaluatedClaim(
          item,
          unfinished,
          curve.map(() => unfinished),
        );
      }
    }),
  );
}

/** Submits (or resubmits) the viewer's organisation's offer while the tender is open and before it closes. */
export async function submitOffer(viewer: Viewer, tenderId: string, input: OfferInput, now = new Date()): Promise<OfferView> {
  const tender = await getTender(viewer, tenderId);
  authorize(viewer, "submit", "Offer", "Only invited vendors submit offers.");
  const refusal = submissionRefusal(tender, now);
  if (refusal) throw new ConflictError(refusal);
  const vendorOrgId = viewer.actor.organisationId;
  const draft = { id: "new", tenderId, vendorOrgId, tenderState: recordTenderState(tender), envelopeOpened: false };
  authorize(viewer, "submit", asSubject("Offer", draft), "Your organisation may not submit to this tender.");
  const prepared = prepareOffer(tender, input);
  if (!prepared.ok) throw new InputError("The offer does not fit this tender: check the highlighted fields.", prepared.fieldErrors);
  const evaluated = await evaluateClaimsOf(prepared.claims);

  const db = await getDb();
  await requireAddendaAcknowledged(db, tenderId, vendorOrgId);
  const row = await db.transaction((tx) => writeOfferVersion(tx, { tender, vendorOrgId, actor: ledgerActor(viewer), input, claims: evaluated, at: now }));
  const summary = verdictSummary(evaluated.map((c) => c.verdict));
  notify(
    await withLedgerHead(db, {
      to: await addressesOf(db, [vendorOrgId]),
      subject: `${tender.reference}: offer version ${row.version} received`,
      text: `Your offer to ${tender.reference} "${tender.title}" was received as version ${row.version}.\nVerdicts: ${summary.plausible} plausible, ${summary["needs-evidence"]} needing evidence, ${summary.impossible} impossible.\nYou may correct and resubmit it until the tender closes.`,
    }),
  );
  const [view] = await assemble(viewer, tender, [row]);
  return view;
}

/** Withdraws the current version; it stays on record as withdrawn. */
export async function withdrawOffer(viewer: Viewer, offerId: string, now = new Date()): Promise<OfferView> {
  authorize(viewer, "withdraw", "Offer", "Only the vendor withdraws its offer.");
  const { row, tender } = await loadOffer(viewer, offerId);
  if (row.status === "withdrawn") throw new ConflictError("This offer is already withdrawn.");
  if (row.status === "superseded") throw new ConflictError("This version was superseded by a newer one; withdraw the current version.");
  const refusal = submissionRefusal(tender, now);
  if (refusal) throw new ConflictError(refusal);
  authorize(viewer, "withdraw", offerSubject(row, tender), "This offer is not yours to withdraw.");
  const db = await getDb();
  const updated = await db.transaction(async (tx) => {
    const [changed] = await tx
      .update(offers)
      .set({ status: "withdrawn", withdrawnAt: now })
      .where(and(eq(offers.id, row.id), eq(offers.status, "submitted")))
      .returning();
    if (!changed) throw new ConflictError("This offer changed meanwhile; reload it.");
    await appendLedger(tx, {
      tenderId: row.tenderId,
      actor: ledgerActor(viewer),
      action: "offer.withdrawn",
      subjectType: "Offer",
      subjectId: row.id,
      data: { version: row.version, vendorOrgId: row.vendorOrgId },
    });
    return changed;
  });
  notify(
    await withLedgerHead(db, {
      to: await addressesOf(db, [row.vendorOrgId]),
      subject: `${tender.reference}: offer withdrawn`,
      text: `Version ${row.version} of your offer to ${tender.reference} "${tender.title}" was withdrawn by ${viewer.name}. You may submit again until the tender closes.`,
    }),
  );
  const [view] = await assemble(viewer, tender, [updated]);
  return view;
}

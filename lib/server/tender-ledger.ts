import "server-only";
import { and, count, desc, eq, inArray } from "drizzle-orm";
import { asSubject, recordTenderState } from "@/policies";
import { getDb } from "./database";
import { claims, documents, ledgerEntries, offers, threads } from "@/db/schema";
import { ledgerSentence, readableDetails, type MayRead } from "@/lib/ledger/reading";
import { ledgerDetails } from "@/lib/tenders/ledger-summary";
import { authorize, type Viewer } from "./session";
import { getTender } from "./tenders";

export const LEDGER_PAGE_SIZE = 50;

/** The vendor organisation behind each of these record ids of the tender (the ones a page of entries names). */
async function vendorsOfRecords(tenderId: string, ids: string[]): Promise<Map<string, string>> {
  if (ids.length === 0) return new Map();
  const db = await getDb();
  const lists = await Promise.all(
    [offers, claims, documents, threads].map((table) =>
      db
        .select({ id: table.id, vendorOrgId: table.vendorOrgId })
        .from(table)
        .where(and(eq(table.tenderId, tenderId), inArray(table.id, ids))),
    ),
  );
  return new Map(lists.flat().map((r) => [r.id, r.vendorOrgId]));
}

/**
 * One page of a tender's ledger, newest first, as this viewer may read it: each entry as a sentence
 * (who did what to which tender) with its details, those the viewer may not read masked by the same
 * policies as the records themselves (an admin reads no award value, statement or verdict).
 */
export async function readTenderLedger(viewer: Viewer, tenderId: string, page = 1) {
  const tender = await getTender(viewer, tenderId);
  authorize(viewer, "read", asSubject("Ledger", { tenderId }), "Only the buying team reads a tender's ledger.");
  const db = await getDb();
  const [{ n: total }] = await db.select({ n: count() }).from(ledgerEntries).where(eq(ledgerEntries.tenderId, tenderId));
  const pages = Math.max(1, Math.ceil(total / LEDGER_PAGE_SIZE));
  const current = Math.min(Math.max(1, Math.floor(page)), pages);
  const rows = await db
    .select()
    .from(ledgerEntries)
    .where(eq(ledgerEntries.tenderId, tenderId))
    .orderBy(desc(ledgerEntries.seq))
    .limit(LEDGER_PAGE_SIZE)
    .offset((current - 1) * LEDGER_PAGE_SIZE);
  const named = (row: (typeof rows)[number]) => [row.subjectId, row.data.claimId, row.data.offerId].filter((id): id is string => typeof id === "string");
  const vendors = await vendorsOfRecords(tenderId, [...new Set(rows.flatMap(named))]);
  const mayRead: MayRead = (subject, record) => viewer.ability.can("read", asSubject(subject, record));
  const base = {
    tenderId,
    tenderState: recordTenderState(tender),
    tenderCreatedBy: tender.createdBy,
    envelopeOpened: tender.envelopesOpenedAt !== null,
    invitedOrgIds: tender.invitedOrgIds,
  };
  const entries = rows.map((row) => {
    const record = named(row).find((id) => vendors.has(id));
    const vendorOrgId = typeof row.data.vendorOrgId === "string" ? row.data.vendorOrgId : record ? vendors.get(record)! : "";
    const { data, masked } = readableDetails(row, { ...base, vendorOrgId }, mayRead);
    return {
      seq: row.seq,
      at: row.at,
      sentence: ledgerSentence(row, tender.reference),
      action: row.action,
      details: ledgerDetails(data),
      masked,
      hash: row.hash,
    };
  });
  return { entries, page: current, pages, total };
}

export type TenderLedgerPage = Awaited<ReturnType<typeof readTenderLedger>>;

import "server-only";
import { and, count, eq, lte } from "drizzle-orm";
import { asSubject } from "@/policies";
import { getDb } from "./database";
import { ledgerEntries } from "@/db/schema";
import { verifyNew, type ChainCheck } from "./ledger-check";
import { authorize, type Viewer } from "./session";
import { getTender } from "./tenders";

/**
 * Checks the chain for whoever reads the ledger: only the entries added since the last check are
 * hashed; a break found earlier (here or by a full check) is named until a full check clears it.
 */
export async function verifyWholeLedger(viewer: Viewer): Promise<ChainCheck & { entries: number }> {
  authorize(viewer, "read", "Ledger", "Only admins, buyers and approvers read the ledger.");
  const db = await getDb();
  const check = await verifyNew(db);
  const [{ n }] = await db.select({ n: count() }).from(ledgerEntries);
  return { ...check, entries: n };
}

export type TenderLedgerReport = ChainCheck & {
  tenderId: string;
  /** The tender's own entries now, and where the break falls among them when it is one of them. */
  entries: number;
  position: number | null;
};

/**
 * The tender's Ledger tab: the same incremental check of the whole chain (a tender's entries are
 * only as sound as the chain they sit in), with the break placed among the tender's entries.
 */
export async function verifyTenderLedger(viewer: Viewer, tenderId: string): Promise<TenderLedgerReport> {
  await getTender(viewer, tenderId);
  authorize(viewer, "read", asSubject("Ledger", { tenderId }), "Only the buying team reads a tender's ledger.");
  const db = await getDb();
  const check = await verifyNew(db);
  const ofTender = (upTo?: number) =>
    db
      .select({ n: count() })
      .from(ledgerEntries)
      .where(and(eq(ledgerEntries.tenderId, tenderId), upTo === undefined ? undefined : lte(ledgerEntries.seq, upTo)));
  const [[{ n: entries }], broken] = await Promise.all([
    ofTender(),
    check.brokenAt === undefined ? null : db.select({ tenderId: ledgerEntries.tenderId }).from(ledgerEntries).where(eq(ledgerEntries.seq, check.brokenAt)),
  ]);
  const position = broken?.[0]?.tenderId === tenderId ? (await ofTender(check.brokenAt))[0].n : null;
  return { ...check, tenderId, entries, position };
}

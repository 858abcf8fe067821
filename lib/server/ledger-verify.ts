import "server-only";
import { asSubject } from "@/policies";
import { getDb } from "@/db/client";
import { bodyOf, entryHash, GENESIS_HASH, verifyChain, type ChainReport } from "@/lib/ledger/chain";
import { listLedger } from "./ledger";
import { authorize, type Viewer } from "./session";
import { getTender } from "./tenders";

/** Re-verifies the whole chain for whoever reads the ledger; names the first broken entry and its position. */
export async function verifyWholeLedger(viewer: Viewer): Promise<ChainReport & { checkedAt: string }> {
  authorize(viewer, "read", "Ledger", "Only admins, buyers and approvers read the ledger.");
  const report = verifyChain(await listLedger(await getDb()));
  return { ...report, checkedAt: new Date().toISOString() };
}

export type TenderLedgerReport =
  | { ok: true; tenderId: string; entries: number; checkedAt: string }
  | { ok: false; tenderId: string; entries: number; brokenAt: number; position: number; reason: string; checkedAt: string };

/**
 * Verifies one tender's entries in place in the chain: each must hash to what it says and point
 * at the entry before it in the whole ledger. position counts within the tender's own entries.
 */
export async function verifyTenderLedger(viewer: Viewer, tenderId: string): Promise<TenderLedgerReport> {
  await getTender(viewer, tenderId);
  authorize(viewer, "read", asSubject("Ledger", { tenderId }), "Only the buying team reads a tender's ledger.");
  const rows = await listLedger(await getDb());
  const checkedAt = new Date().toISOString();
  let position = 0;
  for (const [index, row] of rows.entries()) {
    if (row.tenderId !== tenderId) continue;
    position += 1;
    const prev = index === 0 ? GENESIS_HASH : rows[index - 1].hash;
    const reason =
      row.prevHash !== prev ? "it does not point at the entry before it" : entryHash(row.prevHash, bodyOf(row)) !== row.hash ? "its content no longer matches its hash" : null;
    if (reason) return { ok: false, tenderId, entries: rows.filter((r) => r.tenderId === tenderId).length, brokenAt: row.seq, position, reason, checkedAt };
  }
  return { ok: true, tenderId, entries: position, checkedAt };
}

import "server-only";
import { asSubject } from "@/policies";
import { getDb } from "@/db/client";
import { verifyChain, type ChainReport } from "@/lib/ledger/chain";
import { listLedger } from "./ledger";
import { authorize, type Viewer } from "./session";
import { getTender } from "./tenders";

/** Re-verifies the whole chain for whoever reads the ledger; names the first broken entry and its position. */
export async function verifyWholeLedger(viewer: Viewer): Promise<ChainReport & { checkedAt: string }> {
  authorize(viewer, "read", "Ledger", "Only admins, buyers and approvers read the ledger.");
  const report = verifyChain(await listLedger(await getDb()));
  return { ...report, checkedAt: new Date().toISOString() };
}

export type TenderLedgerReport = ChainReport & { tenderId: string; checkedAt: string };

/**
 * Verifies one tender's entries in place in the chain: each must hash to what it says and point
 * at the entry before it in the whole ledger. position counts within the tender's own entries.
 */
export async function verifyTenderLedger(viewer: Viewer, tenderId: string): Promise<TenderLedgerReport> {
  await getTender(viewer, tenderId);
  authorize(viewer, "read", asSubject("Ledger", { tenderId }), "Only the buying team reads a tender's ledger.");
  const report = verifyChain(await listLedger(await getDb()), (row) => row.tenderId === tenderId);
  return { ...report, tenderId, checkedAt: new Date().toISOString() };
}

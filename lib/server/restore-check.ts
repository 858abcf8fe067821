import "server-only";
import { getDb } from "./database";
import { verifyChain } from "@/lib/ledger/chain";
import type { BackupManifest } from "@/lib/runtime/backup";
import { listLedger } from "./ledger";

/** After a restore: the ledger chain verifies and ends where the backup's manifest says it did. */
export async function checkRestoredLedger(manifest: BackupManifest): Promise<{ ok: boolean; message: string }> {
  const rows = await listLedger(await getDb());
  const report = verifyChain(rows);
  if (!report.ok) return { ok: false, message: `The restored ledger does not verify: entry ${report.brokenAt} ${report.reason}.` };
  const head = rows.at(-1)?.hash ?? null;
  const { entries, headHash } = manifest.ledger;
  if (report.entries !== entries || head !== headHash) {
    return { ok: false, message: `The restored ledger has ${report.entries} entries ending at ${head}; the backup recorded ${entries} ending at ${headHash}.` };
  }
  return { ok: true, message: `The ledger verifies: ${entries} entries, ending at ${headHash ?? "the start"}, as at the backup.` };
}

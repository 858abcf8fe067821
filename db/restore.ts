// `npm run db:restore -- <backup folder>`: restores a backup made by db:backup or by the running
// server into DATA_DIR, which must hold no database yet, then verifies the restored ledger.
import { parseArgs } from "node:util";
import { parseEnv } from "@/lib/env";
import { restoreBackup } from "@/lib/runtime/backup";
import { holdDataFolder } from "@/lib/runtime/data-lock";
import { closeDb } from "./client";

async function main() {
  const { positionals } = parseArgs({ allowPositionals: true });
  if (positionals.length !== 1) throw new Error("usage: npm run db:restore -- <backup folder>   (into DATA_DIR, which must hold no database yet)");
  const settings = parseEnv();
  if (settings.DATABASE_URL) throw new Error("DATABASE_URL names a PostgreSQL server: restore it with pg_restore or psql, as the README describes.");
  // Refuses while a server holds the folder, and keeps one from starting meanwhile.
  holdDataFolder(settings.DATA_DIR, "npm run db:restore");
  const manifest = await restoreBackup({ source: positionals[0], dataDir: settings.DATA_DIR });
  console.log(`Restored the backup of ${manifest.createdAt} into ${settings.DATA_DIR}.`);
  const { checkRestoredLedger } = await import("@/lib/server/restore-check");
  const check = await checkRestoredLedger(manifest);
  await closeDb();
  if (!check.ok) throw new Error(check.message);
  console.log(check.message);
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});

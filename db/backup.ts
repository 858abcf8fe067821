// `npm run db:backup [-- --to <folder>]`: a backup of the embedded database and the local object
// store with the server stopped. While a server runs, only it may open the data folder: make the
// backup through it (POST /api/v1/backups as an administrator; see the README).
import { existsSync } from "node:fs";
import path from "node:path";
import { parseArgs } from "node:util";
import { parseEnv } from "@/lib/env";
import { backupName, writeBackup } from "@/lib/runtime/backup";
import { DataFolderBusyError, holdDataFolder } from "@/lib/runtime/data-lock";

async function main() {
  const { values } = parseArgs({ options: { to: { type: "string" } } });
  const settings = parseEnv();
  if (settings.DATABASE_URL) throw new Error("DATABASE_URL names a PostgreSQL server: back it up with pg_dump, as the README describes.");
  const dir = settings.DATA_DIR;
  try {
    holdDataFolder(dir, "npm run db:backup");
  } catch (error) {
    if (!(error instanceof DataFolderBusyError)) throw error;
    throw new Error(
      `${error.message}\nWhile the server runs, make the backup through it: as an administrator, POST /api/v1/backups ` +
        "(it writes the backup under BACKUP_DIR). Or stop the server and run npm run db:backup again.",
    );
  }
  const database = path.join(dir, "pglite");
  if (!existsSync(database)) throw new Error(`${dir} holds no database yet: nothing to back up.`);
  const { PGlite } = await import("@electric-sql/pglite");
  const pg = await PGlite.create(database);
  const target = path.resolve(values.to ?? path.join(settings.BACKUP_DIR, backupName()));
  try {
    const manifest = await writeBackup({ pg, dataDir: dir, target });
    console.log(`Backed up ${dir} to ${target}: ${manifest.files.length} files, ledger of ${manifest.ledger.entries} entries.`);
    console.log(`Restore it into an empty data folder with: DATA_DIR=<new folder> npm run db:restore -- ${target}`);
  } finally {
    await pg.close();
  }
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});

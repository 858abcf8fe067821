import "server-only";
import path from "node:path";
import { dataDir, embeddedDatabase } from "./database";
import { env } from "@/lib/env";
import { backupName, writeBackup, type BackupManifest } from "@/lib/runtime/backup";
import { ConflictError } from "./errors";
import { authorize, type Viewer } from "./session";

/**
 * A backup made by the running server, the one process that may open its data folder: the
 * database and the local object store, written to a new folder under BACKUP_DIR.
 */
export async function createBackup(viewer: Viewer): Promise<BackupManifest & { folder: string }> {
  authorize(viewer, "create", "Backup", "Only an administrator makes backups.");
  const pg = await embeddedDatabase();
  if (!pg) throw new ConflictError("This server keeps its data in PostgreSQL (DATABASE_URL): back it up with pg_dump, as the README describes.");
  const folder = path.join(env().BACKUP_DIR, backupName());
  const manifest = await writeBackup({ pg, dataDir: dataDir(), target: folder });
  return { ...manifest, folder };
}

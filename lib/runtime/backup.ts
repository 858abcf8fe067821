// Backups of the embedded database and the local object store: one folder per backup with the
// database (PGlite's own dump of its data folder), the stored objects, the store's key pair and
// a manifest with each file's SHA-256. Used by the running server (an admin's request) and by
// `npm run db:backup` / `npm run db:restore` with the server stopped.
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import type { PGliteInterface } from "@electric-sql/pglite";
import { ensureParentFolder, ensurePrivateFolder } from "./data-lock";

export const BACKUP_FORMAT = "ratecourt-backup/1";
const DATABASE_FILE = "database.tar.gz";
const MANIFEST_FILE = "manifest.json";
/** Not copied from the data folder: the database (dumped instead) and the running process's lock. */
const NOT_COPIED = new Set(["pglite", "server.lock"]);

/** What the data folder holds besides the database: stored objects, their key pair, secrets, the mailroom. */
const dataFilesIn = (folder: string) => fs.readdirSync(folder).filter((name) => !NOT_COPIED.has(name));

export type BackupManifest = {
  format: typeof BACKUP_FORMAT;
  createdAt: string;
  /** The newest ledger entry in the backup, to compare with a verification after restoring. */
  ledger: { entries: number; headSeq: number | null; headHash: string | null };
  files: { path: string; bytes: number; sha256: string }[];
};

export class BackupError extends Error {
  override readonly name = "BackupError";
}

/** A name that sorts by time and is safe as a folder name. */
export const backupName = (at = new Date()) => `ratecourt-${at.toISOString().replace(/[:.]/g, "-")}`;

function filesUnder(root: string, folder: string): string[] {
  const here = path.join(root, folder);
  if (!fs.statSync(here).isDirectory()) return [folder];
  return fs.readdirSync(here).flatMap((name) => filesUnder(root, path.join(folder, name)));
}

const sha256Of = (file: string) => createHash("sha256").update(fs.readFileSync(file)).digest("hex");

/**
 * Writes a backup of `pg` (the data folder's open database) and the files beside it into `target`,
 * a new folder. The database is dumped while no transaction runs, then the objects are copied:
 * objects are stored before the rows that name them and never changed, so every object the
 * dumped database refers to is in the copy.
 */
export async function writeBackup(options: { pg: PGliteInterface; dataDir: string; target: string }): Promise<BackupManifest> {
  const { pg, dataDir, target } = options;
  if (fs.existsSync(target)) throw new BackupError(`${target} exists already: choose a new folder for the backup.`);
  if (!path.relative(path.resolve(dataDir), path.resolve(target)).startsWith("..")) {
    throw new BackupError(`${target} is inside the data folder ${dataDir}: keep backups outside it (BACKUP_DIR).`);
  }
  ensureParentFolder(target);
  fs.mkdirSync(target, { mode: 0o700 });
  const { dump, ledger } = await pg.transaction(async (tx) => {
    const head = await tx.query<{ entries: number; seq: number | null; hash: string | null }>(
      "select (select count(*)::int from ledger_entries) as entries, seq::int as seq, hash from (select 1) one left join (select seq, hash from ledger_entries order by seq desc limit 1) last on true",
    );
    const row = head.rows[0];
    return { dump: await pg.dumpDataDir("gzip"), ledger: { entries: row.entries, headSeq: row.seq, headHash: row.hash } };
  });
  fs.writeFileSync(path.join(target, DATABASE_FILE), Buffer.from(await dump.arrayBuffer()), { mode: 0o600 });
  const copied = dataFilesIn(dataDir);
  for (const name of copied) fs.cpSync(path.join(dataDir, name), path.join(target, name), { recursive: true });
  const files = [DATABASE_FILE, ...copied.flatMap((name) => filesUnder(target, name))].map((file) => ({
    path: file,
    bytes: fs.statSync(path.join(target, file)).size,
    sha256: sha256Of(path.join(target, file)),
  }));
  const manifest: BackupManifest = { format: BACKUP_FORMAT, createdAt: new Date().toISOString(), ledger, files };
  fs.writeFileSync(path.join(target, MANIFEST_FILE), JSON.stringify(manifest, null, 2), { mode: 0o600 });
  return manifest;
}

/** Reads a backup's manifest and checks every file against it; throws a BackupError naming what is wrong. */
export function checkBackup(source: string): BackupManifest {
  let manifest: BackupManifest;
  try {
    manifest = JSON.parse(fs.readFileSync(path.join(source, MANIFEST_FILE), "utf8")) as BackupManifest;
  } catch {
    throw new BackupError(`${source} is not a Ratecourt backup: it has no readable ${MANIFEST_FILE}.`);
  }
  if (manifest.format !== BACKUP_FORMAT) throw new BackupError(`${source} is a backup in format "${manifest.format}", not ${BACKUP_FORMAT}.`);
  for (const file of manifest.files) {
    const at = path.join(source, file.path);
    if (!fs.existsSync(at) || sha256Of(at) !== file.sha256)
      throw new BackupError(`The backup's file ${file.path} is missing or changed since the backup was made.`);
  }
  return manifest;
}

/**
 * Restores a checked backup into `dataDir`, which must not hold a database yet (the caller holds
 * its lock). Returns the manifest, so the caller can compare the restored ledger with it.
 */
export async function restoreBackup(options: { source: string; dataDir: string }): Promise<BackupManifest> {
  const { source, dataDir } = options;
  const manifest = checkBackup(source);
  const database = path.join(dataDir, "pglite");
  if (fs.existsSync(database)) {
    throw new BackupError(`${dataDir} already holds a database: restore into a new DATA_DIR, or move that folder away first.`);
  }
  ensurePrivateFolder(dataDir);
  const { PGlite } = await import("@electric-sql/pglite");
  const dump = new Blob([fs.readFileSync(path.join(source, DATABASE_FILE))]);
  const pg = await PGlite.create(database, { loadDataDir: dump });
  await pg.close();
  for (const name of dataFilesIn(source).filter((n) => n !== DATABASE_FILE && n !== MANIFEST_FILE)) {
    fs.cpSync(path.join(source, name), path.join(dataDir, name), { recursive: true, force: true });
  }
  return manifest;
}

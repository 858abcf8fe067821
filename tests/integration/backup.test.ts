// Backups of the embedded database and object store: made by the running server (an admin's
// request) or by `npm run db:backup` with it stopped, restored with `npm run db:restore` into a
// new folder, where the ledger verifies and the stored objects read back.
import { spawnSync } from "node:child_process";
import { chmodSync, mkdtempSync, rmSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as backupPost } from "@/app/api/v1/backups/route";
import { closeDb, getDb } from "@/lib/server/database";
import { startLocalServices, type LocalServices } from "@/lib/dev/services";
import { BackupError, checkBackup } from "@/lib/runtime/backup";
import { releaseDataFolder } from "@/lib/runtime/data-lock";
import { getObject, putObject } from "@/lib/storage";
import { freshDatabase, request, signInAs } from "../support/app";
import { setEnv } from "../support/env";

const root = path.resolve(import.meta.dirname, "../..");
let work: string;
let restore = () => {};
let services: LocalServices | undefined;
const memo = new TextEncoder().encode("%PDF-1.7 the award memo");
const folder = (name: string) => path.join(work, name);

/** One of the npm scripts, run as the user would, on a data folder of ours. */
function script(name: "backup" | "restore", dataDir: string, args: string[] = []) {
  const file = path.join(root, "db", `${name}.ts`);
  const run = spawnSync(path.join(root, "node_modules/.bin/tsx"), ["--conditions=react-server", file, ...args], {
    cwd: root,
    encoding: "utf8",
    env: { ...process.env, DB_MEMORY: "0", DATA_DIR: dataDir, BACKUP_DIR: folder("backups") },
    timeout: 120_000,
  });
  return { status: run.status, out: `${run.stdout}${run.stderr}` };
}

let made: { folder: string; ledger: { entries: number; headHash: string } };

beforeAll(async () => {
  work = mkdtempSync(path.join(tmpdir(), "rc-backup-"));
  if (process.env.DATABASE_URL) {
    await freshDatabase();
    return;
  }
  restore = setEnv({ DB_MEMORY: "0", DATA_DIR: folder("live"), BACKUP_DIR: folder("backups") });
  await getDb(); // the demo data, on disk
  services = await startLocalServices({ dataDir: folder("live"), smtpPort: 0, s3Port: 0 });
  await putObject("memos/award.pdf", memo, "application/pdf");
});

afterAll(async () => {
  await services?.stop();
  await closeDb();
  restore();
  rmSync(work, { recursive: true, force: true });
});

// These back up the embedded database; a PostgreSQL server is backed up with pg_dump (below).
const embedded = !process.env.DATABASE_URL;

describe.runIf(!embedded)("on a PostgreSQL server", () => {
  it("refuses and points to pg_dump", async () => {
    const response = await backupPost(request("/api/v1/backups", { method: "POST", headers: await signInAs("admin@tarnwell.example") }), undefined);
    expect(response.status).toBe(409);
    expect((await response.json()).error).toMatch(/pg_dump/);
  });
});

describe.runIf(embedded)("a backup made by the running server", () => {
  it("is an administrator's act", async () => {
    const response = await backupPost(request("/api/v1/backups", { method: "POST", headers: await signInAs("buyer@tarnwell.example") }), undefined);
    expect(response.status).toBe(403);
    expect((await response.json()).error).toMatch(/Only an administrator makes backups/);
  });

  it("writes the database, the objects and their key pair with a manifest", async () => {
    const response = await backupPost(request("/api/v1/backups", { method: "POST", headers: await signInAs("admin@tarnwell.example") }), undefined);
    expect(response.status).toBe(201);
    made = await response.json();
    expect(path.dirname(made.folder)).toBe(folder("backups"));
    expect(made.ledger.entries).toBeGreaterThan(10);
    const manifest = checkBackup(made.folder);
    const paths = manifest.files.map((file) => file.path);
    expect(paths).toContain("database.tar.gz");
    expect(paths).toContain("object-store-credentials.json");
    expect(paths.some((p) => p.startsWith("objects/") && p.includes("award.pdf"))).toBe(true);
    expect(paths).not.toContain("server.lock");
  });

  it("is refused by db:backup while the server holds the folder, which points to the running server instead", () => {
    const run = script("backup", folder("live"));
    expect(run.status).toBe(1);
    expect(run.out).toMatch(/is in use by process/);
    expect(run.out).toMatch(/POST \/api\/v1\/backups/);
  });
});

describe.runIf(embedded)("restoring", () => {
  it("into a new folder verifies the ledger against the backup and reads the objects back", async () => {
    const run = script("restore", folder("restored"), [made.folder]);
    expect(run.out).toMatch(new RegExp(`The ledger verifies: ${made.ledger.entries} entries, ending at ${made.ledger.headHash}`));
    expect(run.status).toBe(0);

    await services!.stop();
    services = await startLocalServices({ dataDir: folder("restored"), smtpPort: 0, s3Port: 0 });
    expect(await getObject("memos/award.pdf")).toEqual(memo);
  });

  it("refuses a folder that already holds a database, and a backup changed since it was made", () => {
    const again = script("restore", folder("restored"), [made.folder]);
    expect(again.status).toBe(1);
    expect(again.out).toMatch(/already holds a database: restore into a new DATA_DIR/);

    writeFileSync(path.join(made.folder, "object-store-credentials.json"), "{}");
    expect(() => checkBackup(made.folder)).toThrow(BackupError);
    expect(() => checkBackup(made.folder)).toThrow(/object-store-credentials.json is missing or changed/);
  });

  it("db:backup works with the server stopped, and its backup restores too", async () => {
    await closeDb();
    releaseDataFolder(folder("live"));
    // A folder the backup goes into keeps its permissions (a backup to /tmp/x once closed /tmp).
    chmodSync(work, 0o755);
    const backup = script("backup", folder("live"), ["--to", folder("stopped-backup")]);
    expect(backup.out).toMatch(/Backed up .* ledger of \d+ entries/);
    expect(backup.status).toBe(0);
    expect(statSync(work).mode & 0o777).toBe(0o755);
    expect(statSync(folder("stopped-backup")).mode & 0o777).toBe(0o700);
    const restored = script("restore", folder("restored-2"), [folder("stopped-backup")]);
    expect(restored.out).toMatch(/The ledger verifies/);
    expect(restored.status).toBe(0);
  });
});

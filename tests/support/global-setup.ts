// Runs once before every test file: migrates and seeds one in-memory database and dumps it, so that
// each file loads that dump (TEST_DB_SNAPSHOT, read by db/client.ts) instead of migrating and
// seeding its own. Against a PostgreSQL server (DATABASE_URL) there is nothing to prepare.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { TEST_LEDGER_KEY } from "./ledger-key";

export default async function setup() {
  if (process.env.DATABASE_URL) return;
  (process.env as Record<string, string>).NODE_ENV = "test";
  process.env.DB_MEMORY = "1";
  process.env.LEDGER_KEY ??= TEST_LEDGER_KEY;
  delete process.env.TEST_DB_SNAPSHOT;
  const { embeddedDatabase, closeDb } = await import("@/lib/server/database");
  const pglite = await embeddedDatabase();
  if (!pglite) throw new Error("The test snapshot needs the embedded database.");
  const dump = await pglite.dumpDataDir("none");
  await closeDb();
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "ratecourt-test-db-"));
  const file = path.join(dir, "migrated-and-seeded.tar");
  fs.writeFileSync(file, Buffer.from(await dump.arrayBuffer()));
  // Test files run in child processes started after this: they inherit the setting.
  process.env.TEST_DB_SNAPSHOT = file;
  return () => fs.rmSync(dir, { recursive: true, force: true });
}

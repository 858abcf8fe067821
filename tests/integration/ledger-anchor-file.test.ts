import { mkdtempSync, readFileSync, rmSync, statSync, writeFileSync, appendFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { desc } from "drizzle-orm";
import { closeDb, getDb, type Db } from "@/lib/server/database";
import { ledgerEntries } from "@/db/schema";
import { resetEnvForTests } from "@/lib/env";
import { CHECKPOINT_FILE } from "@/lib/ledger/anchors";
import { releaseDataFolder } from "@/lib/runtime/data-lock";
import { checkpointsOutside } from "@/lib/server/ledger-anchors";
import { verifyLedger } from "@/lib/server/ledger";
import { verifyNew } from "@/lib/server/ledger-check";
import { truncateAfter } from "../support/ledger-tamper";

// The embedded database on disk, as `npm run dev` runs it: the key and the checkpoints live in the
// data folder beside the database files, readable by the owner only.
const dir = mkdtempSync(path.join(tmpdir(), "ratecourt-ledger-"));
let db: Db;
beforeAll(async () => {
  process.env.DATA_DIR = dir;
  process.env.DB_MEMORY = "0";
  // As `npm run dev` runs: no LEDGER_KEY setting, so the key is made and kept in the data folder.
  delete process.env.LEDGER_KEY;
  resetEnvForTests();
  db = await getDb();
});
afterAll(async () => {
  await closeDb();
  releaseDataFolder(dir);
  rmSync(dir, { recursive: true, force: true });
});

const mode = (name: string) => statSync(path.join(dir, name)).mode & 0o777;

// The embedded database's data folder; a PostgreSQL server run keeps its database elsewhere.
describe.skipIf(Boolean(process.env.DATABASE_URL))("checkpoints in the data folder", () => {
  it("keeps the ledger key and the checkpoint of the seeded head in files only the owner reads", async () => {
    const [head] = await db.select().from(ledgerEntries).orderBy(desc(ledgerEntries.seq)).limit(1);
    expect(mode("ledger-key")).toBe(0o600);
    expect(mode(CHECKPOINT_FILE)).toBe(0o600);
    const lines = readFileSync(path.join(dir, CHECKPOINT_FILE), "utf8")
      .trim()
      .split("\n")
      .map((l) => JSON.parse(l));
    expect(lines).toEqual([expect.objectContaining({ seq: head.seq, hash: head.hash, reason: "schedule" })]);
  });

  it("find a truncation with the database's own checkpoints gone, from the file", async () => {
    const [head] = await db.select().from(ledgerEntries).orderBy(desc(ledgerEntries.seq)).limit(1);
    await truncateAfter(db, head.seq - 3);
    const removed = { ok: false, brokenAt: head.seq - 2, reason: expect.stringMatching(/the newest entries were removed/) };
    expect(await verifyNew(db)).toMatchObject(removed);
    // The whole-chain check scripts use (a restore, for one) sees it too.
    expect(await verifyLedger(db)).toMatchObject(removed);
  });

  it("read lines added since the last read, and count a line that is not a checkpoint", () => {
    const before = checkpointsOutside().checkpoints.length;
    const file = path.join(dir, CHECKPOINT_FILE);
    appendFileSync(file, `${readFileSync(file, "utf8").split("\n")[0]}\n`);
    expect(checkpointsOutside()).toMatchObject({ unreadable: 0 });
    expect(checkpointsOutside().checkpoints).toHaveLength(before + 1);
    appendFileSync(file, "not a checkpoint\n");
    expect(checkpointsOutside().unreadable).toBe(1);
    writeFileSync(file, "");
    expect(checkpointsOutside()).toEqual({ checkpoints: [], unreadable: 0 });
  });
});

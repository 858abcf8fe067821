import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { desc, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { ledgerCheckpoints, ledgerEntries } from "@/db/schema";
import { GET as verifyGet } from "@/app/api/v1/ledger/verify/route";
import { CHECKPOINT_EVERY, signatureHolds, signCheckpoint } from "@/lib/ledger/anchors";
import { appendLedger } from "@/lib/server/ledger";
import { checkpointsOutside, ledgerKey, withLedgerHead } from "@/lib/server/ledger-anchors";
import { closeDb, freshDatabase, request, signInAs } from "../support/app";
import { runFullCheck } from "../support/ledger-checks";
import { allEntries, restoreEntries, rewriteFrom, truncateAfter, type Entry } from "../support/ledger-tamper";

let db: Db;
let admin: Headers;
beforeAll(async () => {
  db = await freshDatabase();
  admin = await signInAs("admin@tarnwell.example");
});
afterAll(closeDb);

const verify = async () => (await verifyGet(request("/api/v1/ledger/verify", { headers: admin }), undefined)).json();
const append = (n: number) => db.transaction((tx) => appendLedger(tx, { actor: null, action: "test.noted", subjectType: "Test", data: { n } }));

async function restoreAndClear(rows: Entry[]) {
  await restoreEntries(db, rows);
  expect(await runFullCheck(admin)).toMatchObject({ status: "intact" });
  expect(await verify()).toMatchObject({ ok: true });
}

describe("signed checkpoints of the ledger head", () => {
  it("are signed on a schedule of entries, with a key that is not in the database, and kept outside it too", async () => {
    // The demo data is written in one transaction: its head is signed once it is committed.
    const [seeded] = await db.select().from(ledgerEntries).orderBy(desc(ledgerEntries.seq)).limit(1);
    expect(await db.select().from(ledgerCheckpoints)).toMatchObject([{ seq: seeded.seq, hash: seeded.hash, reason: "schedule" }]);
    for (let n = 0; n < 2 * CHECKPOINT_EVERY + 1; n++) await append(n);
    expect(await verify()).toMatchObject({ ok: true });
    const inside = await db.select().from(ledgerCheckpoints).orderBy(ledgerCheckpoints.seq);
    const key = ledgerKey();
    const scheduled = inside.filter((c) => c.reason === "schedule").map((c) => c.seq);
    expect(scheduled).toEqual([seeded.seq, seeded.seq + CHECKPOINT_EVERY, seeded.seq + 2 * CHECKPOINT_EVERY]);
    for (const c of inside) expect(signatureHolds(key, c)).toBe(true);
    // The copy outside the database holds every checkpoint this process signed (the seeded head was
    // signed by the process that made the test database snapshot, tests/support/global-setup.ts).
    const signedHere = inside.filter((c) => c.seq > seeded.seq).map((c) => c.signature);
    expect(signedHere.length).toBeGreaterThan(0);
    expect(checkpointsOutside().checkpoints.map((c) => c.signature)).toEqual(expect.arrayContaining(signedHere));
    const dump = JSON.stringify(await db.execute(sql`select * from ledger_checkpoints, ledger_verification`));
    expect(dump).not.toContain(key);
    // The view just verified the chain: its head is signed, so nothing verified can vanish unseen.
    const [head] = await db.select().from(ledgerEntries).orderBy(desc(ledgerEntries.seq)).limit(1);
    expect(inside.at(-1)).toMatchObject({ seq: head.seq, hash: head.hash, reason: "verified" });
  });

  it("detect the newest entries deleted, even with the database's checkpoints and verified head deleted too", async () => {
    const all = await allEntries(db);
    const keep = all.at(-6)!;
    await truncateAfter(db, keep.seq);
    const report = await verify();
    expect(report).toMatchObject({ ok: false, brokenAt: keep.seq + 1 });
    expect(report.reason).toMatch(
      new RegExp(`the ledger ends at entry #${keep.seq}, but the checkpoint signed at entry #\\d+ .* the newest entries were removed`),
    );
    expect(await runFullCheck(admin)).toMatchObject({ status: "broken", reason: expect.stringMatching(/newest entries were removed/) });
    await restoreAndClear(all);
  });

  it("detect one entry edited and every later hash recomputed", async () => {
    const all = await allEntries(db);
    const target = all[Math.floor(all.length / 2)];
    await rewriteFrom(db, target.seq, { quietly: "changed" });
    const report = await verify();
    expect(report.ok).toBe(false);
    expect(report.brokenAt).toBeGreaterThanOrEqual(target.seq);
    expect(report.brokenAt).toBeLessThanOrEqual(target.seq + CHECKPOINT_EVERY);
    expect(report.reason).toMatch(
      new RegExp(`entry #${report.brokenAt} no longer has the hash signed at the checkpoint .*: entries up to it were rewritten and their hashes recomputed`),
    );
    await restoreAndClear(all);
  });

  it("refuse a checkpoint signed with another key", async () => {
    const [head] = await db.select().from(ledgerEntries).orderBy(desc(ledgerEntries.seq)).limit(1);
    const forged = signCheckpoint("a key that is not the ledger key, 32+ chars", { seq: head.seq + 1, hash: "f".repeat(64) }, "schedule");
    await append(1);
    await db.insert(ledgerCheckpoints).values(forged);
    expect((await verify()).reason).toMatch(/has a signature that does not match: it was forged or edited/);
    await db.delete(ledgerCheckpoints).where(sql`signature = ${forged.signature}`);
    expect(await runFullCheck(admin)).toMatchObject({ status: "intact" });
  });

  it("cannot show entries removed after the newest checkpoint, and say so", async () => {
    expect(await verify()).toMatchObject({ ok: true });
    const all = await allEntries(db);
    await append(2);
    await truncateAfter(db, all.at(-1)!.seq);
    const report = await verify();
    expect(report).toMatchObject({ ok: true });
    expect(report.anchors.limit).toMatch(/after the newest signed checkpoint can be removed without trace/);
  });
});

describe("notices", () => {
  it("carry the ledger head they were sent at", async () => {
    const entry = await append(3);
    const [notice] = await withLedgerHead(db, { to: ["someone@example.test"], subject: "s", text: "Body." });
    expect(notice.text).toBe(`Body.\n\nLedger head when issued: entry #${entry.seq}, hash ${entry.hash.slice(0, 12)}.`);
  });
});

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { tenders } from "@/db/schema";
import { GET as verifyGet } from "@/app/api/v1/ledger/verify/route";
import { appendLedger, appendLedgerMany, listLedger, verifyLedger } from "@/lib/server/ledger";
import { closeDb, freshDatabase, request, signInAs } from "../support/app";
import { runFullCheck, startCheck, stepCheck } from "../support/ledger-checks";
import { allEntries, restoreEntries, type Entry } from "../support/ledger-tamper";

let db: Db;
let admin: Headers;
let gaugesId: string;
let weirsId: string;
beforeAll(async () => {
  db = await freshDatabase();
  admin = await signInAs("admin@tarnwell.example");
  const rows = await db.select({ id: tenders.id, reference: tenders.reference }).from(tenders);
  gaugesId = rows.find((t) => t.reference === "RC-2027-001")!.id;
  weirsId = rows.find((t) => t.reference === "RC-2027-003")!.id;
});
afterAll(closeDb);

const verify = async (headers?: Headers, tenderId?: string) => {
  const response = await verifyGet(request(`/api/v1/ledger/verify${tenderId ? `?tenderId=${tenderId}` : ""}`, { headers }), undefined);
  return { status: response.status, body: await response.json() };
};
const append = (tenderId: string | null, data: Record<string, unknown>) =>
  db.transaction((tx) => appendLedger(tx, { tenderId, actor: null, action: "test.noted", subjectType: "Tender", subjectId: tenderId, data }));
const editData = (seq: number, data: Record<string, unknown>) =>
  db.execute(sql`update ledger_entries set data = ${JSON.stringify(data)}::jsonb where seq = ${seq}`);

/** Puts the ledger back and has the admin's full check find it intact, as after a restore. */
async function restoreAndClear(rows: Entry[]) {
  await restoreEntries(db, rows);
  expect(await runFullCheck(admin)).toMatchObject({ status: "intact" });
  expect((await verify(admin)).body).toMatchObject({ ok: true });
}

describe("ledger verification", () => {
  it("is for whoever reads the ledger: admin and buyer yes, engineer and vendor no, signed out 401", async () => {
    expect((await verify(admin)).body).toMatchObject({ ok: true });
    expect((await verify(await signInAs("buyer@tarnwell.example"))).status).toBe(200);
    expect((await verify(await signInAs("engineer@tarnwell.example"))).status).toBe(403);
    expect((await verify(await signInAs("sales@kestrelink.example"))).status).toBe(403);
    expect((await verify()).status).toBe(401);
  });

  it("hashes each entry once: a view checks only the entries added since the last check", async () => {
    const before = await verify(admin);
    const all = await allEntries(db);
    expect(before.body).toMatchObject({ ok: true, entries: all.length, verifiedThrough: { seq: all.at(-1)!.seq, hash: all.at(-1)!.hash } });
    expect((await verify(admin)).body.checkedNow).toBe(0);
    expect((await verify(admin, gaugesId)).body.checkedNow).toBe(0);
    await append(gaugesId, { n: 1 });
    const added = await append(gaugesId, { n: 2 });
    const after = (await verify(admin, gaugesId)).body;
    expect(after).toMatchObject({ ok: true, checkedNow: 2, verifiedThrough: { seq: added.seq, hash: added.hash } });
    expect((await verify(admin)).body.checkedNow).toBe(0);
  });

  it("names an entry edited after the last check, for the chain and its tender, on every view until a full check finds it intact", async () => {
    const all = await allEntries(db);
    const target = await append(gaugesId, { n: 3 });
    await append(weirsId, { n: 4 });
    await editData(target.seq, { quietly: "changed" });

    const reason = "its content no longer matches its hash";
    expect((await verify(admin)).body).toMatchObject({ ok: false, brokenAt: target.seq, reason });
    const gaugesEntries = (await allEntries(db)).filter((e) => e.tenderId === gaugesId).length;
    expect((await verify(admin, gaugesId)).body).toMatchObject({ ok: false, brokenAt: target.seq, position: gaugesEntries, entries: gaugesEntries });
    // The break is in another tender's entry: the weirs tender sits in the same broken chain.
    expect((await verify(admin, weirsId)).body).toMatchObject({ ok: false, brokenAt: target.seq, position: null });

    // Putting the data back is not enough: the break stays named until a full check.
    await editData(target.seq, target.data);
    expect((await verify(admin)).body).toMatchObject({ ok: false, brokenAt: target.seq });
    await restoreAndClear(all);
  });

  it("answers 404 for an unknown tender", async () => {
    expect((await verify(admin, "no-such-tender")).status).toBe(404);
  });
});

describe("the full check (admin)", () => {
  it("finds an edit of an entry views had already verified, in batches with progress, and the views name it after", async () => {
    const all = await allEntries(db);
    const target = all.filter((e) => e.tenderId === gaugesId)[1];
    await editData(target.seq, { quietly: "changed" });
    // A view hashes only what is new: an old entry edited without touching its hash goes unseen until a full check.
    expect((await verify(admin)).body).toMatchObject({ ok: true, checkedNow: 0 });

    const steps: number[] = [];
    const result = await runFullCheck(admin, 10, (check) => steps.push(check.checked));
    const position = all.findIndex((e) => e.seq === target.seq);
    expect(steps.slice(0, Math.floor(position / 10))).toEqual(Array.from({ length: Math.floor(position / 10) }, (_, i) => (i + 1) * 10));
    expect(result).toMatchObject({
      status: "broken",
      brokenAt: target.seq,
      checked: position,
      total: all.length,
      reason: "its content no longer matches its hash",
    });
    expect((await verify(admin)).body).toMatchObject({ ok: false, brokenAt: target.seq });
    expect((await verify(admin, gaugesId)).body).toMatchObject({ ok: false, brokenAt: target.seq, position: 2 });
    await restoreAndClear(all);
  });

  it("is for admins only, and refuses a bad step size", async () => {
    expect((await startCheck(await signInAs("buyer@tarnwell.example"))).status).toBe(403);
    expect((await startCheck(await signInAs("approver@tarnwell.example"))).status).toBe(403);
    expect((await startCheck()).status).toBe(401);
    const started = await startCheck(admin);
    expect(started.status).toBe(201);
    const { id } = await started.json();
    const bad = await stepCheck(admin, id, "0");
    expect(bad.status).toBe(400);
    expect((await bad.json()).error).toMatch(/at least 1/);
    expect((await stepCheck(admin, "no-such-check")).status).toBe(404);
  });
});

describe("appending many entries at once (bulk writers)", () => {
  it("chains them in the given order, between single appends, as one by one would", async () => {
    const before = (await listLedger(db)).length;
    const inputs = Array.from({ length: 1203 }, (_, i) => ({
      tenderId: gaugesId,
      actor: null,
      action: "test.bulk",
      subjectType: "Tender",
      subjectId: gaugesId,
      data: { i },
    }));
    await db.transaction(async (tx) => {
      await appendLedger(tx, { tenderId: weirsId, actor: null, action: "test.single", subjectType: "Tender", subjectId: weirsId, data: {} });
      await appendLedgerMany(tx, inputs);
      await appendLedger(tx, { tenderId: weirsId, actor: null, action: "test.single", subjectType: "Tender", subjectId: weirsId, data: {} });
    });
    const rows = (await listLedger(db)).slice(before);
    expect(rows.map((r) => r.action)).toEqual(["test.single", ...inputs.map(() => "test.bulk"), "test.single"]);
    expect(rows.slice(1, -1).map((r) => r.data.i)).toEqual(inputs.map((_, i) => i));
    expect(await verifyLedger(db)).toMatchObject({ ok: true });
    expect((await verify(admin)).body).toMatchObject({ ok: true });
  });
});

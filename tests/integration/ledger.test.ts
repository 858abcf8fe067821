import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { asc, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { ledgerEntries, tenders } from "@/db/schema";
import { GET as verifyGet } from "@/app/api/v1/ledger/verify/route";
import { closeDb, freshDatabase, request, signInAs } from "../support/app";

let db: Db;
let gaugesId: string;
let weirsId: string;
beforeAll(async () => {
  db = await freshDatabase();
  const rows = await db.select({ id: tenders.id, reference: tenders.reference }).from(tenders);
  gaugesId = rows.find((t) => t.reference === "RC-2027-001")!.id;
  weirsId = rows.find((t) => t.reference === "RC-2027-003")!.id;
});
afterAll(closeDb);

const verify = async (headers?: Headers, tenderId?: string) => {
  const response = await verifyGet(request(`/api/v1/ledger/verify${tenderId ? `?tenderId=${tenderId}` : ""}`, { headers }), undefined);
  return { status: response.status, body: await response.json() };
};

describe("ledger verification", () => {
  it("is for whoever reads the ledger: admin and buyer yes, engineer and vendor no, signed out 401", async () => {
    expect((await verify(await signInAs("admin@tarnwell.example"))).body).toMatchObject({ ok: true });
    expect((await verify(await signInAs("buyer@tarnwell.example"))).status).toBe(200);
    expect((await verify(await signInAs("engineer@tarnwell.example"))).status).toBe(403);
    expect((await verify(await signInAs("sales@kestrelink.example"))).status).toBe(403);
    expect((await verify()).status).toBe(401);
  });

  it("names the first entry edited directly in the database, with its position, for the whole chain and its tender", async () => {
    const admin = await signInAs("admin@tarnwell.example");
    const all = await db.select().from(ledgerEntries).orderBy(asc(ledgerEntries.seq));
    const tenderEntries = all.filter((e) => e.tenderId === gaugesId);
    const target = tenderEntries[1];
    expect(target).toBeDefined();
    const before = await verify(admin);
    expect(before.body).toMatchObject({ ok: true, entries: all.length });
    expect((await verify(admin, gaugesId)).body).toMatchObject({ ok: true, entries: tenderEntries.length });

    await db.execute(sql`update ledger_entries set data = ${JSON.stringify({ quietly: "changed" })}::jsonb where seq = ${target.seq}`);

    const whole = await verify(admin);
    expect(whole.body).toMatchObject({ ok: false, brokenAt: target.seq, position: all.findIndex((e) => e.seq === target.seq) + 1, reason: "its content no longer matches its hash" });
    expect((await verify(admin, gaugesId)).body).toMatchObject({ ok: false, brokenAt: target.seq, position: 2 });
    // Another tender's entries are still intact where they stand.
    expect((await verify(admin, weirsId)).body).toMatchObject({ ok: true });
  });

  it("answers 404 for an unknown tender", async () => {
    expect((await verify(await signInAs("admin@tarnwell.example"), "no-such-tender")).status).toBe(404);
  });
});


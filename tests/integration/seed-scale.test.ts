// The scale workload at a tiny size: every row written through the app's functions, the ledger
// one valid chain, the report's counts equal to the database's, and the same seed giving the same
// workload twice (ids, hashes and times aside).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { asc, count, eq } from "drizzle-orm";
import type { PgTable } from "drizzle-orm/pg-core";
import { closeDb, getDb } from "@/lib/server/database";
import { claims, evidenceRuns, ledgerEntries, marks, offers, organisations, tenders, threads } from "@/db/schema";
import { seedScale, type ScaleReport } from "@/db/seed-scale";
import { freshDatabase } from "../support/app";
import { verifyLedger } from "@/lib/server/ledger";

const TINY = { tenders: 10, vendors: 6, wide: { offers: 7, points: 3 }, seed: 7 };

/** What a run wrote, without the parts that differ by nature (ids, hashes, timestamps). */
async function fingerprint() {
  const db = await getDb();
  const tenderRows = await db
    .select({ reference: tenders.reference, state: tenders.state, title: tenders.title })
    .from(tenders)
    .orderBy(asc(tenders.reference));
  const claimRows = await db
    .select({
      reference: tenders.reference,
      vendor: organisations.name,
      point: claims.pointIndex,
      value: claims.value,
      verdict: claims.verdict,
      status: offers.status,
      version: offers.version,
    })
    .from(claims)
    .innerJoin(offers, eq(offers.id, claims.offerId))
    .innerJoin(tenders, eq(tenders.id, claims.tenderId))
    .innerJoin(organisations, eq(organisations.id, claims.vendorOrgId));
  const actions = await db.select({ action: ledgerEntries.action }).from(ledgerEntries).orderBy(asc(ledgerEntries.seq));
  return {
    tenders: tenderRows,
    claims: claimRows.map((c) => JSON.stringify(c)).sort(),
    actions: actions.map((a) => a.action),
  };
}

const total = async (table: PgTable) => {
  const db = await getDb();
  return Number((await db.select({ n: count() }).from(table))[0].n);
};

beforeAll(async () => {
  await freshDatabase();
});
afterAll(() => closeDb());

describe("the scale seed", () => {
  let first: ScaleReport;
  let firstPrint: Awaited<ReturnType<typeof fingerprint>>;

  it("fills the demo database with tenders in every later state, a valid ledger and counts that match", async () => {
    first = await seedScale(TINY);
    const db = await getDb();
    expect(first.tenders).toBe(TINY.tenders);
    expect(await total(tenders)).toBe(TINY.tenders);
    // The demo's tenders and the ordinary ones: each state the workload plans, and the wide tender open for comparison.
    expect(Object.keys(first.byState).sort()).toEqual(expect.arrayContaining(["approval", "awarded", "commercial", "draft", "open", "technical"]));
    expect(first.offers).toBe(await total(offers));
    expect(first.claims).toBe(await total(claims));
    expect(first.marks).toBe(await total(marks));
    expect(first.evidenceRuns).toBe(await total(evidenceRuns));
    expect(first.threads).toBe(await total(threads));
    expect(first.ledgerEntries).toBe(await total(ledgerEntries));
    expect(first.vendorOrganisations).toBe(TINY.wide.offers);

    const [wide] = await db.select().from(tenders).where(eq(tenders.id, first.wideTenderId!));
    expect(wide.state).toBe("commercial");
    expect(wide.envelopesOpenedAt).not.toBeNull();
    const wideClaims = await db.select({ n: count() }).from(claims).where(eq(claims.tenderId, wide.id));
    expect(Number(wideClaims[0].n)).toBe(TINY.wide.offers * TINY.wide.points);

    const report = await verifyLedger(db);
    expect(report.ok).toBe(true);
    expect(report.entries).toBe(first.ledgerEntries);
    firstPrint = await fingerprint();
  }, 600_000);

  it("writes the same workload again from the same seed", async () => {
    // A fresh demo database: a new in-memory one on PGlite, the server's tables emptied and re-seeded on PostgreSQL.
    await closeDb();
    await freshDatabase();
    const second = await seedScale(TINY);
    const { seconds: _a, wideTenderId: _b, ...counts } = second;
    const { seconds: _c, wideTenderId: _d, ...before } = first;
    expect(counts).toEqual(before);
    expect(await fingerprint()).toEqual(firstPrint);
  }, 600_000);

  it("refuses to run on a database that holds more than the demo", async () => {
    await expect(seedScale(TINY)).rejects.toThrow(/db:reset/);
  });
});

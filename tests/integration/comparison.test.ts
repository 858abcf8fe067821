import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { declarations, ledgerEntries, marks, recommendations, tenders, users } from "@/db/schema";
import { POST as envelopesPost } from "@/app/api/v1/tenders/[id]/envelopes/route";
import { GET as comparisonGet } from "@/app/api/v1/tenders/[id]/comparison/route";
import { GET as recommendationGet, POST as recommendationPost } from "@/app/api/v1/tenders/[id]/recommendation/route";
import { getCurrentRecommendation } from "@/lib/server/recommendations";
import { appendLedger, verifyLedger } from "@/lib/server/ledger";
import { startLocalServices, type LocalServices } from "@/lib/dev/services";
import { flushMail, listCapturedMail } from "@/lib/mail";
import type { Comparison } from "@/lib/server/comparison";
import { closeDb, freshDatabase, params, request, signInAll } from "../support/app";
import { createCommercialTender, honest, impossible } from "../support/comparison-fixtures";

let db: Db;
let services: LocalServices;
const as: Record<string, Headers> = {};
const ENVELOPE_KEYS = ["unitPrice", "leadTimeWeeks", "warrantyMonths", "priceBreaks"];

beforeAll(async () => {
  services = await startLocalServices({ dataDir: mkdtempSync(path.join(tmpdir(), "rc-comparison-")), smtpPort: 0, s3Port: 0 });
  db = await freshDatabase();
  Object.assign(as, await signInAll("buyer", "engineer", "approver", "director", "kestrelink"));
});
afterAll(async () => {
  await flushMail();
  await services.stop();
  await closeDb();
});

const open = (who: string, id: string) => envelopesPost(request(`/api/v1/tenders/${id}/envelopes`, { method: "POST", headers: as[who] }), params({ id }));
const grid = (who: string, id: string) => comparisonGet(request(`/api/v1/tenders/${id}/comparison`, { headers: as[who] }), params({ id }));
const recommend = (who: string, id: string, body: unknown) =>
  recommendationPost(request(`/api/v1/tenders/${id}/recommendation`, { method: "POST", headers: as[who], body }), params({ id }));
const readGrid = async (who: string, id: string): Promise<Comparison> => {
  const response = await grid(who, id);
  expect(response.status).toBe(200);
  return response.json();
};
const ledgerFor = async (tenderId: string, action: string) =>
  db
    .select()
    .from(ledgerEntries)
    .where(and(eq(ledgerEntries.tenderId, tenderId), eq(ledgerEntries.action, action)));
const tenderRow = async (id: string) => (await db.select().from(tenders).where(eq(tenders.id, id)))[0];
const hasKeyDeep = (value: unknown, keys: string[]): boolean =>
  Array.isArray(value)
    ? value.some((v) => hasKeyDeep(v, keys))
    : typeof value === "object" && value !== null
      ? Object.entries(value).some(([k, v]) => keys.includes(k) || hasKeyDeep(v, keys))
      : false;

const fourOffers = [honest("Alder", 41, 10, 24), honest("Birch", 38.5, 14, 36), honest("Cedar", 44, 6, 24), impossible("Dunlin", 29, 8, 24)];

describe("opening the envelopes", () => {
  it("is refused with 409 before the technical sign-off, and writes nothing", async () => {
    const fx = await createCommercialTender(db, { signed: false, offers: fourOffers });
    const response = await open("buyer", fx.tenderId);
    expect(response.status).toBe(409);
    expect((await response.json()).error).toMatch(/sign/i);
    expect((await tenderRow(fx.tenderId)).envelopesOpenedAt).toBeNull();
    expect(await ledgerFor(fx.tenderId, "envelopes.opened")).toHaveLength(0);
  });

  it("is a buyer's act: an engineer and a vendor get 403", async () => {
    const fx = await createCommercialTender(db, { offers: fourOffers });
    expect((await open("engineer", fx.tenderId)).status).toBe(403);
    expect((await open("kestrelink", fx.tenderId)).status).toBe(403);
    expect((await tenderRow(fx.tenderId)).envelopesOpenedAt).toBeNull();
  });

  it("keeps prices out of the buyer's grid until opened, then shows every column; recorded once in the ledger", async () => {
    const fx = await createCommercialTender(db, { offers: fourOffers });
    const sealed = await readGrid("buyer", fx.tenderId);
    expect(sealed.envelopesOpened).toBe(false);
    expect(sealed.sheet.sealed).toBe(true);
    expect(hasKeyDeep(sealed.input, ENVELOPE_KEYS)).toBe(false);
    expect(sealed.input.offers.every((o) => o.envelope === null)).toBe(true);
    expect(sealed.sheet.offers.every((o) => o.totalPrice === null && o.total === null && o.rank === null)).toBe(true);
    expect(sealed.can.openEnvelopes).toBe(true);

    const opened = await open("buyer", fx.tenderId);
    expect(opened.status).toBe(200);
    expect((await opened.json()).envelopesOpenedAt).toBeTruthy();
    const entries = await ledgerFor(fx.tenderId, "envelopes.opened");
    expect(entries).toHaveLength(1);
    expect(entries[0].data).toMatchObject({ offers: 4 });
    expect((await open("buyer", fx.tenderId)).status).toBe(409);

    const full = await readGrid("buyer", fx.tenderId);
    expect(full.sheet.sealed).toBe(false);
    const birch = full.input.offers.find((o) => o.vendorName.startsWith("Birch"))!;
    expect(birch.envelope).toEqual({ unitPrice: 38.5, currency: "EUR", leadTimeWeeks: 14, warrantyMonths: 36, priceBreaks: [] });
    const birchScore = full.sheet.offers.find((o) => o.offerId === birch.id)!;
    expect(birchScore.totalPrice).toBe(154_000);
    expect(birchScore.lines.map((l) => l.criterion)).toEqual(["technical", "evidence", "price", "leadTime", "warranty"]);
    expect(birchScore.lines.every((l) => l.normalised !== null && l.contribution !== null)).toBe(true);
    expect(full.sheet.offers.filter((o) => o.rank !== null)).toHaveLength(3);
    expect(full.can).toMatchObject({ openEnvelopes: false, recommend: true, export: true });
  });
});

describe("who reads the comparison", () => {
  it("answers 403 to an engineer and to a vendor, 401 signed out", async () => {
    const fx = await createCommercialTender(db, { opened: true, offers: fourOffers });
    expect((await grid("engineer", fx.tenderId)).status).toBe(403);
    expect((await grid("kestrelink", fx.tenderId)).status).toBe(403);
    const anonymous = await comparisonGet(request(`/api/v1/tenders/${fx.tenderId}/comparison`), params({ id: fx.tenderId }));
    expect(anonymous.status).toBe(401);
  });

  it("lets an approver read it only once declared, and never the offers of a conflicted vendor", async () => {
    const fx = await createCommercialTender(db, { opened: true, offers: fourOffers });
    expect((await grid("approver", fx.tenderId)).status).toBe(403);
    const [approver] = await db.select().from(users).where(eq(users.email, "approver@tarnwell.example"));
    await db.insert(declarations).values({ tenderId: fx.tenderId, userId: approver.id, conflictedOrgIds: [fx.vendorOrgIds[0]] });
    const seen = await readGrid("approver", fx.tenderId);
    expect(seen.input.offers.map((o) => o.id).sort()).toEqual(fx.offerIds.slice(1).sort());
    expect(seen.can.openEnvelopes).toBe(false);
  });

  it("answers 404 for a tender that does not exist", async () => {
    expect((await grid("buyer", "no-such-tender")).status).toBe(404);
  });
});

describe("the tender's rule for confirmed impossible claims", () => {
  it("disqualify: the cheapest offer leaves the ranking as soon as an engineer rejects its impossible claim", async () => {
    const cheap = impossible("Dunlin", 29, 8, 24);
    cheap.claims = [{ value: 1e-6 }, { value: 1e-6, mark: "accepted" }];
    const fx = await createCommercialTender(db, {
      opened: true,
      rule: "disqualify",
      offers: [honest("Alder", 41, 10, 24), honest("Birch", 38.5, 14, 36), cheap],
    });
    const before = await readGrid("buyer", fx.tenderId);
    const dunlin = () => before.sheet.offers.find((o) => o.offerId === fx.offerIds[2])!;
    expect(dunlin()).toMatchObject({ disqualified: false });
    expect(dunlin().rank).not.toBeNull();

    // A later mark is the current one; the comparison is recomputed on the next read.
    const [engineer] = await db.select().from(users).where(eq(users.email, "engineer@tarnwell.example"));
    // Written as the app writes a mark: with its ledger entry in the same transaction (the comparison is keyed to the tender's ledger).
    await db.transaction(async (tx) => {
      await tx.insert(marks).values({
        claimId: fx.claimIds[2][1],
        tenderId: fx.tenderId,
        vendorOrgId: fx.vendorOrgIds[2],
        mark: "rejected-impossible",
        comment: "Beyond the converse.",
        markedBy: engineer.id,
        markedAt: new Date(Date.now() + 1000),
      });
      await appendLedger(tx, {
        tenderId: fx.tenderId,
        actor: { id: engineer.id, label: engineer.name },
        action: "claim.marked",
        subjectType: "Claim",
        subjectId: fx.claimIds[2][1],
        data: { mark: "rejected-impossible" },
      });
    });
    const after = await readGrid("buyer", fx.tenderId);
    const out = after.sheet.offers.find((o) => o.offerId === fx.offerIds[2])!;
    expect(out).toMatchObject({ disqualified: true, rank: null });
    expect(out.confirmedImpossible[0]).toMatch(/Storm fade/);
    expect(
      after.sheet.offers
        .filter((o) => o.rank !== null)
        .map((o) => o.rank)
        .sort(),
    ).toEqual([1, 2]);
    // The price reference moves to the cheapest offer still standing.
    const birch = after.sheet.offers.find((o) => o.offerId === fx.offerIds[1])!;
    expect(birch.lines.find((l) => l.criterion === "price")!.normalised).toBe(100);
  });

  it("penalty: the same offer stays ranked but loses the penalty points, which moves it down", async () => {
    const offers = [honest("Alder", 41, 10, 24), impossible("Dunlin", 15, 6, 36)];
    const soft = await createCommercialTender(db, { opened: true, rule: "penalty", penalty: 0, offers });
    const hard = await createCommercialTender(db, { opened: true, rule: "penalty", penalty: 30, offers });
    const unpenalised = (await readGrid("buyer", soft.tenderId)).sheet.offers.find((o) => o.offerId === soft.offerIds[1])!;
    expect(unpenalised.rank).toBe(1);
    const sheet = (await readGrid("buyer", hard.tenderId)).sheet;
    const dunlin = sheet.offers.find((o) => o.offerId === hard.offerIds[1])!;
    expect(dunlin).toMatchObject({ disqualified: false, penalty: 30, rank: 2 });
    expect(dunlin.total).toBeCloseTo(dunlin.subtotal! - 30, 9);
    expect(dunlin.subtotal).toBeCloseTo(unpenalised.subtotal!, 9);
    expect(sheet.offers[0].offerId).toBe(hard.offerIds[0]);
  });
});

describe("the recommendation", () => {
  const justification = "Best total score with a plausible code at both operating points and a short lead time.";

  it("refuses a disqualified offer with 409 and writes nothing", async () => {
    const fx = await createCommercialTender(db, { opened: true, offers: fourOffers });
    const response = await recommend("buyer", fx.tenderId, { offerId: fx.offerIds[3], quantity: 4000, value: 116_000, justification });
    expect(response.status).toBe(409);
    expect((await response.json()).error).toMatch(/disqualified/);
    expect((await tenderRow(fx.tenderId)).state).toBe("commercial");
    expect(await getCurrentRecommendation(db, fx.tenderId)).toBeNull();
  });

  it("refuses bad input with 400 naming the field, a vendor or engineer with 403, before opening with 409", async () => {
    const fx = await createCommercialTender(db, { offers: fourOffers });
    const body = { offerId: fx.offerIds[0], quantity: 4000, value: 164_000, justification };
    expect((await recommend("buyer", fx.tenderId, body)).status).toBe(409);
    await open("buyer", fx.tenderId);
    const short = await recommend("buyer", fx.tenderId, { ...body, justification: "Cheapest." });
    expect(short.status).toBe(400);
    expect(Object.keys((await short.json()).fieldErrors)).toContain("justification");
    expect((await recommend("buyer", fx.tenderId, { ...body, quantity: 0.5 })).status).toBe(400);
    expect((await recommend("buyer", fx.tenderId, { ...body, offerId: "not-an-offer" })).status).toBe(400);
    expect((await recommend("kestrelink", fx.tenderId, body)).status).toBe(403);
    expect((await recommend("engineer", fx.tenderId, body)).status).toBe(403);
    expect(await getCurrentRecommendation(db, fx.tenderId)).toBeNull();
  });

  it("moves the tender to approval with a ledger entry, snapshots the sheet, tells the approvers; a returned one can be revised", async () => {
    const fx = await createCommercialTender(db, { opened: true, offers: fourOffers });
    const response = await recommend("buyer", fx.tenderId, { offerId: fx.offerIds[0], quantity: 4000, value: 164_000, justification });
    expect(response.status).toBe(201);
    const row = await response.json();
    expect(row).toMatchObject({ status: "pending", quantity: 4000, value: 164_000, currency: "EUR", offerId: fx.offerIds[0] });
    expect((await tenderRow(fx.tenderId)).state).toBe("approval");
    const [entry] = await ledgerFor(fx.tenderId, "recommendation.submitted");
    expect(entry.data).toMatchObject({ from: "commercial", to: "approval", value: 164_000, offerId: fx.offerIds[0] });
    const current = (await getCurrentRecommendation(db, fx.tenderId))!;
    expect(current.id).toBe(row.id);
    expect((current.scoreSheet as { offers: unknown[] }).offers).toHaveLength(4);
    // A second recommendation while one is pending is the wrong state.
    expect((await recommend("buyer", fx.tenderId, { offerId: fx.offerIds[1], quantity: 4000, value: 154_000, justification })).status).toBe(409);

    await flushMail();
    expect(listCapturedMail().some((m) => m.to.includes("approver@tarnwell.example") && /awaits/.test(m.subject))).toBe(true);

    // The approvals side returns it (simulated here): the buyer revises and resubmits; the old row stays.
    await db.update(recommendations).set({ status: "returned" }).where(eq(recommendations.id, row.id));
    await db.update(tenders).set({ state: "commercial" }).where(eq(tenders.id, fx.tenderId));
    const again = await recommend("buyer", fx.tenderId, { offerId: fx.offerIds[1], quantity: 4000, value: 154_000, justification });
    expect(again.status).toBe(201);
    const listed = await (
      await recommendationGet(request(`/api/v1/tenders/${fx.tenderId}/recommendation`, { headers: as.buyer }), params({ id: fx.tenderId }))
    ).json();
    expect(listed.history.map((r: { status: string }) => r.status)).toEqual(["pending", "returned"]);
    expect(listed.current.offerId).toBe(fx.offerIds[1]);
    expect(listed.current).not.toHaveProperty("scoreSheet");
  });

  it("keeps the ledger chain intact through all of the above", async () => {
    expect(await verifyLedger(db)).toMatchObject({ ok: true });
  });
});

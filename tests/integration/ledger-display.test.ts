import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { tenders } from "@/db/schema";
import { GET as ledgerGet } from "@/app/api/v1/tenders/[id]/ledger/route";
import { POST as decidePost } from "@/app/api/v1/tenders/[id]/approvals/route";
import { POST as declarePost } from "@/app/api/v1/tenders/[id]/declaration/route";
import { appendLedger } from "@/lib/server/ledger";
import { LEDGER_PAGE_SIZE } from "@/lib/server/tender-ledger";
import { closeDb, freshDatabase, params, request, signInAs } from "../support/app";
import { createApprovalFixture, type ApprovalFixture } from "../support/approval-fixtures";

interface Line {
  sentence: string;
  action: string;
  details: { key: string; text: string }[];
  masked: string[];
}

let db: Db;
let gauges = "";
let awarded: ApprovalFixture;

const ledgerAs = async (email: string, tenderId: string, query = "") =>
  ledgerGet(request(`/api/v1/tenders/${tenderId}/ledger${query}`, { headers: await signInAs(email) }), params({ id: tenderId }));
const entriesAs = async (email: string, tenderId: string): Promise<Line[]> => (await (await ledgerAs(email, tenderId)).json()).entries;
const text = (line: Line) => JSON.stringify(line.details);

beforeAll(async () => {
  db = await freshDatabase();
  [{ id: gauges }] = await db.select({ id: tenders.id }).from(tenders).where(eq(tenders.reference, "RC-2027-001"));
  awarded = await createApprovalFixture(db, { value: 120_000 });
  const approver = await signInAs("approver@tarnwell.example");
  const body = { conflict: "none", conflictedOrgIds: [], statement: "No ties to any vendor of this tender." };
  await declarePost(request(`/api/v1/tenders/${awarded.tenderId}/declaration`, { method: "POST", headers: approver, body }), params({ id: awarded.tenderId }));
  const decided = await decidePost(
    request(`/api/v1/tenders/${awarded.tenderId}/approvals`, { method: "POST", headers: approver, body: { decision: "approve", comment: "Within budget." } }),
    params({ id: awarded.tenderId }),
  );
  expect((await decided.json()).kind).toBe("awarded");
});
afterAll(closeDb);

describe("the Ledger tab, read by an admin", () => {
  it("masks the award value, the approver's comment and the declaration statement, keeping the memo fingerprint", async () => {
    const lines = await entriesAs("admin@tarnwell.example", awarded.tenderId);
    const award = lines.find((l) => l.action === "tender.awarded")!;
    expect(award.masked).toEqual(expect.arrayContaining(["value", "currency", "offerId"]));
    expect(text(award)).not.toContain("120000");
    expect(award.details.map((d) => d.key)).toEqual(expect.arrayContaining(["memo", "sha256"]));
    const approval = lines.find((l) => l.action === "approval.given")!;
    expect(approval.masked).toEqual(expect.arrayContaining(["value", "comment"]));
    expect(text(approval)).not.toMatch(/120000|Within budget/);
    const declaration = lines.find((l) => l.action === "declaration.made")!;
    expect(declaration.masked).toContain("statement");
    expect(text(declaration)).not.toContain("No ties");
  });

  it("masks the verdicts of every offer", async () => {
    const offers = (await entriesAs("admin@tarnwell.example", gauges)).filter((l) => l.action === "offer.submitted");
    expect(offers.length).toBeGreaterThan(0);
    for (const line of offers) {
      expect(line.masked).toEqual(expect.arrayContaining(["verdicts", "summary", "module"]));
      expect(text(line)).not.toMatch(/plausible|impossible/);
    }
  });
});

describe("the Ledger tab, read by the buyer", () => {
  it("shows what the buyer may read, as sentences naming who did what to which tender", async () => {
    const lines = await entriesAs("buyer@tarnwell.example", awarded.tenderId);
    const award = lines.find((l) => l.action === "tender.awarded")!;
    expect(award.masked).toEqual([]);
    expect(text(award)).toContain("120000");
    expect(award.sentence).toBe(`${awarded.reference} was awarded on Helen Strand's approval.`);
    expect(lines.find((l) => l.action === "approval.given")!.sentence).toBe(`Helen Strand approved the award recommendation of ${awarded.reference}.`);
    expect(lines.find((l) => l.action === "declaration.made")!.details).toContainEqual({ key: "statement", text: "No ties to any vendor of this tender." });
  });
});

describe("ledger pages", () => {
  it("come newest first, a page at a time, and refuse a page that is not a number", async () => {
    const ids = (await db.select({ id: tenders.id, createdBy: tenders.createdBy }).from(tenders).where(eq(tenders.id, awarded.tenderId)))[0];
    await db.transaction(async (tx) => {
      for (let i = 0; i < LEDGER_PAGE_SIZE; i++)
        await appendLedger(tx, { tenderId: ids.id, actor: null, action: "test.filler", subjectType: "Tender", data: { i } });
    });
    const first = await (await ledgerAs("buyer@tarnwell.example", awarded.tenderId)).json();
    expect(first).toMatchObject({ page: 1, pages: 2 });
    expect(first.entries).toHaveLength(LEDGER_PAGE_SIZE);
    expect(first.entries[0].details).toEqual([{ key: "i", text: String(LEDGER_PAGE_SIZE - 1) }]);
    const second = await (await ledgerAs("buyer@tarnwell.example", awarded.tenderId, "?page=2")).json();
    expect(second.entries.at(-1).action).toBe("declaration.made");
    expect((await ledgerAs("buyer@tarnwell.example", awarded.tenderId, "?page=two")).status).toBe(400);
    expect((await ledgerAs("engineer@tarnwell.example", awarded.tenderId)).status).toBe(403);
  });
});

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { ledgerEntries, objections, tenders } from "@/db/schema";
import { GET as signOffGet, POST as decidePost } from "@/app/api/v1/tenders/[id]/approvals/route";
import { SAFETY_CAUTION } from "@/lib/cautions";
import { POST as declarePost } from "@/app/api/v1/tenders/[id]/declaration/route";
import { GET as objectionsGet, POST as objectionsPost } from "@/app/api/v1/tenders/[id]/objections/route";
import { clearCapturedMail, type CapturedMail } from "@/lib/mail";
import { mailAbout } from "../support/mail";
import { closeDb, freshDatabase, params, request, signInAs } from "../support/app";
import { createApprovalFixture, type ApprovalFixture } from "../support/approval-fixtures";

let db: Db;
beforeAll(async () => {
  db = await freshDatabase();
});
afterAll(closeDb);

/** A fixture tender awarded to Kestrelink by one approval (120,000 EUR needs one), with its mail. */
async function award(disclosure?: "rank-and-scores", safetyRelevant = false): Promise<{ f: ApprovalFixture; mail: CapturedMail[] }> {
  const f = await createApprovalFixture(db, { value: 120_000 });
  if (safetyRelevant) await db.update(tenders).set({ safetyRelevant }).where(eq(tenders.id, f.tenderId));
  if (disclosure) await db.update(tenders).set({ noticeDisclosure: disclosure, standstillDays: 14 }).where(eq(tenders.id, f.tenderId));
  const approver = await signInAs("approver@tarnwell.example");
  const body = { conflict: "none", conflictedOrgIds: [], statement: "No ties to any vendor of this tender." };
  expect(
    (await declarePost(request(`/api/v1/tenders/${f.tenderId}/declaration`, { method: "POST", headers: approver, body }), params({ id: f.tenderId }))).status,
  ).toBe(201);
  clearCapturedMail();
  const decided = await decidePost(
    request(`/api/v1/tenders/${f.tenderId}/approvals`, { method: "POST", headers: approver, body: { decision: "approve", comment: "Within budget." } }),
    params({ id: f.tenderId }),
  );
  expect((await decided.json()).kind).toBe("awarded");
  return { f, mail: await mailAbout(f.reference, 5) };
}
const regretTo = (mail: { to: string[]; text: string }[], address: string) => mail.find((m) => m.to.includes(address))!.text;

const objectTo = async (email: string, tenderId: string, text: string) =>
  objectionsPost(
    request(`/api/v1/tenders/${tenderId}/objections`, { method: "POST", headers: await signInAs(email), body: { body: text } }),
    params({ id: tenderId }),
  );
const objectionsOf = async (email: string, tenderId: string) =>
  (await objectionsGet(request(`/api/v1/tenders/${tenderId}/objections`, { headers: await signInAs(email) }), params({ id: tenderId }))).json();

describe("award notices", () => {
  it("by default tell each losing vendor the winner's name and its own rank, no score, and the standstill period", async () => {
    const { mail } = await award();
    const oxbow = regretTo(mail, "bids@oxbow.example");
    expect(oxbow).toContain("The tender is awarded to Kestrelink Radio.");
    expect(oxbow).toContain("Your offer ranked 3 of 3.");
    // With its own price, a price score would give away the winning price (100 x lowest / own).
    expect(oxbow).not.toMatch(/score|of 100|€/);
    expect(oxbow).toMatch(/standstill period of 10 days, on \w+ \d+ \w+ \d{4}, \d\d:\d\d \(Europe\/London\)/);
    expect(oxbow).toMatch(/you may object to it in writing: http\S+\/tenders\/\S+\/notices/);
    const winner = regretTo(mail, "sales@kestrelink.example");
    expect(winner).toContain("standstill period of 10 days");
  });

  it("add the vendor's own scores and the winner's total only when the tender discloses scores", async () => {
    const { mail } = await award("rank-and-scores");
    const oxbow = regretTo(mail, "bids@oxbow.example");
    expect(oxbow).toContain("Your offer ranked 3 of 3, with a total score of 64.2 out of 100.");
    expect(oxbow).toContain("The winning offer's total score is 82.4 out of 100.");
    expect(oxbow).toContain("standstill period of 14 days");
    expect(oxbow).not.toMatch(/€|Marram|Quillfield/);
  });

  it("of a safety-relevant tender carry the stronger caution, and so does its Sign-off tab", async () => {
    const { f, mail } = await award(undefined, true);
    for (const m of mail) expect(m.text, m.subject).toContain(SAFETY_CAUTION);
    const view = await (
      await signOffGet(request(`/api/v1/tenders/${f.tenderId}/approvals`, { headers: await signInAs("buyer@tarnwell.example") }), params({ id: f.tenderId }))
    ).json();
    expect(view.tender.safetyRelevant).toBe(true);
    const plain = await award();
    for (const m of plain.mail) expect(m.text).not.toContain(SAFETY_CAUTION);
  });
});

describe("objections during the standstill period", () => {
  let f: ApprovalFixture;
  const TEXT = "The lead time of the winning offer cannot be met; we ask you to review the award.";

  beforeAll(async () => {
    ({ f } = await award());
  });

  it("a vendor lodges one in writing: recorded, in the ledger, and told to the buyer", async () => {
    clearCapturedMail();
    const lodged = await objectTo("bids@oxbow.example", f.tenderId, TEXT);
    expect(lodged.status).toBe(201);
    const [entry] = await db
      .select()
      .from(ledgerEntries)
      .where(and(eq(ledgerEntries.tenderId, f.tenderId), eq(ledgerEntries.action, "objection.lodged")));
    expect(entry.data).toMatchObject({ vendor: "Oxbow Wireless", length: TEXT.length });
    const toBuyer = (await mailAbout("objection to the award", 1)).find((m) => m.to.includes("buyer@tarnwell.example"));
    expect(toBuyer?.subject).toBe(`${f.reference}: objection to the award from Oxbow Wireless`);
    expect(toBuyer?.text).toContain(TEXT);
  });

  it("the buyer reads every objection; another vendor none of them", async () => {
    const buyer = await objectionsOf("buyer@tarnwell.example", f.tenderId);
    expect(buyer.objections.map((o: { vendorName: string; body: string }) => [o.vendorName, o.body])).toEqual([["Oxbow Wireless", TEXT]]);
    expect(buyer.standstill).toMatchObject({ days: 10, final: false });
    const other = await objectionsOf("offers@marram.example", f.tenderId);
    expect(other.objections).toEqual([]);
    expect(other.mayLodge).toBe(true);
  });

  it("is refused from the buying side, when too short, and once the award is final, changing nothing", async () => {
    const before = await db.select().from(objections).where(eq(objections.tenderId, f.tenderId));
    const engineer = await objectTo("engineer@tarnwell.example", f.tenderId, TEXT);
    expect(engineer.status).toBe(403);
    const short = await objectTo("offers@marram.example", f.tenderId, "No.");
    expect(short.status).toBe(400);
    await db
      .update(tenders)
      .set({ awardedAt: new Date(Date.now() - 11 * 86_400_000) })
      .where(eq(tenders.id, f.tenderId));
    const late = await objectTo("offers@marram.example", f.tenderId, TEXT);
    expect(late.status).toBe(409);
    expect((await late.json()).error).toMatch(/standstill period of 10 days has ended and the award is final/);
    expect(await db.select().from(objections).where(eq(objections.tenderId, f.tenderId))).toEqual(before);
  });

  it("is refused before any award", async () => {
    const pending = await createApprovalFixture(db, { value: 120_000 });
    const early = await objectTo("bids@oxbow.example", pending.tenderId, TEXT);
    expect(early.status).toBe(409);
    expect((await early.json()).error).toMatch(/has not been awarded/);
  });
});

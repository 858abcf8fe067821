import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { count, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { approvalBands, approvals, ledgerEntries, memos, recommendations, tenders } from "@/db/schema";
import { GET as bandsGet, POST as bandsPost } from "@/app/api/v1/approval-bands/route";
import { DELETE as bandDelete, PUT as bandPut } from "@/app/api/v1/approval-bands/[id]/route";
import { GET as memoGet } from "@/app/api/v1/tenders/[id]/memo/route";
import { GET as signOffGet, POST as decidePost } from "@/app/api/v1/tenders/[id]/approvals/route";
import { POST as declarePost } from "@/app/api/v1/tenders/[id]/declaration/route";
import { closeDb, freshDatabase, params, request, signInAs } from "../support/app";
import { createApprovalFixture, ensureDemoBands, FIXTURE_OFFERS, idsByEmail, insertRecommendation, type ApprovalFixture } from "../support/approval-fixtures";
import { flushMail, listCapturedMail } from "@/lib/mail";
import { formatMoney } from "@/lib/format";
import { pdfText } from "../unit/pdf/pdf-text";

let db: Db;
let as: Record<"admin" | "buyer" | "engineer" | "approver" | "director", Headers>;
beforeAll(async () => {
  db = await freshDatabase();
  await ensureDemoBands(db);
  as = {
    admin: await signInAs("admin@tarnwell.example"),
    buyer: await signInAs("buyer@tarnwell.example"),
    engineer: await signInAs("engineer@tarnwell.example"),
    approver: await signInAs("approver@tarnwell.example"),
    director: await signInAs("director@tarnwell.example"),
  };
});
afterAll(closeDb);

const decide = (headers: Headers, tenderId: string, body: unknown) =>
  decidePost(request(`/api/v1/tenders/${tenderId}/approvals`, { method: "POST", headers, body }), params({ id: tenderId }));
const signOff = async (headers: Headers, tenderId: string) =>
  (await signOffGet(request(`/api/v1/tenders/${tenderId}/approvals`, { headers }), params({ id: tenderId }))).json();
async function declare(headers: Headers, tenderId: string, conflictedOrgIds: string[] = []) {
  const body = { conflict: conflictedOrgIds.length ? "some" : "none", conflictedOrgIds, statement: "I have no ties I have not named here." };
  const response = await declarePost(request(`/api/v1/tenders/${tenderId}/declaration`, { method: "POST", headers, body }), params({ id: tenderId }));
  expect(response.status).toBe(201);
}

/** Everything a refused decision must leave untouched. */
async function snapshot(f: ApprovalFixture) {
  const [t] = await db.select({ state: tenders.state }).from(tenders).where(eq(tenders.id, f.tenderId));
  const recs = await db
    .select({ id: recommendations.id, status: recommendations.status, needed: recommendations.approvalsNeeded })
    .from(recommendations)
    .where(eq(recommendations.tenderId, f.tenderId));
  const [{ n: given }] = await db.select({ n: count() }).from(approvals).where(eq(approvals.tenderId, f.tenderId));
  const [{ n: ledger }] = await db.select({ n: count() }).from(ledgerEntries);
  return { state: t.state, recs, given, ledger };
}

async function expectRefused(response: Response, status: number, message: RegExp | string, f: ApprovalFixture, before: Awaited<ReturnType<typeof snapshot>>) {
  expect(response.status).toBe(status);
  const body = await response.json();
  expect(body.error).toMatch(message);
  expect(await snapshot(f)).toEqual(before);
}

describe("approval bands (admin)", () => {
  it("lists the bands to buyers and approvers, not to engineers", async () => {
    expect((await bandsGet(request("/api/v1/approval-bands", { headers: as.engineer }), undefined)).status).toBe(403);
    const response = await bandsGet(request("/api/v1/approval-bands", { headers: as.approver }), undefined);
    expect(response.status).toBe(200);
    const { bands } = await response.json();
    expect(bands.map((b: { minValue: number }) => b.minValue)).toEqual([0, 50_000, 250_000]);
  });

  it("refuses an overlapping band with a clear message and writes nothing", async () => {
    const before = await db.select().from(approvalBands);
    const response = await bandsPost(
      request("/api/v1/approval-bands", {
        method: "POST",
        headers: as.admin,
        body: { currency: "EUR", minValue: 200_000, maxValue: 300_000, approvalsNeeded: 1, minApproverLimit: 0 },
      }),
      undefined,
    );
    expect(response.status).toBe(400);
    expect((await response.json()).error).toMatch(/overlap/);
    expect(await db.select().from(approvalBands)).toEqual(before);
  });

  it("lets only an admin add, change and remove a band, each with a ledger entry", async () => {
    const usd = { currency: "USD", minValue: 0, maxValue: null, approvalsNeeded: 1, minApproverLimit: 10_000 };
    expect((await bandsPost(request("/api/v1/approval-bands", { method: "POST", headers: as.buyer, body: usd }), undefined)).status).toBe(403);
    const created = await bandsPost(request("/api/v1/approval-bands", { method: "POST", headers: as.admin, body: usd }), undefined);
    expect(created.status).toBe(201);
    const { id } = await created.json();
    const changed = await bandPut(
      request(`/api/v1/approval-bands/${id}`, { method: "PUT", headers: as.admin, body: { ...usd, approvalsNeeded: 2 } }),
      params({ id }),
    );
    expect((await changed.json()).approvalsNeeded).toBe(2);
    expect((await bandDelete(request(`/api/v1/approval-bands/${id}`, { method: "DELETE", headers: as.admin }), params({ id }))).status).toBe(204);
    const actions = (await db.select().from(ledgerEntries).where(eq(ledgerEntries.subjectId, id))).map((e) => e.action);
    expect(actions).toEqual(["approval-band.added", "approval-band.changed", "approval-band.removed"]);
    expect((await bandDelete(request(`/api/v1/approval-bands/${id}`, { method: "DELETE", headers: as.admin }), params({ id }))).status).toBe(404);
  });
});

describe("segregation of duties and limits", () => {
  it("refuses the preparer approving their own recommendation", async () => {
    const ids = await idsByEmail(db);
    const f = await createApprovalFixture(db, { value: 100_000 });
    // The director also holds the approver role; here the recommendation is theirs.
    await db.update(recommendations).set({ preparedBy: ids.director }).where(eq(recommendations.id, f.recommendationId));
    await declare(as.director, f.tenderId);
    const before = await snapshot(f);
    await expectRefused(await decide(as.director, f.tenderId, { decision: "approve" }), 403, "No one approves a recommendation they prepared.", f, before);
  });

  it("refuses an approver whose limit is below the value", async () => {
    const f = await createApprovalFixture(db, { value: 300_000 });
    await declare(as.approver, f.tenderId);
    const before = await snapshot(f);
    await expectRefused(
      await decide(as.approver, f.tenderId, { decision: "approve" }),
      403,
      "Your approval limit of €250,000.00 does not cover this award of €300,000.00.",
      f,
      before,
    );
  });

  it("refuses an approver who declared a conflict on the tender", async () => {
    const f = await createApprovalFixture(db, { value: 100_000 });
    await declare(as.approver, f.tenderId, [f.orgIds[3]]);
    const before = await snapshot(f);
    await expectRefused(await decide(as.approver, f.tenderId, { decision: "approve" }), 403, /declared a conflict of interest/, f, before);
  });

  it("asks for the declaration before any decision", async () => {
    const f = await createApprovalFixture(db, { value: 100_000 });
    const before = await snapshot(f);
    await expectRefused(await decide(as.director, f.tenderId, { decision: "approve" }), 403, /Declare any conflict of interest/, f, before);
  });

  it("refuses the same approver giving two of the approvals a band needs", async () => {
    const f = await createApprovalFixture(db, { value: 250_000 });
    await declare(as.director, f.tenderId);
    expect((await decide(as.director, f.tenderId, { decision: "approve" })).status).toBe(200);
    const before = await snapshot(f);
    await expectRefused(await decide(as.director, f.tenderId, { decision: "approve" }), 409, /same person cannot give two of the approvals/, f, before);
  });

  it("needs a comment to return, and refuses non-approvers and bad input", async () => {
    const f = await createApprovalFixture(db, { value: 100_000 });
    await declare(as.approver, f.tenderId);
    const before = await snapshot(f);
    await expectRefused(await decide(as.approver, f.tenderId, { decision: "return" }), 400, /Say why you return it/, f, before);
    await expectRefused(await decide(as.approver, f.tenderId, { decision: "maybe" }), 400, /approve.*return/, f, before);
    await expectRefused(await decide(as.buyer, f.tenderId, { decision: "approve" }), 403, "Only approvers approve or return a recommendation.", f, before);
    const out = await decidePost(
      request(`/api/v1/tenders/${f.tenderId}/approvals`, { method: "POST", body: { decision: "approve" } }),
      params({ id: f.tenderId }),
    );
    expect(out.status).toBe(401);
    expect((await decide(as.approver, "no-such-tender", { decision: "approve" })).status).toBe(404);
  });
});

/** The captured mail about one tender, once at least `atLeast` messages have arrived. */
async function mailAbout(reference: string, atLeast: number) {
  for (let i = 0; i < 100; i++) {
    await flushMail();
    const found = listCapturedMail().filter((m) => m.subject.includes(reference));
    if (found.length >= atLeast) return found;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`fewer than ${atLeast} messages about ${reference}`);
}

let awarded: ApprovalFixture | undefined;

describe("from recommendation to award", () => {
  it("routes to the approvers whose limits cover the value, fixing the band rule in force", async () => {
    const f = await createApprovalFixture(db, { value: 250_000 });
    await declare(as.approver, f.tenderId);
    const view = await signOff(as.approver, f.tenderId);
    expect(view.recommendation.rule).toEqual({ approvalsNeeded: 2, minApproverLimit: 250_000 });
    expect(view.routedTo).toEqual(["Helen Strand", "Tomas Veld"]);
    expect(view.me).toMatchObject({ allowed: true, reason: null });
    expect(view.offers).toHaveLength(4);
    expect(JSON.stringify(view)).not.toMatch(/unitPrice|€/);
    // Not yet declared: the director sees only the request to declare.
    expect(await signOff(as.director, f.tenderId)).toMatchObject({ canDeclare: true, recommendation: null });
  });

  it("returns, resubmits and awards after two approvals, with ledger entries and a stored memo", async () => {
    const ids = await idsByEmail(db);
    const f = await createApprovalFixture(db, { value: 250_000 });
    await declare(as.approver, f.tenderId);
    await declare(as.director, f.tenderId);

    const first = await decide(as.approver, f.tenderId, { decision: "approve", comment: "Within budget." });
    expect(await first.json()).toMatchObject({ kind: "approved", given: 1, needed: 2 });
    // The band rule is stored on the recommendation with the first decision: later band edits do not touch it.
    await db.update(approvalBands).set({ approvalsNeeded: 3 }).where(eq(approvalBands.minValue, 250_000));
    const [stored] = await db.select().from(recommendations).where(eq(recommendations.id, f.recommendationId));
    expect(stored.approvalsNeeded).toBe(2);

    const returned = await decide(as.director, f.tenderId, { decision: "return", comment: "Confirm the lead time with the vendor." });
    expect(await returned.json()).toMatchObject({ kind: "returned" });
    expect((await snapshot(f)).state).toBe("commercial");
    expect((await decide(as.approver, f.tenderId, { decision: "approve" })).status).toBe(409);

    await db.update(approvalBands).set({ approvalsNeeded: 2 }).where(eq(approvalBands.minValue, 250_000));
    await insertRecommendation(db, {
      tenderId: f.tenderId,
      offerId: f.offerIds[0],
      value: 250_000,
      preparedBy: ids.buyer,
      offerIds: f.offerIds,
      justification: "Lead time confirmed at 8 weeks in writing.",
    });
    expect(await (await decide(as.director, f.tenderId, { decision: "approve" })).json()).toMatchObject({ kind: "approved", given: 1 });
    const last = await decide(as.approver, f.tenderId, { decision: "approve", comment: "Second signature." });
    expect(last.status).toBe(200);
    const outcome = await last.json();
    expect(outcome.kind).toBe("awarded");

    const [tender] = await db.select().from(tenders).where(eq(tenders.id, f.tenderId));
    expect(tender.state).toBe("awarded");
    expect(tender.awardedAt).not.toBeNull();
    const [memo] = await db.select().from(memos).where(eq(memos.tenderId, f.tenderId));
    expect(memo.identifier).toBe(`${f.reference}-M1`);
    expect(memo.sha256).toMatch(/^[0-9a-f]{64}$/);
    const ledger = await db.select().from(ledgerEntries).where(eq(ledgerEntries.tenderId, f.tenderId));
    expect(ledger.map((e) => e.action)).toEqual([
      "declaration.made",
      "declaration.made",
      "approval.given",
      "recommendation.returned",
      "approval.given",
      "approval.given",
      "tender.awarded",
    ]);
    expect(ledger.at(-1)!.data).toMatchObject({ sha256: memo.sha256, memo: memo.identifier, to: "awarded" });

    // Awarded is read-only: no more decisions.
    expect((await decide(as.director, f.tenderId, { decision: "return", comment: "Too late now." })).status).toBe(409);
    const view = await signOff(as.buyer, f.tenderId);
    expect(view.memo).toMatchObject({ identifier: memo.identifier, sha256: memo.sha256 });
    // Decisions are grouped by recommendation: Helen's approval of the returned one is not a decision on the award.
    const said = (list: { name: string; decision: string }[]) => list.map((d) => `${d.name} ${d.decision}`);
    expect(said(view.decisions)).toEqual(["Tomas Veld approved", "Helen Strand approved"]);
    expect(view.earlier).toHaveLength(1);
    expect(view.earlier[0]).toMatchObject({ status: "returned" });
    expect(said(view.earlier[0].decisions)).toEqual(["Helen Strand approved", "Tomas Veld returned"]);

    // The ledger groups them the same way: each decision names its recommendation, the award the last one.
    const decisions = ledger.filter((e) => ["approval.given", "recommendation.returned"].includes(e.action)).map((e) => e.data.recommendationId);
    expect(decisions[0]).toBe(decisions[1]);
    expect(decisions[2]).toBe(decisions[3]);
    expect(decisions[0]).not.toBe(decisions[2]);
    expect(ledger.at(-1)!.data.recommendationId).toBe(decisions[2]);
    // And so does the memo: the award's two approvals, not the one given to the returned recommendation.
    const file = await memoGet(request(`/api/v1/tenders/${f.tenderId}/memo`, { headers: as.buyer }), params({ id: f.tenderId }));
    const text = await pdfText(new Uint8Array(await file.arrayBuffer()));
    expect(text.match(/Approved by Helen Strand/g)).toHaveLength(1);
    expect(text.match(/Approved by Tomas Veld/g)).toHaveLength(1);
    awarded = f;
  });

  it("sends the award notice to the winner and regret notices that name only the winner and no price", async () => {
    const f = awarded!;
    const mail = await mailAbout(f.reference, 6);
    const to = (address: string) => mail.filter((m) => m.to.includes(address));
    expect(to("sales@kestrelink.example").map((m) => m.subject)).toEqual([`Award notice: ${f.reference} ${f.title}`]);
    expect(to("buyer@tarnwell.example").some((m) => /returned by Tomas Veld/.test(m.subject))).toBe(true);
    expect(to("buyer@tarnwell.example").some((m) => /awarded to Kestrelink Radio/.test(m.subject))).toBe(true);
    const others = { "offers@marram.example": "Marram Telemetry", "bids@oxbow.example": "Oxbow Wireless", "tenders@quillfield.example": "Quillfield RF" };
    for (const [address, own] of Object.entries(others)) {
      const [regret] = to(address);
      expect(regret.subject).toBe(`Outcome of tender ${f.reference} ${f.title}`);
      expect(regret.text).toContain(`Dear ${own}`);
      expect(regret.text).toContain("The tender is awarded to Kestrelink Radio.");
      for (const vendor of FIXTURE_OFFERS.filter((o) => o.org !== own)) {
        if (vendor.org !== "Kestrelink Radio") expect(regret.text).not.toContain(vendor.org);
        expect(regret.text).not.toContain(formatMoney(vendor.unitPrice, "EUR"));
        expect(regret.text).not.toContain(formatMoney(vendor.unitPrice * 4000, "EUR"));
      }
      expect(regret.text).not.toMatch(/€/);
    }
    expect(to("bids@oxbow.example")[0].text).toContain("Your offer ranked 3 of 3.");
  });
});

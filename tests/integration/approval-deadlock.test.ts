// Approvals that cannot deadlock: the award value comes from the offer, a recommendation is
// accepted only if the people who exist can approve it, nobody strands one, and the buyer can
// always withdraw one. Through the route handlers, against a real in-memory database.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, count, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { ledgerEntries, recommendations, tenders, users } from "@/db/schema";
import { GET as bandsGet } from "@/app/api/v1/approval-bands/route";
import { GET as signOffGet, POST as decidePost } from "@/app/api/v1/tenders/[id]/approvals/route";
import { POST as declarePost } from "@/app/api/v1/tenders/[id]/declaration/route";
import { GET as memoGet } from "@/app/api/v1/tenders/[id]/memo/route";
import { POST as recommendationPost } from "@/app/api/v1/tenders/[id]/recommendation/route";
import { POST as withdrawPost } from "@/app/api/v1/tenders/[id]/recommendation/withdraw/route";
import { PATCH as userPatch } from "@/app/api/v1/users/[id]/route";
import { getDesk } from "@/lib/server/desk";
import { requireViewer } from "@/lib/server/session";
import { closeDb, freshDatabase, params, request, signInAs } from "../support/app";
import { createApprovalFixture, idsByEmail } from "../support/approval-fixtures";
import { createCommercialTender, honest } from "../support/comparison-fixtures";
import { pdfText } from "../unit/pdf/pdf-text";

let db: Db;
let ids: Awaited<ReturnType<typeof idsByEmail>>;
const as: Record<string, Headers> = {};
beforeAll(async () => {
  db = await freshDatabase();
  ids = await idsByEmail(db);
  for (const who of ["admin", "buyer", "engineer", "approver", "director"]) as[who] = await signInAs(`${who}@tarnwell.example`);
});
afterAll(closeDb);

const post = (handler: typeof recommendationPost, path: string, id: string, who: string, body: unknown) =>
  handler(request(path, { method: "POST", headers: as[who], body }), params({ id }));
const recommend = (id: string, body: unknown) => post(recommendationPost, `/api/v1/tenders/${id}/recommendation`, id, "buyer", body);
const withdraw = (id: string, who: string, reason: unknown) => post(withdrawPost, `/api/v1/tenders/${id}/recommendation/withdraw`, id, who, { reason });
const signOff = async (who: string, id: string) => (await signOffGet(request(`/api/v1/tenders/${id}/approvals`, { headers: as[who] }), params({ id }))).json();
const patchUser = (id: string, body: unknown) => userPatch(request(`/api/v1/users/${id}`, { method: "PATCH", headers: as.admin, body }), params({ id }));
const declare = (who: string, id: string) =>
  post(declarePost, `/api/v1/tenders/${id}/declaration`, id, who, { conflict: "none", conflictedOrgIds: [], statement: "No ties to any invited vendor." });
const ledgerCount = async () => (await db.select({ n: count() }).from(ledgerEntries))[0].n;
const tenderState = async (id: string) => (await db.select({ state: tenders.state }).from(tenders).where(eq(tenders.id, id)))[0].state;
const recsOf = (id: string) => db.select().from(recommendations).where(eq(recommendations.tenderId, id));

// Alder's 35.90 EUR a unit gives 143,600.00 EUR for the tender's 4,000 units.
const justification = "Best total score with plausible claims at both operating points.";
const commercial = () => createCommercialTender(db, { opened: true, offers: [honest("Alder", 35.9, 10, 24), honest("Birch", 41, 12, 24)] });

describe("the award value comes from the offer", () => {
  it("needs a reason for another value or for more units, and refuses an award nobody could approve; each refusal writes nothing", async () => {
    const fx = await commercial();
    const base = { offerId: fx.offerIds[0], quantity: 4000, justification };
    const before = await ledgerCount();

    const bare = await recommend(fx.tenderId, { ...base, value: 300_000 });
    expect(bare.status).toBe(400);
    expect((await bare.json()).fieldErrors.valueReason[0]).toBe(
      "The offer's prices give €143,600.00 for 4,000 units. Use that value, or state why the award value differs.",
    );

    // The case seen in production: 100,000,000 units at a stated 1,000 EUR.
    const huge = { ...base, quantity: 100_000_000, value: 1000, valueReason: "A framework figure." };
    const noQuantityReason = await recommend(fx.tenderId, huge);
    expect(noQuantityReason.status).toBe(400);
    expect((await noQuantityReason.json()).fieldErrors.quantityReason[0]).toMatch(/The tender asks for 4,000 units/);
    const nobody = await recommend(fx.tenderId, { ...huge, quantityReason: "Every gauge the region will ever need." });
    expect(nobody.status).toBe(409);
    expect((await nobody.json()).error).toMatch(/^This award of €3,590,000,000.00 needs 2 approvals .* nobody can give one\. Nothing was submitted/);

    // 300,000 EUR needs two approvers with limits of at least 300,000 EUR: only Tomas Veld holds one.
    const one = await recommend(fx.tenderId, { ...base, value: 300_000, valueReason: "Installation and five years of support." });
    expect(one.status).toBe(409);
    expect((await one.json()).error).toMatch(
      /needs 2 approvals from different approvers with a limit of at least €300,000.00.*only 1 approver can give one \(Tomas Veld\)/,
    );

    expect(await recsOf(fx.tenderId)).toEqual([]);
    expect(await tenderState(fx.tenderId)).toBe("commercial");
    expect(await ledgerCount()).toBe(before);
  });

  it("keeps the computed value beside a stated one, on the Sign-off tab and in the memo", async () => {
    const fx = await commercial();
    const created = await recommend(fx.tenderId, {
      offerId: fx.offerIds[0],
      quantity: 4000,
      value: 150_000,
      valueReason: "Includes the site survey.",
      justification,
    });
    expect(created.status).toBe(201);
    expect(await created.json()).toMatchObject({
      value: 150_000,
      computedValue: 143_600,
      valueReason: "Includes the site survey.",
      quantityReason: null,
      approvalsNeeded: 1,
    });

    await declare("approver", fx.tenderId);
    const view = await signOff("approver", fx.tenderId);
    expect(view.recommendation.deviations).toEqual([
      "Stated value €150,000.00; the offer's prices give €143,600.00 for 4,000 units. Reason: Includes the site survey.",
    ]);
    expect(view.me).toMatchObject({ allowed: true, awardsIfApproved: true });

    const decided = await post(decidePost, `/api/v1/tenders/${fx.tenderId}/approvals`, fx.tenderId, "approver", { decision: "approve" });
    expect((await decided.json()).kind).toBe("awarded");
    const memo = await memoGet(request(`/api/v1/tenders/${fx.tenderId}/memo`, { headers: as.buyer }), params({ id: fx.tenderId }));
    const text = await pdfText(new Uint8Array(await memo.arrayBuffer()));
    expect(text).toContain("the offer's prices give €143,600.00 for 4,000 units");
  });

  it("lets the larger of the stated and computed values decide who may approve", async () => {
    // A row stated at 1,000 EUR whose offer prices make it 3,590,000,000 EUR: Helen's 250,000 EUR limit does not reach it.
    const f = await createApprovalFixture(db, { value: 1000 });
    await db.update(recommendations).set({ computedValue: 3_590_000_000 }).where(eq(recommendations.id, f.recommendationId));
    await declare("approver", f.tenderId);
    const refused = await post(decidePost, `/api/v1/tenders/${f.tenderId}/approvals`, f.tenderId, "approver", { decision: "approve" });
    expect(refused.status).toBe(403);
    expect((await refused.json()).error).toMatch(/does not cover this award of €3,590,000,000.00/);
    expect(await withdraw(f.tenderId, "buyer", "Stated value was a typing slip.")).toHaveProperty("status", 200);
  });
});

describe("withdrawing a recommendation", () => {
  it("is the buying team's act, needs a reason, goes into the ledger and sends the tender back", async () => {
    const fx = await commercial();
    expect((await recommend(fx.tenderId, { offerId: fx.offerIds[0], quantity: 4000, value: 143_600, justification })).status).toBe(201);
    expect((await withdraw(fx.tenderId, "engineer", "Not mine to withdraw.")).status).toBe(403);
    const short = await withdraw(fx.tenderId, "buyer", "No.");
    expect(short.status).toBe(400);
    expect((await short.json()).fieldErrors.reason[0]).toMatch(/Say why you withdraw it/);
    expect(await tenderState(fx.tenderId)).toBe("approval");

    const done = await withdraw(fx.tenderId, "buyer", "The vendor corrected its lead time; recommending again.");
    expect(done.status).toBe(200);
    expect(await done.json()).toMatchObject({ status: "withdrawn", withdrawReason: "The vendor corrected its lead time; recommending again." });
    expect(await tenderState(fx.tenderId)).toBe("commercial");
    const [entry] = await db
      .select()
      .from(ledgerEntries)
      .where(and(eq(ledgerEntries.tenderId, fx.tenderId), eq(ledgerEntries.action, "recommendation.withdrawn")));
    expect(entry.data).toMatchObject({ from: "approval", to: "commercial", reason: "The vendor corrected its lead time; recommending again." });
    // Both entries name the recommendation they concern.
    const [submitted] = await db
      .select()
      .from(ledgerEntries)
      .where(and(eq(ledgerEntries.tenderId, fx.tenderId), eq(ledgerEntries.action, "recommendation.submitted")));
    expect(submitted.data).toMatchObject({ recommendationId: entry.subjectId });
    expect(entry.data).toMatchObject({ recommendationId: entry.subjectId });
    const again = await withdraw(fx.tenderId, "buyer", "Withdrawing twice is not possible.");
    expect(again.status).toBe(409);
    expect((await again.json()).error).toBe("There is no recommendation awaiting approval on this tender to withdraw.");
  });
});

describe("nobody strands a pending recommendation", () => {
  it("refuses to deactivate, lower the limit of, or unrole an approver it needs, and allows it once withdrawn", async () => {
    // 250,000 EUR needs both Helen and Tomas.
    const f = await createApprovalFixture(db, { value: 250_000 });
    for (const change of [{ active: false }, { approvalLimit: 100_000 }, { roles: ["engineer"] }]) {
      const response = await patchUser(ids.director, change);
      expect(response.status).toBe(409);
      expect((await response.json()).error).toMatch(
        new RegExp(`recommendation on ${f.reference} awaiting approval without enough approvers.*Tomas Veld.*Nothing was changed\\. Ask the buyer to withdraw`),
      );
    }
    const [tomas] = await db.select().from(users).where(eq(users.id, ids.director));
    expect(tomas).toMatchObject({ active: true, approvalLimit: 2_000_000 });
    expect((await patchUser(ids.director, { approvalLimit: 3_000_000 })).status).toBe(200);

    expect((await withdraw(f.tenderId, "buyer", "Freeing the approvers for a limit review.")).status).toBe(200);
    expect((await patchUser(ids.director, { approvalLimit: 2_000_000 })).status).toBe(200);
  });
});

describe("stuck recommendations and bands that cannot be met", () => {
  it("shows a stuck recommendation on the Desk of buyers and admins, and on its Sign-off tab with the way out", async () => {
    // Recorded before the rule: 300,000 EUR needing two approvers with such limits, while only Tomas has one.
    const f = await createApprovalFixture(db, { value: 300_000 });
    const stuckOn = async (who: string) => {
      const section = (await getDesk(await requireViewer(as[who]))).find((s) => s.title === "Recommendations that cannot be approved");
      return section && { ids: section.tenders.map((t) => t.id), note: section.notes?.[f.tenderId] };
    };
    for (const who of ["buyer", "admin"]) {
      expect(await stuckOn(who)).toEqual({
        ids: [f.tenderId],
        note: expect.stringMatching(/^It still needs 2 approvals, and only 1 approver who has not yet approved can give one/),
      });
    }
    expect(await stuckOn("approver")).toBeUndefined();
    const view = await signOff("buyer", f.tenderId);
    expect(view).toMatchObject({ canWithdraw: true, stuck: expect.stringMatching(/still needs 2 approvals/) });

    expect((await withdraw(f.tenderId, "buyer", "Nobody can approve it as it stands.")).status).toBe(200);
    expect((await stuckOn("buyer"))!.ids).toEqual([]);
  });

  it("warns on the Approval limits page when a band cannot be met by today's approvers", async () => {
    const { warnings } = await (await bandsGet(request("/api/v1/approval-bands", { headers: as.admin }), undefined)).json();
    expect(warnings).toEqual([
      "Awards above €250,000.00 in the band [250,000, ∞) EUR cannot be approved today: the band needs 2 approvals from different approvers, and only 1 approver holds a limit above €250,000.00.",
    ]);
  });
});

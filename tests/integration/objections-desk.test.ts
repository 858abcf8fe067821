// A vendor's objection lodged during the standstill period waits on the Desk of the tender's buyer
// (and the admin's), with a link to the Notices tab, until it is answered or the standstill ends.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { ledgerEntries, tenders } from "@/db/schema";
import { GET as objectionsGet, POST as objectionsPost } from "@/app/api/v1/tenders/[id]/objections/route";
import { POST as answerPost } from "@/app/api/v1/objections/[id]/answer/route";
import { getDesk } from "@/lib/server/desk";
import { requireViewer } from "@/lib/server/session";
import { closeDb, freshDatabase, params, request, signInAs } from "../support/app";
import { createApprovalFixture, type ApprovalFixture } from "../support/approval-fixtures";
import { mailAbout } from "../support/mail";

let db: Db;
const TEXT = "The lead time of the winning offer cannot be met; we ask you to review the award.";
const ANSWER = "The lead time was checked against the delivery plan and holds.";

beforeAll(async () => {
  db = await freshDatabase();
});
afterAll(closeDb);

/** A fixture tender of the demo buyer, awarded now, with an objection from Oxbow. */
async function objected(): Promise<{ f: ApprovalFixture; objectionId: string }> {
  const f = await createApprovalFixture(db, { value: 120_000 });
  await db.update(tenders).set({ state: "awarded", awardedAt: new Date() }).where(eq(tenders.id, f.tenderId));
  const lodged = await objectionsPost(
    request(`/api/v1/tenders/${f.tenderId}/objections`, { method: "POST", headers: await signInAs("bids@oxbow.example"), body: { body: TEXT } }),
    params({ id: f.tenderId }),
  );
  expect(lodged.status).toBe(201);
  return { f, objectionId: (await lodged.json()).id };
}
const objectionsOnDesk = async (email: string) => {
  const section = (await getDesk(await requireViewer(await signInAs(email)))).find((s) => s.title === "Objections to answer");
  return section ? { ids: section.tenders.map((t) => t.id), tab: section.tab, notes: section.notes ?? {} } : null;
};
const answer = async (email: string, objectionId: string, body: unknown) =>
  answerPost(request(`/api/v1/objections/${objectionId}/answer`, { method: "POST", headers: await signInAs(email), body }), params({ id: objectionId }));

describe("objections on the Desk", () => {
  it("wait on the buyer's and the admin's Desk, linked to the Notices tab, and on nobody else's", async () => {
    const { f } = await objected();
    for (const email of ["buyer@tarnwell.example", "admin@tarnwell.example"]) {
      const desk = await objectionsOnDesk(email);
      expect(desk?.ids, email).toContain(f.tenderId);
      expect(desk?.tab).toBe("notices");
      expect(desk?.notes[f.tenderId]).toBe("1 objection waits for a written answer before the standstill period ends.");
    }
    for (const email of ["engineer@tarnwell.example", "bids@oxbow.example"]) expect(await objectionsOnDesk(email), email).toBeNull();
  });

  it("leave the Desk once answered; the vendor reads the answer and the ledger records it", async () => {
    const { f, objectionId } = await objected();
    expect((await answer("bids@oxbow.example", objectionId, { answer: ANSWER })).status).toBe(403);
    expect((await answer("buyer@tarnwell.example", objectionId, { answer: "No." })).status).toBe(400);
    expect((await objectionsOnDesk("buyer@tarnwell.example"))?.ids).toContain(f.tenderId);

    expect((await answer("buyer@tarnwell.example", objectionId, { answer: ANSWER })).status).toBe(200);
    expect((await objectionsOnDesk("buyer@tarnwell.example"))?.ids).not.toContain(f.tenderId);
    expect((await objectionsOnDesk("admin@tarnwell.example"))?.ids).not.toContain(f.tenderId);
    const again = await answer("buyer@tarnwell.example", objectionId, { answer: ANSWER });
    expect(again.status).toBe(409);

    const seen = await (
      await objectionsGet(request(`/api/v1/tenders/${f.tenderId}/objections`, { headers: await signInAs("bids@oxbow.example") }), params({ id: f.tenderId }))
    ).json();
    expect(seen.objections[0]).toMatchObject({ body: TEXT, answer: ANSWER, mayAnswer: false });
    const [entry] = await db
      .select()
      .from(ledgerEntries)
      .where(and(eq(ledgerEntries.tenderId, f.tenderId), eq(ledgerEntries.action, "objection.answered")));
    expect(entry.actorLabel).toBe("Ines Calloway");
    const mail = await mailAbout("answer to your objection", 1);
    expect(mail[0].to).toEqual(["bids@oxbow.example"]);
    expect(mail[0].text).toContain(ANSWER);
  });

  it("leave the Desk when the standstill period ends unanswered", async () => {
    const { f } = await objected();
    await db
      .update(tenders)
      .set({ awardedAt: new Date(Date.now() - 11 * 86_400_000) })
      .where(eq(tenders.id, f.tenderId));
    expect((await objectionsOnDesk("buyer@tarnwell.example"))?.ids).not.toContain(f.tenderId);
  });
});

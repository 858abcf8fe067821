import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { claims, threadMessages, threads } from "@/db/schema";
import { POST as decidePost } from "@/app/api/v1/tenders/[id]/approvals/route";
import { POST as declarePost } from "@/app/api/v1/tenders/[id]/declaration/route";
import { POST as messagePost } from "@/app/api/v1/threads/[id]/messages/route";
import { clearCapturedMail, flushMail, listCapturedMail } from "@/lib/mail";
import { mailAbout } from "../support/mail";
import { MAIL_CAUTION } from "@/lib/mail/words";
import { closeDb, freshDatabase, params, request, signInAs, BASE } from "../support/app";
import { createApprovalFixture, idsByEmail, type ApprovalFixture } from "../support/approval-fixtures";

let db: Db;
beforeAll(async () => {
  db = await freshDatabase();
});
afterAll(closeDb);

async function declare(email: string, tenderId: string, conflictedOrgIds: string[] = []) {
  const body = { conflict: conflictedOrgIds.length ? "some" : "none", conflictedOrgIds, statement: "I have named every tie I have." };
  const response = await declarePost(
    request(`/api/v1/tenders/${tenderId}/declaration`, { method: "POST", headers: await signInAs(email), body }),
    params({ id: tenderId }),
  );
  expect(response.status).toBe(201);
}
const approve = async (email: string, f: ApprovalFixture) =>
  decidePost(
    request(`/api/v1/tenders/${f.tenderId}/approvals`, { method: "POST", headers: await signInAs(email), body: { decision: "approve", comment: "Fine." } }),
    params({ id: f.tenderId }),
  );

const to = <M extends { to: string[] }>(mail: M[], address: string) => mail.filter((m) => m.to.includes(address));

describe("a vendor's answer in a clarification thread", () => {
  it("reaches only the engineers who may read that vendor's thread", async () => {
    const f = await createApprovalFixture(db, { value: 120_000 });
    const ids = await idsByEmail(db);
    const kestrelink = f.orgIds[0];
    await declare("engineer@tarnwell.example", f.tenderId);
    await declare("director@tarnwell.example", f.tenderId, [kestrelink]);
    const [claim] = await db
      .select()
      .from(claims)
      .where(and(eq(claims.tenderId, f.tenderId), eq(claims.vendorOrgId, kestrelink)));
    const [thread] = await db
      .insert(threads)
      .values({ tenderId: f.tenderId, vendorOrgId: kestrelink, claimId: claim.id, subject: "Frame length", createdBy: ids.engineer })
      .returning();
    await db.insert(threadMessages).values({ threadId: thread.id, authorId: ids.engineer, authorLabel: "Ravi Okonjo", body: "Which frame length?" });

    clearCapturedMail();
    const vendor = await signInAs("sales@kestrelink.example");
    const posted = await messagePost(
      request(`/api/v1/threads/${thread.id}/messages`, { method: "POST", headers: vendor, body: { body: "1536 bits, as stated." } }),
      params({ id: thread.id }),
    );
    expect(posted.status).toBe(201);
    const [answer] = await mailAbout(f.reference, 1);
    expect(answer.to).toEqual(["engineer@tarnwell.example"]);
    expect(answer.text).toContain("1536 bits");
  });
});

describe("a recommendation awaiting approval", () => {
  it("is told in full only to approvers cleared to decide; an undeclared one gets a prompt that says nothing of it", async () => {
    const f = await createApprovalFixture(db, { value: 250_000 });
    await declare("approver@tarnwell.example", f.tenderId);
    clearCapturedMail();
    expect((await approve("approver@tarnwell.example", f)).status).toBe(200);
    const mail = await mailAbout(f.reference, 2);
    const [prompt] = to(mail, "director@tarnwell.example");
    expect(prompt.subject).toBe(`${f.reference}: a recommendation awaits approval`);
    expect(prompt.text).toMatch(/Declare any conflict of interest/);
    expect(prompt.text).not.toMatch(/Kestrelink|€|250,000|Fine\./);

    // Once the director has declared without conflict, the next request carries the content.
    const g = await createApprovalFixture(db, { value: 250_000 });
    await declare("approver@tarnwell.example", g.tenderId);
    await declare("director@tarnwell.example", g.tenderId);
    clearCapturedMail();
    expect((await approve("approver@tarnwell.example", g)).status).toBe(200);
    const [full] = to(await mailAbout(g.reference, 2), "director@tarnwell.example");
    expect(full.subject).toBe(`${g.reference}: award recommendation awaits your approval`);
    expect(full.text).toContain("€250,000.00");
  });

  it("does not reach an approver who declared a conflict", async () => {
    const f = await createApprovalFixture(db, { value: 250_000 });
    await declare("approver@tarnwell.example", f.tenderId);
    await declare("director@tarnwell.example", f.tenderId, [f.orgIds[2]]);
    clearCapturedMail();
    expect((await approve("approver@tarnwell.example", f)).status).toBe(200);
    const mail = await mailAbout(f.reference, 1);
    expect(to(mail, "director@tarnwell.example")).toEqual([]);
  });
});

describe("every e-mail sent above", () => {
  it("carries absolute links only, and the short caution", async () => {
    await flushMail();
    const all = listCapturedMail();
    expect(all.length).toBeGreaterThan(0);
    for (const mail of all) {
      expect(mail.text, mail.subject).not.toMatch(/(^|[\s(])\/[a-z]/m);
      expect(mail.text, mail.subject).toContain(`${BASE}/tenders/`);
      expect(mail.text, mail.subject).toContain(MAIL_CAUTION);
    }
  });
});

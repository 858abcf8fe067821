import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { declarations, ledgerEntries, marks, organisations, technicalSignoffs, tenders, threads, users } from "@/db/schema";
import { GET as queueGet } from "@/app/api/v1/claims/route";
import { GET as claimGet } from "@/app/api/v1/claims/[id]/route";
import { POST as markPost } from "@/app/api/v1/claims/[id]/marks/route";
import { GET as declarationGet, POST as declarePost } from "@/app/api/v1/tenders/[id]/declaration/route";
import { getDeclaration, listDeclarableVendors } from "@/lib/server/declarations";
import { requireViewer } from "@/lib/server/session";
import { POST as signPost } from "@/app/api/v1/tenders/[id]/signoff/route";
import { GET as threadsGet } from "@/app/api/v1/threads/route";
import { GET as messagesGet, POST as messagePost } from "@/app/api/v1/threads/[id]/messages/route";
import { startLocalServices, type LocalServices } from "@/lib/dev/services";
import { flushMail, listCapturedMail } from "@/lib/mail";
import { closeDb, freshDatabase, params, request, signInAll } from "../support/app";
import { reviewFixtures, VENDORS, type ReviewFixtures } from "../support/review-fixtures";

let db: Db;
let fx: ReviewFixtures;
let services: LocalServices;
const as: Record<string, Headers> = {};
const ENVELOPE = ["unitPrice", "leadTimeWeeks", "warrantyMonths", "priceBreaks"];

beforeAll(async () => {
  services = await startLocalServices({ dataDir: mkdtempSync(path.join(tmpdir(), "rc-review-")), smtpPort: 0, s3Port: 0 });
  db = await freshDatabase();
  fx = await reviewFixtures(db);
  Object.assign(as, await signInAll("engineer", "director", "buyer", "marram", "oxbow"));
});
afterAll(async () => {
  await flushMail();
  await services.stop();
  await closeDb();
});

const ledger = async (action: string) => (await db.select().from(ledgerEntries).where(eq(ledgerEntries.action, action))).length;
const queue = (who: string, query = "") => queueGet(request(`/api/v1/claims?tenderId=${fx.tenderId}${query}`, { headers: as[who] }), undefined);
const claim = (who: string, id: string) => claimGet(request(`/api/v1/claims/${id}`, { headers: as[who] }), params({ id }));
const mark = (who: string, id: string, body: unknown) =>
  markPost(request(`/api/v1/claims/${id}/marks`, { method: "POST", headers: as[who], body }), params({ id }));
const declare = (who: string, body: unknown) =>
  declarePost(request(`/api/v1/tenders/${fx.tenderId}/declaration`, { method: "POST", headers: as[who], body }), params({ id: fx.tenderId }));
const sign = (who: string, body: unknown) =>
  signPost(request(`/api/v1/tenders/${fx.tenderId}/signoff`, { method: "POST", headers: as[who], body }), params({ id: fx.tenderId }));
const mailTo = (address: string, subject: RegExp) => listCapturedMail().filter((m) => m.to.includes(address) && subject.test(m.subject));

describe("conflict-of-interest declaration", () => {
  it("gives an engineer who has not declared 403 on the tender's claims, and lets them mark nothing", async () => {
    expect((await claim("engineer", fx.evidenceClaimId)).status).toBe(403);
    const listed = await queue("engineer");
    expect(listed.status).toBe(403);
    expect((await listed.json()).error).toMatch(/Declare/);
    expect((await mark("engineer", fx.evidenceClaimId, { mark: "accepted" })).status).toBe(403);
  });

  it("refuses a declaration naming no vendor, or one not invited, and writes nothing", async () => {
    const [buyerOrg] = await db.select().from(organisations).where(eq(organisations.kind, "buyer"));
    expect((await declare("engineer", { conflict: "some", conflictedOrgIds: [], statement: "I hold shares somewhere." })).status).toBe(400);
    const stranger = await declare("engineer", { conflict: "some", conflictedOrgIds: [buyerOrg.id], statement: "I used to work there." });
    expect(stranger.status).toBe(400);
    expect(
      await db
        .select()
        .from(declarations)
        .where(eq(declarations.tenderId, fx.tenderId))
        .then((r) => r.filter((d) => d.statement.includes("work there"))),
    ).toHaveLength(0);
  });

  it("records a declared conflict once, in the ledger, and then hides that vendor's claims", async () => {
    const before = await ledger("declaration.made");
    const made = await declare("engineer", { conflict: "some", conflictedOrgIds: [fx.orgIds.kestrelink], statement: "My brother sells for Kestrelink." });
    expect(made.status).toBe(201);
    expect(await ledger("declaration.made")).toBe(before + 1);
    expect((await declare("engineer", { conflict: "none", conflictedOrgIds: [], statement: "Changed my mind about it." })).status).toBe(409);

    const rows: { vendorOrgId: string }[] = (await (await queue("engineer")).json()).claims;
    expect(rows.length).toBe(fx.claimIds.marram.length + fx.claimIds.oxbow.length + fx.claimIds.quillfield.length);
    expect(rows.some((r) => r.vendorOrgId === fx.orgIds.kestrelink)).toBe(false);
    expect((await claim("engineer", fx.claimIds.kestrelink[0])).status).toBe(404);
    expect((await claim("engineer", fx.claimIds.oxbow[0])).status).toBe(200);
  });

  it("never sends an engineer an envelope field, in the queue or on the claim page", async () => {
    const bodies = [await (await queue("engineer")).text(), await (await claim("engineer", fx.evidenceClaimId)).text()];
    for (const body of bodies) for (const field of ENVELOPE) expect(body).not.toContain(field);
    const detail = await (await claim("engineer", fx.evidenceClaimId)).json();
    expect(detail.offer.moduleName).toBeTruthy();
    expect(detail.claim.result.findings.length).toBeGreaterThan(0);
  });

  it("filters the queue by verdict and refuses an unknown verdict with 400", async () => {
    const rows: { verdict: string }[] = (await (await queue("engineer", "&verdict=needs-evidence")).json()).claims;
    expect(rows.length).toBeGreaterThan(0);
    expect(rows.every((r) => r.verdict === "needs-evidence")).toBe(true);
    expect((await queue("engineer", "&verdict=maybe")).status).toBe(400);
  });
});

describe("marks and clarification threads", () => {
  let threadId: string;

  it("requires a comment for every mark but accepted, and writes nothing without one", async () => {
    const bad = await mark("engineer", fx.claimIds.oxbow[0], { mark: "evidence-requested", comment: "" });
    expect(bad.status).toBe(400);
    expect((await bad.json()).fieldErrors.comment).toBeDefined();
    expect(await db.select().from(marks).where(eq(marks.claimId, fx.claimIds.oxbow[0]))).toHaveLength(0);
    const ok = await mark("engineer", fx.claimIds.oxbow[0], { mark: "accepted" });
    expect(ok.status).toBe(201);
    expect((await ok.json()).mark).toBe("accepted");
  });

  it("does not let a vendor mark, even its own claim", async () => {
    expect((await mark("marram", fx.claimIds.marram[0], { mark: "accepted" })).status).toBe(403);
  });

  it("opens a thread with a clarification request and e-mails the vendor", async () => {
    const before = await ledger("thread.opened");
    const response = await mark("engineer", fx.evidenceClaimId, {
      mark: "clarification-requested",
      subject: "Decoder iterations at storm fade",
      comment: "How many decoder iterations give this BLER?",
    });
    expect(response.status).toBe(201);
    threadId = (await response.json()).threadId;
    expect(threadId).toBeTruthy();
    expect(await ledger("thread.opened")).toBe(before + 1);
    await vi.waitFor(
      async () => {
        await flushMail();
        expect(mailTo("offers@marram.example", /question from the evaluators/)).toHaveLength(1);
      },
      { timeout: 15_000 },
    );
  });

  it("shows a vendor only its own organisation's threads", async () => {
    const marramThreads: { id: string }[] = (await (await threadsGet(request("/api/v1/threads", { headers: as.marram }), undefined)).json()).threads;
    expect(marramThreads.map((t) => t.id)).toContain(threadId);
    const oxbowThreads: { id: string }[] = (await (await threadsGet(request("/api/v1/threads", { headers: as.oxbow }), undefined)).json()).threads;
    expect(oxbowThreads).toHaveLength(0);
    expect((await messagesGet(request(`/api/v1/threads/${threadId}/messages`, { headers: as.oxbow }), params({ id: threadId }))).status).toBe(404);
    const post = (who: string) =>
      messagePost(
        request(`/api/v1/threads/${threadId}/messages`, { method: "POST", headers: as[who], body: { body: "Not ours to answer." } }),
        params({ id: threadId }),
      );
    expect((await post("oxbow")).status).toBe(404);
  });

  it("lets the vendor answer, records it, and e-mails the engineers", async () => {
    const before = await ledger("thread.message");
    const answer = await messagePost(
      request(`/api/v1/threads/${threadId}/messages`, { method: "POST", headers: as.marram, body: { body: "Twenty iterations, layered schedule." } }),
      params({ id: threadId }),
    );
    expect(answer.status).toBe(201);
    expect(await ledger("thread.message")).toBe(before + 1);
    const thread = await (await messagesGet(request(`/api/v1/threads/${threadId}/messages`, { headers: as.engineer }), params({ id: threadId }))).json();
    expect(thread.messages.map((m: { body: string }) => m.body)).toEqual([
      "How many decoder iterations give this BLER?",
      "Twenty iterations, layered schedule.",
    ]);
    await vi.waitFor(
      async () => {
        await flushMail();
        expect(mailTo("engineer@tarnwell.example", /vendor answer/)).toHaveLength(1);
        expect(mailTo("director@tarnwell.example", /vendor answer/)).toHaveLength(1);
      },
      { timeout: 15_000 },
    );
    const empty = await messagePost(
      request(`/api/v1/threads/${threadId}/messages`, { method: "POST", headers: as.marram, body: { body: " " } }),
      params({ id: threadId }),
    );
    expect(empty.status).toBe(400);
  });
});

describe("technical sign-off", () => {
  const tenderRow = async () => (await db.select().from(tenders).where(eq(tenders.id, fx.tenderId)))[0];
  const statement = { statement: "Every claim reviewed against the bounds and the lab runs." };

  it("is refused to an engineer with a declared conflict", async () => {
    expect((await sign("engineer", statement)).status).toBe(403);
  });

  it("is refused with 409 while a claim is unmarked, naming how many, and writes nothing", async () => {
    const [director] = await db.select().from(users).where(eq(users.email, "director@tarnwell.example"));
    const held = await db
      .select()
      .from(declarations)
      .where(and(eq(declarations.tenderId, fx.tenderId), eq(declarations.userId, director.id)));
    if (held.length === 0)
      expect((await declare("director", { conflict: "none", conflictedOrgIds: [], statement: "No ties to any invited vendor." })).status).toBe(201);
    const before = await ledger("tender.technical-signed");
    const refused = await sign("director", statement);
    expect(refused.status).toBe(409);
    expect((await refused.json()).error).toMatch(/\d+ claims have no final mark yet/);
    expect(await db.select().from(technicalSignoffs)).toHaveLength(0);
    expect((await tenderRow()).state).toBe("technical");
    expect(await ledger("tender.technical-signed")).toBe(before);
  });

  it("moves the tender to commercial evaluation with a ledger entry once every claim is marked", async () => {
    for (const vendor of VENDORS) {
      for (const id of fx.claimIds[vendor]) {
        const body = vendor === "kestrelink" ? { mark: "rejected-impossible", comment: "Beyond the converse at storm fade." } : { mark: "accepted" };
        expect((await mark("director", id, body)).status).toBe(201);
      }
    }
    const signed = await sign("director", statement);
    expect(signed.status).toBe(201);
    const tender = await tenderRow();
    expect(tender.state).toBe("commercial");
    expect(tender.technicalSignedAt).toBeInstanceOf(Date);
    expect(await ledger("tender.technical-signed")).toBe(1);
    expect((await sign("director", statement)).status).toBe(409);
    expect((await mark("director", fx.claimIds.oxbow[0], { mark: "accepted" })).status).toBe(409);
    await vi.waitFor(
      async () => {
        await flushMail();
        expect(mailTo("buyer@tarnwell.example", /technical evaluation signed/)).toHaveLength(1);
      },
      { timeout: 15_000 },
    );
  });

  it("keeps the threads readable by the vendor after the sign-off", async () => {
    const list: unknown[] = (await (await threadsGet(request(`/api/v1/threads?tenderId=${fx.tenderId}`, { headers: as.marram }), undefined)).json()).threads;
    expect(list.length).toBeGreaterThan(0);
    expect(await db.select().from(threads).where(eq(threads.vendorOrgId, fx.orgIds.oxbow))).toHaveLength(0);
  });
});

describe("declaration data answers only those it belongs to", () => {
  it("names the invited vendors only to someone who may declare on the tender", async () => {
    for (const who of ["marram", "buyer"]) {
      await expect(listDeclarableVendors(await requireViewer(as[who]), fx.tenderId)).rejects.toThrow(/Engineers and approvers declare/);
    }
    expect((await listDeclarableVendors(await requireViewer(as.director), fx.tenderId)).length).toBeGreaterThan(0);
  });

  it("answers a declaration only for a tender the viewer may read, and only to those who declare", async () => {
    const engineer = await requireViewer(as.engineer);
    await expect(getDeclaration(engineer, crypto.randomUUID())).rejects.toThrow(/No such tender/);
    await expect(getDeclaration(await requireViewer(as.marram), fx.tenderId)).rejects.toThrow(/Only engineers and approvers/);
    const get = (who: string, id: string) => declarationGet(request(`/api/v1/tenders/${id}/declaration`, { headers: as[who] }), params({ id }));
    expect((await get("engineer", crypto.randomUUID())).status).toBe(404);
    expect((await get("oxbow", fx.tenderId)).status).toBe(403);
    expect((await get("engineer", fx.tenderId)).status).toBe(200);
  });
});

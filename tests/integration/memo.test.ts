import { createHash } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { desc, eq } from "drizzle-orm";
import { PDFDocument } from "pdf-lib";
import type { Db } from "@/db/client";
import { ledgerEntries, memos, recommendations, tenders } from "@/db/schema";
import { GET as memoGet } from "@/app/api/v1/tenders/[id]/memo/route";
import { GET as previewGet } from "@/app/api/v1/tenders/[id]/memo/preview/route";
import { POST as checkPost } from "@/app/api/v1/memo-check/route";
import { POST as decidePost } from "@/app/api/v1/tenders/[id]/approvals/route";
import { POST as declarePost } from "@/app/api/v1/tenders/[id]/declaration/route";
import { headLine } from "@/lib/ledger/head";
import { flushMail, listCapturedMail } from "@/lib/mail";
import { approvalsGiven, renderMemoFor } from "@/lib/server/memos";
import { BASE, closeDb, freshDatabase, params, request, signInAs } from "../support/app";
import { createApprovalFixture, FIXTURE_OFFERS, type ApprovalFixture } from "../support/approval-fixtures";
import { pdfText } from "../unit/pdf/pdf-text";
import { runFullCheck } from "../support/ledger-checks";
import { allEntries, restoreEntries, rewriteFrom } from "../support/ledger-tamper";

let db: Db;
let f: ApprovalFixture;
let buyer: Headers;
let file: Uint8Array;
const sha = (bytes: Uint8Array) => createHash("sha256").update(bytes).digest("hex");

beforeAll(async () => {
  db = await freshDatabase();
  buyer = await signInAs("buyer@tarnwell.example");
  f = await createApprovalFixture(db, { value: 40_000 });
});
afterAll(closeDb);

const check = (init: { body?: unknown; form?: FormData; headers?: Headers }) =>
  checkPost(
    init.form
      ? new Request(`${BASE}/api/v1/memo-check`, { method: "POST", body: init.form, headers: init.headers })
      : request("/api/v1/memo-check", { method: "POST", body: init.body, headers: init.headers }),
    undefined,
  );
const formWith = (bytes: Uint8Array, name = "memo.pdf") => {
  const form = new FormData();
  form.set("file", new Blob([Buffer.from(bytes)], { type: "application/pdf" }), name);
  return form;
};

describe("the memo before the award", () => {
  it("previews as a PDF marked as a preview, for the buying team only", async () => {
    const response = await previewGet(request(`/api/v1/tenders/${f.tenderId}/memo/preview`, { headers: buyer }), params({ id: f.tenderId }));
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("application/pdf");
    const text = await pdfText(new Uint8Array(await response.arrayBuffer()));
    expect(text).toContain("PREVIEW");
    expect(text).toContain(f.title);
    const engineer = await signInAs("engineer@tarnwell.example");
    expect((await previewGet(request(`/api/v1/tenders/${f.tenderId}/memo/preview`, { headers: engineer }), params({ id: f.tenderId }))).status).toBe(403);
    expect((await memoGet(request(`/api/v1/tenders/${f.tenderId}/memo`, { headers: buyer }), params({ id: f.tenderId }))).status).toBe(404);
  });
});

describe("the issued memo", () => {
  beforeAll(async () => {
    const approver = await signInAs("approver@tarnwell.example");
    const body = { conflict: "none", conflictedOrgIds: [], statement: "No ties to any of the vendors." };
    await declarePost(request(`/api/v1/tenders/${f.tenderId}/declaration`, { method: "POST", headers: approver, body }), params({ id: f.tenderId }));
    const decided = await decidePost(
      request(`/api/v1/tenders/${f.tenderId}/approvals`, {
        method: "POST",
        headers: approver,
        body: { decision: "approve", comment: "Small award, one signature." },
      }),
      params({ id: f.tenderId }),
    );
    expect((await decided.json()).kind).toBe("awarded");
    const response = await memoGet(request(`/api/v1/tenders/${f.tenderId}/memo`, { headers: buyer }), params({ id: f.tenderId }));
    expect(response.status).toBe(200);
    expect(response.headers.get("content-disposition")).toContain(`${f.reference}-M1.pdf`);
    file = new Uint8Array(await response.arrayBuffer());
  });

  it("is the stored file whose fingerprint was recorded", async () => {
    const [memo] = await db.select().from(memos).where(eq(memos.tenderId, f.tenderId));
    expect(sha(file)).toBe(memo.sha256);
    expect(file.length).toBe(memo.size);
  });

  it("parses back with the tender title, each vendor's verdicts and the approver's name", async () => {
    await PDFDocument.load(file);
    const text = await pdfText(file);
    expect(text).toContain(`${f.reference}: ${f.title}`);
    expect(text).toContain("Tarnwell Water Authority");
    for (const o of FIXTURE_OFFERS) expect(text).toContain(`${o.org}: ${o.module}`);
    for (const verdict of ["Plausible", "Needs evidence", "Impossible"]) expect(text).toContain(verdict);
    expect(text).toMatch(/Approved by Helen Strand, \d+ \w+ \d{4}, \d\d:\d\d Europe\/London/);
    expect(text).toContain("Small award, one signature.");
    expect(text).toContain("they do not replace qualification testing");
    expect(text).toContain(`Ratecourt award memo ${f.reference}-M1`);
  });

  it("renders again to the same bytes from the same record", async () => {
    const [tender] = await db.select().from(tenders).where(eq(tenders.id, f.tenderId));
    const [rec] = await db.select().from(recommendations).where(eq(recommendations.id, f.recommendationId));
    const [memo] = await db.select().from(memos).where(eq(memos.tenderId, f.tenderId));
    const ledgerHead = { seq: memo.ledgerSeq!, hash: memo.ledgerHash! };
    const again = await renderMemoFor(db, tender, rec, {
      identifier: `${f.reference}-M1`,
      draft: false,
      issuedAt: tender.awardedAt!,
      approvals: await approvalsGiven(db, rec.id),
      ledgerHead,
    });
    expect(sha(again)).toBe(sha(file));
  });

  it("prints the ledger head it was issued at: the approval entry just before the award's", async () => {
    const [memo] = await db.select().from(memos).where(eq(memos.tenderId, f.tenderId));
    const entries = await db.select().from(ledgerEntries).where(eq(ledgerEntries.tenderId, f.tenderId)).orderBy(ledgerEntries.seq);
    const [approval, award] = entries.slice(-2);
    expect([approval.action, award.action]).toEqual(["approval.given", "tender.awarded"]);
    expect(memo).toMatchObject({ ledgerSeq: approval.seq, ledgerHash: approval.hash });
    expect(await pdfText(file)).toContain(headLine(approval));
  });

  it("is announced in notices that carry the ledger head they were sent at, the award entry included", async () => {
    const [award] = await db.select().from(ledgerEntries).where(eq(ledgerEntries.tenderId, f.tenderId)).orderBy(desc(ledgerEntries.seq)).limit(1);
    let notices = [] as ReturnType<typeof listCapturedMail>;
    for (let i = 0; i < 100 && notices.length === 0; i++) {
      await flushMail();
      notices = listCapturedMail().filter((m) => m.subject.startsWith(`Award notice: ${f.reference}`));
      if (notices.length === 0) await new Promise((r) => setTimeout(r, 100));
    }
    expect(notices).toHaveLength(1);
    const head = /Ledger head when issued: entry #(\d+), hash ([0-9a-f]{12})/.exec(notices[0].text);
    expect(Number(head?.[1])).toBeGreaterThanOrEqual(award.seq);
  });
});

describe("Memo check (public)", () => {
  it("confirms the exact file, signed out, naming the tender, the approver and the time", async () => {
    const response = await check({ form: formWith(file) });
    expect(response.status).toBe(200);
    const result = await response.json();
    expect(result).toMatchObject({ authentic: true, identifier: `${f.reference}-M1`, tender: { reference: f.reference, title: f.title }, sha256: sha(file) });
    expect(result.approvedBy.map((a: { name: string }) => a.name)).toEqual(["Helen Strand"]);
    expect(Date.parse(result.awardedAt)).not.toBeNaN();
    const [memo] = await db.select().from(memos).where(eq(memos.tenderId, f.tenderId));
    expect(result.ledgerHead).toMatchObject({ seq: memo.ledgerSeq, hash: memo.ledgerHash, inVerifiedChain: true });
    expect(result.ledgerHead.standing).toMatch(
      new RegExp(`^Entry #${memo.ledgerSeq} is in the ledger with the same hash, and the chain is verified through entry #\\d+\\.$`),
    );
  });

  it("says when the head the memo was issued at is no longer in the chain", async () => {
    const all = await allEntries(db);
    const [memo] = await db.select().from(memos).where(eq(memos.tenderId, f.tenderId));
    await rewriteFrom(db, memo.ledgerSeq!, { quietly: "changed" });
    const result = await (await check({ form: formWith(file) })).json();
    expect(result).toMatchObject({ authentic: true, ledgerHead: { seq: memo.ledgerSeq, inVerifiedChain: false } });
    expect(result.ledgerHead.standing).toBe(`Entry #${memo.ledgerSeq} no longer has the hash it had at issue: the ledger was rewritten.`);
    await restoreEntries(db, all);
    expect(await runFullCheck(await signInAs("admin@tarnwell.example"))).toMatchObject({ status: "intact" });
    expect((await (await check({ body: { sha256: sha(file) } })).json()).ledgerHead.inVerifiedChain).toBe(true);
  });

  it("fails a memo with one byte changed", async () => {
    const altered = file.slice();
    altered[Math.floor(altered.length / 2)] ^= 0x01;
    const result = await (await check({ form: formWith(altered) })).json();
    expect(result).toEqual({ authentic: false, sha256: sha(altered) });
  });

  it("confirms a pasted fingerprint, forgiving case and spaces", async () => {
    const pasted = sha(file)
      .toUpperCase()
      .replace(/(.{16})/g, "$1 ");
    const result = await (await check({ body: { sha256: pasted } })).json();
    expect(result.authentic).toBe(true);
    expect((await (await check({ body: { sha256: "0".repeat(64) } })).json()).authentic).toBe(false);
  });

  it("answers bad input with a clear 400", async () => {
    const cases: [Parameters<typeof check>[0], RegExp][] = [
      [{ body: { sha256: "z".repeat(64) } }, /only the characters 0-9 and a-f/],
      [{ body: { sha256: "abc123" } }, /exactly 64 characters/],
      [{ body: {} }, /Paste a SHA-256 fingerprint/],
      [{ form: formWith(new Uint8Array(0)) }, /empty/],
      [{ form: formWith(new Uint8Array(20 * 1024 * 1024 + 1)) }, /larger than 20 MB/],
      [{ form: new FormData() }, /form field "file"/],
    ];
    for (const [input, message] of cases) {
      const response = await check(input);
      expect(response.status).toBe(400);
      expect((await response.json()).error).toMatch(message);
    }
    const raw = await checkPost(request("/api/v1/memo-check", { method: "POST", rawBody: "{oops" }), undefined);
    expect(raw.status).toBe(400);
  });
});

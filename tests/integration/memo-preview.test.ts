import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { memoPreviews } from "@/db/schema";
import { GET as previewGet } from "@/app/api/v1/tenders/[id]/memo/preview/route";
import { POST as declarePost } from "@/app/api/v1/tenders/[id]/declaration/route";
import { memoPreviewRenders } from "@/lib/server/memos";
import { closeDb, freshDatabase, params, request, signInAs } from "../support/app";
import { createApprovalFixture, type ApprovalFixture } from "../support/approval-fixtures";
import { pdfText } from "../unit/pdf/pdf-text";

let db: Db;
let f: ApprovalFixture;
let buyer: Headers;

beforeAll(async () => {
  db = await freshDatabase();
  buyer = await signInAs("buyer@tarnwell.example");
  f = await createApprovalFixture(db, { value: 40_000 });
});
afterAll(closeDb);

const visit = async (headers = buyer) => {
  const response = await previewGet(request(`/api/v1/tenders/${f.tenderId}/memo/preview`, { headers }), params({ id: f.tenderId }));
  expect(response.status).toBe(200);
  return { bytes: new Uint8Array(await response.arrayBuffer()), renderedAt: response.headers.get("x-memo-preview-rendered-at") };
};

const declare = async (email: string, statement: string) => {
  const headers = await signInAs(email);
  const body = { conflict: "none", conflictedOrgIds: [], statement };
  const response = await declarePost(request(`/api/v1/tenders/${f.tenderId}/declaration`, { method: "POST", headers, body }), params({ id: f.tenderId }));
  expect(response.status).toBe(201);
  return headers;
};

describe("the memo preview is rendered once per version of what it prints", () => {
  let first: Awaited<ReturnType<typeof visit>>;

  it("renders on the first visit and keeps the result", async () => {
    const before = memoPreviewRenders();
    first = await visit();
    expect(memoPreviewRenders()).toBe(before + 1);
    const rows = await db.select().from(memoPreviews);
    expect(rows).toHaveLength(1);
    expect(Buffer.from(rows[0].pdf).equals(Buffer.from(first.bytes))).toBe(true);
  });

  it("does not render again on a second visit, nor for another reader of the same memo", async () => {
    const before = memoPreviewRenders();
    const again = await visit();
    expect(memoPreviewRenders()).toBe(before);
    expect(Buffer.from(again.bytes).equals(Buffer.from(first.bytes))).toBe(true);
    expect(again.renderedAt).toBe(first.renderedAt);
  });

  it("renders again once something the memo prints changes (a declaration), and the new one shows it", async () => {
    const before = memoPreviewRenders();
    const approver = await declare("approver@tarnwell.example", "No ties to any vendor of this tender.");
    const changed = await visit(approver);
    expect(memoPreviewRenders()).toBe(before + 1);
    expect(Buffer.from(changed.bytes).equals(Buffer.from(first.bytes))).toBe(false);
    expect(await pdfText(first.bytes)).not.toContain("Helen Strand");
    expect(await pdfText(changed.bytes)).toContain("Helen Strand");
    // Still one stored preview per recommendation: the new version replaced the old.
    const [row] = await db.select().from(memoPreviews);
    expect(await db.select().from(memoPreviews).where(eq(memoPreviews.recommendationId, row.recommendationId))).toHaveLength(1);
    await visit();
    expect(memoPreviewRenders()).toBe(before + 1);
  });

  it("renders once for visits that arrive together after a change", async () => {
    await declare("director@tarnwell.example", "No ties to any vendor; I also review the technical side.");
    const before = memoPreviewRenders();
    const all = await Promise.all(Array.from({ length: 5 }, () => visit()));
    expect(memoPreviewRenders()).toBe(before + 1);
    for (const v of all) expect(Buffer.from(v.bytes).equals(Buffer.from(all[0].bytes))).toBe(true);
  });
});

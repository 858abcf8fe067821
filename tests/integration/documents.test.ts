import { existsSync, mkdtempSync, readdirSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, count, eq, notInArray } from "drizzle-orm";
import { documents, ledgerEntries, offers, organisations, tenders } from "@/db/schema";
import type { Db } from "@/db/client";
import { startLocalServices, type LocalServices } from "@/lib/dev/services";
import { sha256Hex } from "@/lib/storage";
import { verifyLedger } from "@/lib/server/ledger";
import { POST as submitPost } from "@/app/api/v1/tenders/[id]/offers/route";
import { GET as offerGet } from "@/app/api/v1/offers/[id]/route";
import { POST as uploadPost } from "@/app/api/v1/offers/[id]/documents/route";
import { GET as downloadGet } from "@/app/api/v1/documents/[id]/route";
import { BASE, closeDb, freshDatabase, params, request, signInAs } from "../support/app";

let db: Db;
let folder: string;
let services: LocalServices;
let weirs = "";
let oxbowOfferId = "";
const orgIds: Record<string, string> = {};

const ascii = (text: string) => new TextEncoder().encode(text);
const PDF = ascii("%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n");

beforeAll(async () => {
  db = await freshDatabase();
  folder = mkdtempSync(path.join(tmpdir(), "ratecourt-documents-"));
  services = await startLocalServices({ dataDir: folder, smtpPort: 0, s3Port: 0 });
  for (const o of await db.select().from(organisations)) orgIds[o.name] = o.id;
  [{ id: weirs }] = await db.select({ id: tenders.id }).from(tenders).where(eq(tenders.reference, "RC-2027-003"));
  oxbowOfferId = (await submitOxbow("Oxbow OW-Weir")).id;
});

/** Oxbow's honest offer to the weirs tender (one point, p = 2e-3). */
async function submitOxbow(moduleName: string) {
  const body = {
    moduleName,
    partNumber: "OW-W1",
    code: { family: "LDPC", decision: "hard", n: 2048, k: 1536 },
    claims: [{ pointIndex: 0, metric: "bler", value: 1e-5 }],
    envelope: { unitPrice: 61, currency: "EUR", leadTimeWeeks: 9, warrantyMonths: 24, priceBreaks: [] },
  };
  const headers = await signInAs("bids@oxbow.example");
  return (await submitPost(request(`/api/v1/tenders/${weirs}/offers`, { method: "POST", headers, body }), params({ id: weirs }))).json();
}

afterAll(async () => {
  await closeDb();
  await services?.stop();
  rmSync(folder, { recursive: true, force: true });
});

function upload(headers: Headers, offerId: string, file: Blob | null, kind: string | null = "datasheet", extra: Record<string, string> = {}) {
  const form = new FormData();
  if (file) form.set("file", file);
  if (kind !== null) form.set("kind", kind);
  const h = new Headers(headers);
  for (const [k, v] of Object.entries(extra)) h.set(k, v);
  return uploadPost(new Request(`${BASE}/api/v1/offers/${offerId}/documents`, { method: "POST", headers: h, body: form }), params({ id: offerId }));
}
const download = (headers: Headers, id: string) => downloadGet(request(`/api/v1/documents/${id}`, { headers }), params({ id }));

async function counts() {
  const [d] = await db.select({ n: count() }).from(documents);
  const [l] = await db
    .select({ n: count() })
    .from(ledgerEntries)
    .where(notInArray(ledgerEntries.action, ["tender.closed", "offers.unsealed"]));
  const objects = path.join(folder, "objects");
  const stored = existsSync(objects) ? readdirSync(objects, { recursive: true, withFileTypes: true }).filter((e) => e.isFile()).length : 0;
  return { documents: d.n, ledger: l.n, stored };
}

async function refused(response: Response, status: number | number[], message: RegExp, before: Awaited<ReturnType<typeof counts>>) {
  expect([status].flat()).toContain(response.status);
  expect((await response.json()).error).toMatch(message);
  expect(await counts()).toEqual(before);
}

describe("uploading a PDF", () => {
  let documentId = "";

  it("stores it with its SHA-256 and a sanitised name, and records it in the ledger", async () => {
    const oxbow = await signInAs("bids@oxbow.example");
    const response = await upload(oxbow, oxbowOfferId, new File([PDF], "../OW Weir <datasheet>.pdf", { type: "application/pdf" }));
    expect(response.status).toBe(201);
    const doc = await response.json();
    documentId = doc.id;
    expect(doc).toMatchObject({ kind: "datasheet", size: PDF.length, sha256: sha256Hex(PDF), offerId: oxbowOfferId });
    expect(doc.fileName).not.toMatch(/[/<>]/);
    expect(doc).not.toHaveProperty("storageKey");
    const [entry] = await db
      .select()
      .from(ledgerEntries)
      .where(and(eq(ledgerEntries.action, "document.uploaded"), eq(ledgerEntries.subjectId, doc.id)));
    expect(entry.data).toMatchObject({ sha256: sha256Hex(PDF), kind: "datasheet", version: 1 });
  });

  it("gives the same bytes back to the vendor, as an attachment", async () => {
    const oxbow = await signInAs("bids@oxbow.example");
    const response = await download(oxbow, documentId);
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("application/pdf");
    expect(response.headers.get("content-disposition")).toMatch(/^attachment; filename="/);
    expect(new Uint8Array(await response.arrayBuffer())).toEqual(PDF);
  });

  it("keeps it sealed from the buyer while the tender is open, and from every other vendor", async () => {
    const buyer = await download(await signInAs("buyer@tarnwell.example"), documentId);
    expect(buyer.status).toBe(403);
    expect(new TextDecoder().decode(await buyer.arrayBuffer())).not.toContain("%PDF");
    const other = await download(await signInAs("offers@marram.example"), documentId);
    expect([403, 404]).toContain(other.status);
    expect(new TextDecoder().decode(await other.arrayBuffer())).not.toContain("%PDF");
  });

  it("carries over to the next version of the offer", async () => {
    const oxbow = await signInAs("bids@oxbow.example");
    const second = await submitOxbow("Oxbow OW-Weir rev B");
    expect(second.version).toBe(2);
    expect(second.documents.map((d: { id: string }) => d.id)).toEqual([documentId]);
    const detail = await (await offerGet(request(`/api/v1/offers/${second.id}`, { headers: oxbow }), params({ id: second.id }))).json();
    expect(detail.documents).toHaveLength(1);
    // The superseded version takes no more uploads.
    const before = await counts();
    await refused(await upload(oxbow, oxbowOfferId, new File([PDF], "late.pdf")), 409, /current version/, before);
    oxbowOfferId = second.id;
  });
});

describe("refused uploads write nothing", () => {
  it("a file of 21 MB", async () => {
    const oxbow = await signInAs("bids@oxbow.example");
    const before = await counts();
    expect(before.stored).toBeGreaterThan(0); // the datasheet above is in the object store
    const big = new Uint8Array(21 * 1024 * 1024);
    big.set(PDF);
    await refused(await upload(oxbow, oxbowOfferId, new File([big], "huge.pdf")), 413, /larger than 20 MB/, before);
  });

  it("a body declared larger than the limit, before it is read", async () => {
    const oxbow = await signInAs("bids@oxbow.example");
    const before = await counts();
    const response = await upload(oxbow, oxbowOfferId, new File([PDF], "small.pdf"), "datasheet", { "content-length": String(22 * 1024 * 1024) });
    await refused(response, 413, /20 MB/, before);
  });

  it("a renamed executable", async () => {
    const oxbow = await signInAs("bids@oxbow.example");
    const before = await counts();
    const program = new Uint8Array([0x4d, 0x5a, 0x90, 0x00, ...ascii("This program cannot be run in DOS mode")]);
    await refused(await upload(oxbow, oxbowOfferId, new File([program], "datasheet.pdf", { type: "application/pdf" })), 415, /program .*not a PDF/, before);
    const elf = new Uint8Array([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1, 0]);
    await refused(await upload(oxbow, oxbowOfferId, new File([elf], "report.pdf")), 415, /not a PDF/, before);
  });

  it("a file that is not a PDF, an empty one, a missing file, an unknown kind", async () => {
    const oxbow = await signInAs("bids@oxbow.example");
    const before = await counts();
    await refused(await upload(oxbow, oxbowOfferId, new File([ascii("hello")], "notes.pdf")), 415, /Only PDF/, before);
    await refused(await upload(oxbow, oxbowOfferId, new File([], "empty.pdf")), 400, /empty/, before);
    await refused(await upload(oxbow, oxbowOfferId, null), 400, /field named "file"/, before);
    await refused(await upload(oxbow, oxbowOfferId, new File([PDF], "x.pdf"), "brochure"), 400, /datasheet/, before);
  });

  it("from another vendor, an engineer, or after the tender closed", async () => {
    const before = await counts();
    await refused(await upload(await signInAs("offers@marram.example"), oxbowOfferId, new File([PDF], "x.pdf")), [403, 404], /./, before);
    await refused(await upload(await signInAs("engineer@tarnwell.example"), oxbowOfferId, new File([PDF], "x.pdf")), 403, /vendor/, before);
    const [marramGauges] = await db.select().from(offers).where(eq(offers.vendorOrgId, orgIds["Marram Telemetry"]));
    await refused(await upload(await signInAs("offers@marram.example"), marramGauges.id, new File([PDF], "x.pdf")), 409, /closed/, before);
  });

  it("answers 401 when signed out and 404 for an unknown document", async () => {
    expect((await download(new Headers(), "nope")).status).toBe(401);
    expect((await download(await signInAs("buyer@tarnwell.example"), "nope")).status).toBe(404);
  });
});

describe("upload names and shapes", () => {
  let oxbow: Headers;
  beforeAll(async () => {
    oxbow = await signInAs("bids@oxbow.example");
  });

  it("always keeps a .pdf download name, whatever the file was called", async () => {
    for (const [given, kept] of [
      ["setup.exe", "setup.pdf"],
      ["x.pdf.exe", "x.pdf"],
      ["Report.PDF", "Report.pdf"],
      ["noextension", "noextension.pdf"],
    ]) {
      const response = await upload(oxbow, oxbowOfferId, new File([PDF], given));
      expect(response.status).toBe(201);
      const doc = await response.json();
      expect(doc.fileName).toBe(kept);
      expect((await download(oxbow, doc.id)).headers.get("content-disposition")).toContain(`filename="${kept}"`);
    }
  });

  it("refuses a second file in one upload instead of dropping it", async () => {
    const before = await counts();
    const form = new FormData();
    form.set("kind", "datasheet");
    form.append("file", new File([PDF], "one.pdf"));
    form.append("file", new File([PDF], "two.pdf"));
    const response = await uploadPost(
      new Request(`${BASE}/api/v1/offers/${oxbowOfferId}/documents`, { method: "POST", headers: oxbow, body: form }),
      params({ id: oxbowOfferId }),
    );
    await refused(response, 400, /one file per upload/, before);
  });

  it("stops reading a body past the limit that came without a Content-Length", async () => {
    const before = await counts();
    const chunk = new Uint8Array(1024 * 1024);
    let sent = 0;
    // A chunked body that would never end: the server must stop reading, not wait for it.
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        sent += chunk.length;
        controller.enqueue(chunk);
      },
    });
    const headers = new Headers(oxbow);
    headers.set("content-type", "multipart/form-data; boundary=x");
    const response = await uploadPost(
      new Request(`${BASE}/api/v1/offers/${oxbowOfferId}/documents`, { method: "POST", headers, body, duplex: "half" } as RequestInit),
      params({ id: oxbowOfferId }),
    );
    await refused(response, 413, /20 MB/, before);
    expect(sent).toBeLessThan(25 * 1024 * 1024);
  });
});

describe("the ledger", () => {
  it("still verifies", async () => {
    expect(await verifyLedger(db)).toMatchObject({ ok: true });
  });
});

import { randomBytes, createHash } from "node:crypto";
import { existsSync, mkdtempSync, rmSync } from "node:fs";
import { createServer, type AddressInfo, type Server } from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { objectStoreCredentialsFile, startLocalServices } from "@/lib/dev/services";
import { listCapturedMail, sendMail } from "@/lib/mail";
import { localEndpoints, recordLocalEndpoints } from "@/lib/runtime/local-endpoints";
import {
  checkPdfUpload,
  deleteObject,
  getObject,
  isObjectNotFound,
  MAX_UPLOAD_BYTES,
  ObjectNotFoundError,
  putObject,
  sanitizeFileName,
  sha256Hex,
  sniffPdf,
} from "@/lib/storage";
import { startFakeS3, type FakeS3 } from "@/lib/storage/fake-s3";
import { setEnv } from "../support/env";

const ascii = (text: string) => new TextEncoder().encode(text);
const MINIMAL_PDF = ascii("%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n");

let folder: string;
let fake: FakeS3;
const credentials = { accessKeyId: "RCTESTKEY", secretAccessKey: "test-secret-for-this-file" };
const useFake = () => recordLocalEndpoints({ objectStore: { endpoint: fake.endpoint, bucket: fake.bucket, ...credentials } });

beforeAll(async () => {
  folder = mkdtempSync(path.join(tmpdir(), "ratecourt-storage-"));
  fake = await startFakeS3({ port: 0, directory: path.join(folder, "objects"), credentials });
  useFake();
});

afterAll(async () => {
  await fake.stop();
  rmSync(folder, { recursive: true, force: true });
});

describe("object storage against the fake S3 server", () => {
  it("returns exactly the bytes that were stored", async () => {
    const bytes = new Uint8Array(randomBytes(300_000));
    bytes.set([0, 0, 0, 255], 0);
    const stored = await putObject("offers/o-1/datasheet.pdf", bytes, "application/pdf");
    const read = await getObject("offers/o-1/datasheet.pdf");
    expect(read).toEqual(bytes);
    expect(sha256Hex(read)).toBe(createHash("sha256").update(bytes).digest("hex"));
    expect(stored).toEqual({ key: "offers/o-1/datasheet.pdf", size: 300_000, sha256: sha256Hex(bytes) });
  });

  it("overwrites a key and deletes it", async () => {
    await putObject("memos/m-1.pdf", ascii("first"), "application/pdf");
    await putObject("memos/m-1.pdf", ascii("second"), "application/pdf");
    expect(new TextDecoder().decode(await getObject("memos/m-1.pdf"))).toBe("second");
    await deleteObject("memos/m-1.pdf");
    await expect(getObject("memos/m-1.pdf")).rejects.toBeInstanceOf(ObjectNotFoundError);
  });

  it("gives a typed not-found error for a missing key", async () => {
    const error = await getObject("offers/none/missing.pdf").catch((caught: unknown) => caught);
    expect(error).toBeInstanceOf(ObjectNotFoundError);
    expect(isObjectNotFound(error)).toBe(true);
    expect((error as ObjectNotFoundError).key).toBe("offers/none/missing.pdf");
    expect((error as ObjectNotFoundError).code).toBe("object_not_found");
  });

  it("creates a bucket that does not exist yet on first write", async () => {
    recordLocalEndpoints({ objectStore: { endpoint: fake.endpoint, bucket: "ratecourt-second", ...credentials } });
    try {
      await expect(getObject("a.txt")).rejects.toBeInstanceOf(ObjectNotFoundError);
      await putObject("a.txt", ascii("in the second bucket"), "text/plain");
      expect(new TextDecoder().decode(await getObject("a.txt"))).toBe("in the second bucket");
    } finally {
      useFake();
    }
    await expect(getObject("a.txt")).rejects.toBeInstanceOf(ObjectNotFoundError);
  });

  it("refuses keys that climb out of their folder", async () => {
    for (const key of ["../secrets", "/abs", "a//b", "a/./b", "", "a\nb"]) {
      await expect(putObject(key, ascii("x"), "text/plain")).rejects.toThrow(TypeError);
    }
  });
});

describe("sniffPdf and checkPdfUpload", () => {
  it("accepts a minimal PDF", () => {
    expect(sniffPdf(MINIMAL_PDF)).toBe(true);
    expect(checkPdfUpload(MINIMAL_PDF)).toEqual({ ok: true });
  });

  it("rejects executables renamed to .pdf, plain text and near misses", () => {
    const elf = new Uint8Array([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1, 0]);
    const mz = ascii("MZ\x90\x00 This program cannot be run in DOS mode");
    const macho = new Uint8Array([0xcf, 0xfa, 0xed, 0xfe, 7, 0, 0, 1]);
    const script = ascii("#!/bin/sh\necho hi\n");
    const zip = new Uint8Array([0x50, 0x4b, 0x03, 0x04, 20, 0]);
    for (const bytes of [elf, mz, macho, script, zip]) expect(sniffPdf(bytes)).toBe(false);
    expect(checkPdfUpload(elf)).toEqual({ ok: false, reason: "executable", kind: "elf" });
    expect(checkPdfUpload(mz)).toEqual({ ok: false, reason: "executable", kind: "pe" });
    expect(checkPdfUpload(macho)).toEqual({ ok: false, reason: "executable", kind: "mach-o" });
    expect(checkPdfUpload(script)).toEqual({ ok: false, reason: "executable", kind: "script" });
    expect(checkPdfUpload(zip)).toEqual({ ok: false, reason: "executable", kind: "zip" });

    expect(sniffPdf(ascii("Unit price: 12.50 EUR\n"))).toBe(false);
    expect(sniffPdf(ascii(" %PDF-1.7"))).toBe(false);
    expect(sniffPdf(ascii("%PDF"))).toBe(false);
    expect(sniffPdf(new Uint8Array())).toBe(false);
    expect(checkPdfUpload(ascii("hello"))).toEqual({ ok: false, reason: "not-pdf" });
    expect(checkPdfUpload(new Uint8Array())).toEqual({ ok: false, reason: "empty" });
  });

  it("rejects an upload over the size limit before looking at it", () => {
    const big = new Uint8Array(MAX_UPLOAD_BYTES + 1);
    big.set(ascii("%PDF-1.4"), 0);
    expect(MAX_UPLOAD_BYTES).toBe(20 * 1024 * 1024);
    expect(checkPdfUpload(big)).toEqual({ ok: false, reason: "too-large" });
  });
});

describe("sanitizeFileName", () => {
  it.each([
    ["../../etc/passwd", "passwd"],
    ["C:\\Users\\me\\offer.pdf", "offer.pdf"],
    ["test\u0000report\n.pdf", "testreport.pdf"],
    ["invoice\u202Efdp.exe", "invoicefdp.exe"],
    ["Prüfbericht Nr. 7.pdf", "Prüfbericht Nr. 7.pdf"],
    ["報告書.pdf", "報告書.pdf"],
    ["Pru\u0308fbericht.pdf", "Prüfbericht.pdf"],
    ["offer<script>.pdf", "offer_script_.pdf"],
    ["  .hidden.pdf  ", "hidden.pdf"],
    ["CON.pdf", "_CON.pdf"],
    ["", "file"],
    ["..", "file"],
    ["../", "file"],
    ["\u0001\u0002", "file"],
  ])("%j becomes %j", (input, expected) => {
    expect(sanitizeFileName(input)).toBe(expected);
  });

  it("limits the length and keeps the extension", () => {
    const name = sanitizeFileName(`${"ä".repeat(300)}.pdf`);
    expect(Array.from(name)).toHaveLength(120);
    expect(name.endsWith(".pdf")).toBe(true);
  });
});

async function occupyPort(): Promise<Server> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  return server;
}
const portOf = (server: Server) => (server.address() as AddressInfo).port;

describe("startLocalServices", () => {
  it("refuses a busy port for the fake S3 server instead of crashing", async () => {
    const busy = await occupyPort();
    try {
      await expect(startFakeS3({ port: portOf(busy), directory: path.join(folder, "busy"), credentials })).rejects.toMatchObject({
        code: "EADDRINUSE",
      });
    } finally {
      busy.close();
    }
  });

  it("starts both fakes once (on free ports when the preferred ones are busy), records them in process state, never in the environment", async () => {
    const environment = { ...process.env };
    const dataDir = path.join(folder, "data");
    const busySmtp = await occupyPort();
    const busyS3 = await occupyPort();
    const services = await startLocalServices({ dataDir, smtpPort: portOf(busySmtp), s3Port: portOf(busyS3) });
    try {
      const local = localEndpoints();
      expect(local.smtpUrl).toMatch(/^smtp:\/\/127\.0\.0\.1:\d+$/);
      expect(local.smtpUrl).not.toContain(`:${portOf(busySmtp)}`);
      expect(local.objectStore?.endpoint).not.toContain(`:${portOf(busyS3)}`);
      expect(local.objectStore?.endpoint).not.toBe(fake.endpoint);
      expect(local.mailCaptureFile).toBe(path.join(dataDir, "mailroom.json"));
      expect(await startLocalServices({ dataDir: "elsewhere" })).toBe(services);
      expect(services.started).toEqual({ smtp: true, s3: true });
      expect(process.env).toEqual(environment);

      await putObject("x/y.txt", ascii("through the started fake"), "text/plain");
      expect(new TextDecoder().decode(await getObject("x/y.txt"))).toBe("through the started fake");
      await sendMail({ to: "v@example.test", subject: "Through services", text: "" });
      expect(listCapturedMail().map((mail) => mail.subject)).toEqual(["Through services"]);
    } finally {
      await services.stop();
      busySmtp.close();
      busyS3.close();
    }
    expect(localEndpoints()).toEqual({});
    expect(process.env).toEqual(environment);
    useFake();
  });

  it("starts nothing for services the settings already name", async () => {
    const restore = setEnv({
      SMTP_URL: "smtp://127.0.0.1:1",
      S3_ENDPOINT: fake.endpoint,
      S3_ACCESS_KEY_ID: credentials.accessKeyId,
      S3_SECRET_ACCESS_KEY: credentials.secretAccessKey,
    });
    recordLocalEndpoints({ objectStore: undefined });
    const services = await startLocalServices({ dataDir: path.join(folder, "data2"), s3Port: 0 });
    try {
      expect(services.started).toEqual({ smtp: false, s3: false });
      expect(localEndpoints()).toEqual({});
      await putObject("settings/named.txt", ascii("through the named store"), "text/plain");
      expect(new TextDecoder().decode(await getObject("settings/named.txt"))).toBe("through the named store");
    } finally {
      await services.stop();
      restore();
      useFake();
    }
  });

  it("never starts in production without DEMO: there the settings name the services", async () => {
    const restore = setEnv({
      NODE_ENV: "production",
      DEMO: undefined,
      BETTER_AUTH_SECRET: "x".repeat(32),
      BETTER_AUTH_URL: "https://rc.example.org",
      LEDGER_KEY: "l".repeat(32),
      SMTP_URL: "smtp://127.0.0.1:1",
      MAIL_FROM: "rc@example.org",
      S3_ENDPOINT: "http://127.0.0.1:1",
      S3_BUCKET: "rc-bucket",
      S3_ACCESS_KEY_ID: "k",
      S3_SECRET_ACCESS_KEY: "s",
    });
    try {
      await expect(startLocalServices({ dataDir: path.join(folder, "prod") })).rejects.toThrow(/only in demo mode/);
      expect(existsSync(objectStoreCredentialsFile(path.join(folder, "prod")))).toBe(false);
    } finally {
      restore();
    }
  });
});

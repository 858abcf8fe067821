// The local object store answers only requests signed with its data folder's own key pair.
import { GetObjectCommand, ListObjectsV2Command, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { mkdtempSync, readFileSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { objectStoreCredentialsFile, startLocalServices, type LocalServices } from "@/lib/dev/services";
import { localEndpoints } from "@/lib/runtime/local-endpoints";
import { getObject, putObject } from "@/lib/storage";
import { objectStoreCredentials } from "@/lib/storage/fake-s3";

let dataDir: string;
let services: LocalServices;
const text = (bytes: Uint8Array) => new TextDecoder().decode(bytes);
const store = () => localEndpoints().objectStore!;

function clientWith(accessKeyId: string, secretAccessKey: string) {
  return new S3Client({
    endpoint: store().endpoint,
    region: "us-east-1",
    forcePathStyle: true,
    credentials: { accessKeyId, secretAccessKey },
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
}

const statusOf = (error: unknown) => (error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;

beforeAll(async () => {
  dataDir = mkdtempSync(path.join(tmpdir(), "rc-object-access-"));
  services = await startLocalServices({ dataDir, smtpPort: 0, s3Port: 0 });
  await putObject("memos/m-1.pdf", new TextEncoder().encode("%PDF- the memo"), "application/pdf");
});

afterAll(async () => {
  await services.stop();
  rmSync(dataDir, { recursive: true, force: true });
});

describe("the local object store's credentials", () => {
  it("are made once per data folder, random, and readable by the owner only", () => {
    const file = objectStoreCredentialsFile(dataDir);
    expect(statSync(file).mode & 0o777).toBe(0o600);
    const stored = JSON.parse(readFileSync(file, "utf8")) as { accessKeyId: string; secretAccessKey: string };
    expect(stored.accessKeyId).not.toBe("S3RVER");
    expect(stored.secretAccessKey.length).toBeGreaterThanOrEqual(32);
    expect(store()).toMatchObject(stored);
    // A restart finds the same pair; another folder gets its own.
    expect(objectStoreCredentials(file)).toEqual(stored);
    const other = mkdtempSync(path.join(tmpdir(), "rc-object-other-"));
    try {
      expect(objectStoreCredentials(objectStoreCredentialsFile(other)).accessKeyId).not.toBe(stored.accessKeyId);
    } finally {
      rmSync(other, { recursive: true, force: true });
    }
  });

  it("let the app write and read", async () => {
    expect(text(await getObject("memos/m-1.pdf"))).toBe("%PDF- the memo");
  });

  it("refuse unsigned requests: no listing, no reading, no overwriting", async () => {
    const { endpoint, bucket } = store();
    const list = await fetch(`${endpoint}/${bucket}`);
    expect(list.status).toBe(403);
    expect(await list.text()).toContain("AccessDenied");
    expect((await fetch(`${endpoint}/`)).status).toBe(403);
    expect((await fetch(`${endpoint}/${bucket}/memos/m-1.pdf`)).status).toBe(403);
    const put = await fetch(`${endpoint}/${bucket}/memos/m-1.pdf`, { method: "PUT", body: "%PDF- forged" });
    expect(put.status).toBe(403);
    expect(text(await getObject("memos/m-1.pdf"))).toBe("%PDF- the memo");
  });

  it("refuse the well-known default credentials and a wrong secret", async () => {
    const { bucket } = store();
    for (const client of [clientWith("S3RVER", "S3RVER"), clientWith(store().accessKeyId, "not-the-secret")]) {
      const attempts = [
        client.send(new ListObjectsV2Command({ Bucket: bucket })),
        client.send(new GetObjectCommand({ Bucket: bucket, Key: "memos/m-1.pdf" })),
        client.send(new PutObjectCommand({ Bucket: bucket, Key: "memos/m-1.pdf", Body: "%PDF- forged" })),
      ];
      for (const attempt of attempts) expect(statusOf(await attempt.catch((error: unknown) => error))).toBe(403);
    }
    expect(text(await getObject("memos/m-1.pdf"))).toBe("%PDF- the memo");
  });

  it("refuse a signed request whose path was changed after signing", async () => {
    const client = clientWith(store().accessKeyId, store().secretAccessKey);
    client.middlewareStack.add(
      (next) => async (args) => {
        const request = args.request as { path: string };
        request.path = request.path.replace("m-1.pdf", "m-2.pdf");
        return next(args);
      },
      { step: "finalizeRequest", priority: "low", name: "tamperAfterSigning" },
    );
    const error = await client.send(new PutObjectCommand({ Bucket: store().bucket, Key: "memos/m-1.pdf", Body: "x" })).catch((e: unknown) => e);
    expect(statusOf(error)).toBe(403);
  });
});

import { randomBytes } from "node:crypto";
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { createServer } from "node:net";
import S3rver from "s3rver";
import AWSAccount from "s3rver/lib/models/account.js";
import { DEFAULT_S3_BUCKET } from "./object-store";
import { signatureRefusal, type KeyPair } from "./signed-requests";

export type FakeS3 = {
  host: string;
  port: number;
  /** The address to store objects at; requests must be signed with `credentials`. */
  endpoint: string;
  bucket: string;
  credentials: KeyPair;
  stop(): Promise<void>;
};

// s3rver leaves a listen error unhandled (it would crash the process): try the port first.
function assertPortFree(port: number, host: string): Promise<void> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once("error", reject);
    probe.listen(port, host, () => probe.close(() => resolve()));
  });
}

/**
 * The key pair of a data folder's object store: made once (random) and kept in `file`, readable
 * by its owner only, so that only this app (and whoever may read the data folder) can use it.
 */
export function objectStoreCredentials(file: string): KeyPair {
  try {
    const stored = JSON.parse(readFileSync(file, "utf8")) as Partial<KeyPair>;
    if (stored.accessKeyId && stored.secretAccessKey) return { accessKeyId: stored.accessKeyId, secretAccessKey: stored.secretAccessKey };
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== "ENOENT") throw error;
  }
  const made: KeyPair = {
    accessKeyId: `RC${randomBytes(9).toString("hex").toUpperCase()}`,
    secretAccessKey: randomBytes(30).toString("base64url"),
  };
  try {
    writeFileSync(file, JSON.stringify(made), { flag: "wx", mode: 0o600 });
    return made;
  } catch (error) {
    // Another start made it first: use that one.
    if ((error as NodeJS.ErrnoException).code === "EEXIST") return objectStoreCredentials(file);
    throw error;
  }
}

const refusalXml = (message: string) => `<?xml version="1.0" encoding="UTF-8"?>\n<Error><Code>AccessDenied</Code><Message>${message}</Message></Error>`;

/**
 * A local S3-compatible server keeping objects as files under `directory`, with the bucket already
 * created. It answers only requests signed with `credentials` (s3rver's well-known default key is
 * revoked). Port 0 picks a free port.
 */
export async function startFakeS3(options: { port: number; directory: string; credentials: KeyPair; host?: string; bucket?: string }): Promise<FakeS3> {
  const host = options.host ?? "127.0.0.1";
  const bucket = options.bucket ?? DEFAULT_S3_BUCKET;
  const { credentials } = options;
  mkdirSync(options.directory, { recursive: true });
  if (options.port !== 0) await assertPortFree(options.port, host);
  // s3rver keeps its keys in one registry per process and would take its default key from anyone.
  AWSAccount.DUMMY_ACCOUNT.revokeAccessKey("S3RVER");
  AWSAccount.DUMMY_ACCOUNT.createKeyPair(credentials.accessKeyId, credentials.secretAccessKey);
  const server = new S3rver({
    address: host,
    port: options.port,
    silent: true,
    directory: options.directory,
    // Requests address the bucket in the path; never guess it from a Host header.
    vhostBuckets: false,
    configureBuckets: [{ name: bucket }],
  });
  // First of all middleware: s3rver serves unsigned requests and never checks a version 4 signature.
  server.middleware.unshift(async (ctx, next) => {
    const refusal = await signatureRefusal({ method: ctx.method, url: ctx.req.url ?? "/", header: (name) => ctx.req.headers[name]?.toString() }, credentials);
    if (refusal === null) return next();
    ctx.status = 403;
    ctx.type = "application/xml";
    ctx.body = refusalXml(refusal);
  });
  const address = await server.run();
  return {
    host,
    port: address.port,
    endpoint: `http://${host}:${address.port}`,
    bucket,
    credentials,
    stop: () => server.close(),
  };
}

import {
  CreateBucketCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  PutObjectCommand,
  S3Client,
} from "@aws-sdk/client-s3";
import { sha256Hex } from "./files";

/** Where the local fake listens unless that port is taken (see lib/dev/services.ts). */
export const DEFAULT_S3_PORT = 4569;
export const DEFAULT_S3_BUCKET = "ratecourt";
export const FAKE_S3_CREDENTIAL = "S3RVER";

export type StorageConfig = {
  endpoint: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
};

/** Read at each call: startLocalServices sets S3_ENDPOINT after this module may have loaded. */
export function getStorageConfig(): StorageConfig {
  return {
    endpoint: process.env.S3_ENDPOINT || `http://127.0.0.1:${DEFAULT_S3_PORT}`,
    bucket: process.env.S3_BUCKET || DEFAULT_S3_BUCKET,
    accessKeyId: process.env.S3_ACCESS_KEY_ID || FAKE_S3_CREDENTIAL,
    secretAccessKey: process.env.S3_SECRET_ACCESS_KEY || FAKE_S3_CREDENTIAL,
  };
}

/** Thrown by getObject for a key that does not exist; route handlers answer 404. */
export class ObjectNotFoundError extends Error {
  override readonly name = "ObjectNotFoundError";
  readonly code = "object_not_found";
  constructor(readonly key: string) {
    super(`No stored object under key "${key}"`);
  }
}

/** By name, not instanceof: Next.js may load two copies of this module. */
export function isObjectNotFound(error: unknown): error is ObjectNotFoundError {
  return error instanceof Error && error.name === "ObjectNotFoundError";
}

// One client per configuration, kept across module copies and dev reloads.
const STATE_KEY = Symbol.for("ratecourt.storage.s3");
type StorageState = { clients: Map<string, S3Client>; buckets: Map<string, Promise<void>> };

function state(): StorageState {
  const holder = globalThis as typeof globalThis & { [STATE_KEY]?: StorageState };
  holder[STATE_KEY] ??= { clients: new Map(), buckets: new Map() };
  return holder[STATE_KEY];
}

function clientFor(config: StorageConfig): S3Client {
  const cacheKey = [config.endpoint, config.accessKeyId, config.secretAccessKey].join("\n");
  const { clients } = state();
  let client = clients.get(cacheKey);
  if (!client) {
    client = new S3Client({
      endpoint: config.endpoint,
      region: "us-east-1",
      forcePathStyle: true,
      credentials: { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey },
      // The default checksums are not understood by every S3-compatible service (the fake
      // included); the SHA-256 we keep per file is our integrity check.
      requestChecksumCalculation: "WHEN_REQUIRED",
      responseChecksumValidation: "WHEN_REQUIRED",
    });
    clients.set(cacheKey, client);
  }
  return client;
}

function statusOf(error: unknown): number | undefined {
  return (error as { $metadata?: { httpStatusCode?: number } } | null)?.$metadata?.httpStatusCode;
}

function assertKey(key: string): void {
  const bad =
    key.length === 0 ||
    key.length > 1024 ||
    key.startsWith("/") ||
    key.split("/").some((segment) => segment === "" || segment === "." || segment === "..") ||
    /[\p{Cc}]/u.test(key);
  if (bad) throw new TypeError(`Invalid storage key "${key}"`);
}

/** Creates the bucket when missing. Safe to call repeatedly and concurrently. */
export function ensureBucket(): Promise<void> {
  const config = getStorageConfig();
  const memoKey = `${config.endpoint}|${config.bucket}`;
  const { buckets } = state();
  let ready = buckets.get(memoKey);
  if (!ready) {
    ready = createBucketIfMissing(config).catch((error: unknown) => {
      buckets.delete(memoKey); // let the next call try again
      throw error;
    });
    buckets.set(memoKey, ready);
  }
  return ready;
}

async function createBucketIfMissing(config: StorageConfig): Promise<void> {
  const client = clientFor(config);
  try {
    await client.send(new HeadBucketCommand({ Bucket: config.bucket }));
    return;
  } catch (error) {
    if (statusOf(error) !== 404) throw error;
  }
  try {
    await client.send(new CreateBucketCommand({ Bucket: config.bucket }));
  } catch (error) {
    const name = error instanceof Error ? error.name : "";
    if (name !== "BucketAlreadyOwnedByYou" && name !== "BucketAlreadyExists") throw error;
  }
}

export async function putObject(
  key: string,
  bytes: Uint8Array,
  contentType: string,
): Promise<{ key: string; size: number; sha256: string }> {
  assertKey(key);
  await ensureBucket();
  const config = getStorageConfig();
  await clientFor(config).send(
    new PutObjectCommand({
      Bucket: config.bucket,
      Key: key,
      Body: bytes,
      ContentType: contentType,
      ContentLength: bytes.length,
    }),
  );
  return { key, size: bytes.length, sha256: sha256Hex(bytes) };
}

/** The stored bytes; throws ObjectNotFoundError when the key (or the bucket) does not exist. */
export async function getObject(key: string): Promise<Uint8Array> {
  assertKey(key);
  const config = getStorageConfig();
  try {
    const response = await clientFor(config).send(
      new GetObjectCommand({ Bucket: config.bucket, Key: key }),
    );
    if (!response.Body) throw new ObjectNotFoundError(key);
    return await response.Body.transformToByteArray();
  } catch (error) {
    const name = error instanceof Error ? error.name : "";
    if (name === "NoSuchKey" || name === "NoSuchBucket" || statusOf(error) === 404) {
      throw new ObjectNotFoundError(key);
    }
    throw error;
  }
}

/** Deleting a key that does not exist succeeds, as in S3. */
export async function deleteObject(key: string): Promise<void> {
  assertKey(key);
  const config = getStorageConfig();
  await clientFor(config).send(new DeleteObjectCommand({ Bucket: config.bucket, Key: key }));
}

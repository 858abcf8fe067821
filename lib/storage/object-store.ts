import { CreateBucketCommand, DeleteObjectCommand, GetObjectCommand, HeadBucketCommand, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { env } from "../env";
import { localEndpoints } from "../runtime/local-endpoints";
import { sha256Hex } from "./files";

export const DEFAULT_S3_BUCKET = "ratecourt";

export type StorageConfig = {
  endpoint: string;
  bucket: string;
  region: string;
  accessKeyId: string;
  secretAccessKey: string;
};

/** The operator's storage (S3_ENDPOINT and its keys), else the local object store while it runs; read at each call. */
export function getStorageConfig(): StorageConfig {
  const settings = env();
  if (settings.S3_ENDPOINT) {
    return {
      endpoint: settings.S3_ENDPOINT,
      bucket: settings.S3_BUCKET ?? DEFAULT_S3_BUCKET,
      region: settings.S3_REGION,
      accessKeyId: settings.S3_ACCESS_KEY_ID ?? "",
      secretAccessKey: settings.S3_SECRET_ACCESS_KEY ?? "",
    };
  }
  const local = localEndpoints().objectStore;
  if (!local) {
    throw new Error("No object storage: set S3_ENDPOINT with S3_BUCKET and its keys, or run in demo mode where the local store starts with the server.");
  }
  return { ...local, region: "us-east-1" };
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
  const cacheKey = [config.endpoint, config.region, config.accessKeyId, config.secretAccessKey].join("\n");
  const { clients } = state();
  let client = clients.get(cacheKey);
  if (!client) {
    client = new S3Client({
      endpoint: config.endpoint,
      region: config.region,
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

export async function putObject(key: string, bytes: Uint8Array, contentType: string): Promise<{ key: string; size: number; sha256: string }> {
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
    const response = await clientFor(config).send(new GetObjectCommand({ Bucket: config.bucket, Key: key }));
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

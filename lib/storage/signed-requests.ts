// The local object store's door: only requests signed (AWS Signature Version 4, in the
// Authorization header) with the data folder's own key pair get through. s3rver itself accepts
// unsigned requests and never checks a version 4 signature, so this checks it by signing the
// request again with the SDK's own signer and comparing.
import { createHash, createHmac, timingSafeEqual, type Hash, type Hmac } from "node:crypto";
import { SignatureV4 } from "@smithy/signature-v4";

export type KeyPair = { accessKeyId: string; secretAccessKey: string };

type SourceData = string | ArrayBuffer | ArrayBufferView;

const bytesOf = (data: SourceData): Buffer =>
  typeof data === "string"
    ? Buffer.from(data, "utf8")
    : ArrayBuffer.isView(data)
      ? Buffer.from(data.buffer, data.byteOffset, data.byteLength)
      : Buffer.from(data);

/** SHA-256 (or, with a secret, HMAC-SHA256) in the shape the signer expects. */
class Sha256 {
  private readonly hash: Hash | Hmac;
  constructor(secret?: SourceData) {
    this.hash = secret === undefined ? createHash("sha256") : createHmac("sha256", bytesOf(secret));
  }
  update(data: SourceData): void {
    this.hash.update(bytesOf(data));
  }
  async digest(): Promise<Uint8Array> {
    return new Uint8Array(this.hash.digest());
  }
}

const AUTHORIZATION =
  /^AWS4-HMAC-SHA256 Credential=([^/\s,]+)\/(\d{8})\/([^/\s,]+)\/s3\/aws4_request,\s*SignedHeaders=([a-z0-9;-]+),\s*Signature=([0-9a-f]{64})$/;
const MAX_CLOCK_SKEW_MS = 15 * 60 * 1000;

export type IncomingSigned = {
  method: string;
  /** The raw request target: path and query as sent. */
  url: string;
  header(name: string): string | undefined;
};

function signingDateOf(amzDate: string | undefined): Date | null {
  const m = /^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/.exec(amzDate ?? "");
  return m ? new Date(Date.UTC(+m[1], +m[2] - 1, +m[3], +m[4], +m[5], +m[6])) : null;
}

/** Why a request is refused, or null when it is signed with this key pair. */
export async function signatureRefusal(request: IncomingSigned, keys: KeyPair, now = Date.now()): Promise<string | null> {
  const match = AUTHORIZATION.exec(request.header("authorization") ?? "");
  if (!match) return "Requests to this store must be signed (AWS Signature Version 4 in the Authorization header).";
  const [, accessKeyId, , region, signedHeaders, signature] = match;
  if (accessKeyId !== keys.accessKeyId) return "Unknown access key.";
  const signingDate = signingDateOf(request.header("x-amz-date"));
  if (!signingDate || Math.abs(now - signingDate.getTime()) > MAX_CLOCK_SKEW_MS) return "The request's x-amz-date is missing or too far from now.";

  const names = signedHeaders.split(";");
  if (!names.includes("host")) return "The signature must cover the host header.";
  const headers: Record<string, string> = {};
  for (const name of names) headers[name] = request.header(name) ?? "";
  const [path, search = ""] = request.url.split("?", 2);
  const query: Record<string, string | string[]> = {};
  for (const [key, value] of new URLSearchParams(search)) {
    const seen = query[key];
    query[key] = seen === undefined ? value : [...(Array.isArray(seen) ? seen : [seen]), value];
  }
  const signer = new SignatureV4({ credentials: keys, region, service: "s3", sha256: Sha256, uriEscapePath: false, applyChecksum: false });
  const signed = await signer.sign(
    { method: request.method, protocol: "http:", hostname: "", path, query, headers },
    { signingDate, signingRegion: region, signableHeaders: new Set(names) },
  );
  const expected = /Signature=([0-9a-f]{64})/.exec(String(signed.headers.authorization ?? ""))?.[1] ?? "";
  const same = expected.length === signature.length && timingSafeEqual(Buffer.from(expected), Buffer.from(signature));
  return same ? null : "The request signature does not match.";
}

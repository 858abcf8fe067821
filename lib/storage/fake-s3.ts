import { mkdirSync } from "node:fs";
import { createServer } from "node:net";
import S3rver from "s3rver";
import { DEFAULT_S3_BUCKET } from "./object-store";

export type FakeS3 = {
  host: string;
  port: number;
  /** What S3_ENDPOINT should be for the app to store here. */
  endpoint: string;
  bucket: string;
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
 * A local S3-compatible server (path-style, credentials S3RVER/S3RVER) keeping objects as files
 * under `directory`, with the bucket already created. Port 0 picks a free port.
 */
export async function startFakeS3(options: {
  port: number;
  directory: string;
  host?: string;
  bucket?: string;
}): Promise<FakeS3> {
  const host = options.host ?? "127.0.0.1";
  const bucket = options.bucket ?? DEFAULT_S3_BUCKET;
  mkdirSync(options.directory, { recursive: true });
  if (options.port !== 0) await assertPortFree(options.port, host);
  const server = new S3rver({
    address: host,
    port: options.port,
    silent: true,
    directory: options.directory,
    // Requests address the bucket in the path; never guess it from a Host header.
    vhostBuckets: false,
    configureBuckets: [{ name: bucket }],
  });
  const address = await server.run();
  return {
    host,
    port: address.port,
    endpoint: `http://${host}:${address.port}`,
    bucket,
    stop: () => server.close(),
  };
}

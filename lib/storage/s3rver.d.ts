// s3rver ships no types; this covers the part lib/storage/fake-s3.ts uses.
declare module "s3rver" {
  import type { AddressInfo } from "node:net";
  import type { IncomingMessage } from "node:http";

  export type S3rverOptions = {
    address?: string;
    port?: number;
    silent?: boolean;
    directory?: string;
    resetOnClose?: boolean;
    allowMismatchedSignatures?: boolean;
    vhostBuckets?: boolean;
    configureBuckets?: { name: string; configs?: (string | Buffer)[] }[];
  };

  /** The part of a Koa context the request gate uses. */
  export type S3rverContext = { method: string; req: IncomingMessage; status: number; type: string; body: unknown };

  export default class S3rver {
    constructor(options?: S3rverOptions);
    /** Koa's middleware list, composed when the server starts. */
    middleware: ((ctx: S3rverContext, next: () => Promise<void>) => Promise<void>)[];
    run(): Promise<AddressInfo>;
    close(): Promise<void>;
  }
}

declare module "s3rver/lib/models/account.js" {
  class AWSAccount {
    createKeyPair(accessKeyId: string, secretAccessKey: string): void;
    revokeAccessKey(accessKeyId: string): void;
    static DUMMY_ACCOUNT: AWSAccount;
  }
  export default AWSAccount;
}

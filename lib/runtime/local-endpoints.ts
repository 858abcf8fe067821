// Where the local fakes (lib/dev/services.ts) listen, kept in process state instead of the
// environment: lib/mail and lib/storage combine it with the operator's settings from lib/env.ts.
// On globalThis because Next.js may load this module more than once in one process.

export type LocalObjectStore = {
  endpoint: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
};

export type LocalEndpoints = {
  /** The local SMTP fake's address, while it runs. */
  smtpUrl?: string;
  /** Where the local SMTP fake keeps captured mail; without it the Mailroom lives in memory. */
  mailCaptureFile?: string;
  /** The local object store and the credentials made for its data folder, while it runs. */
  objectStore?: LocalObjectStore;
};

const KEY = Symbol.for("ratecourt.local-endpoints");
type Holder = { [KEY]?: LocalEndpoints };

export function localEndpoints(): Readonly<LocalEndpoints> {
  return ((globalThis as Holder)[KEY] ??= {});
}

/** Records (or, with undefined, forgets) what the local fakes offer. */
export function recordLocalEndpoints(patch: Partial<LocalEndpoints>): void {
  const current = { ...localEndpoints(), ...patch };
  for (const name of Object.keys(current) as (keyof LocalEndpoints)[]) {
    if (current[name] === undefined) delete current[name];
  }
  (globalThis as Holder)[KEY] = current;
}

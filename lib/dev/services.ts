import path from "node:path";
import { env } from "../env";
import { ensurePrivateFolder } from "../runtime/data-lock";
import { recordLocalEndpoints } from "../runtime/local-endpoints";
import { demoPackages, demoPackagesRefusal, isMissingPackage } from "./demo-packages";

export const DEFAULT_SMTP_PORT = 2525;
export const DEFAULT_S3_PORT = 4569;

export type LocalServices = {
  /** Which fakes this call started; false where SMTP_URL or S3_ENDPOINT name a real service. */
  started: { smtp: boolean; s3: boolean };
  stop(): Promise<void>;
};

export type LocalServicesOptions = {
  /** The app's data folder: objects go to <dataDir>/objects, captured mail to <dataDir>/mailroom.json. */
  dataDir: string;
  /** Preferred ports (a busy one falls back to a free one); 0 takes any free port. */
  smtpPort?: number;
  s3Port?: number;
};

/** The object store's key pair lives beside the objects, never among them. */
export const objectStoreCredentialsFile = (dataDir: string) => path.join(dataDir, "object-store-credentials.json");

const GUARD_KEY = Symbol.for("ratecourt.dev.services");
type Guarded = typeof globalThis & { [GUARD_KEY]?: Promise<LocalServices> };

function isAddressInUse(error: unknown): boolean {
  return (error as { code?: unknown } | null)?.code === "EADDRINUSE";
}

async function onPreferredOrFreePort<T>(preferred: number, start: (port: number) => Promise<T>): Promise<T> {
  try {
    return await start(preferred);
  } catch (error) {
    if (preferred === 0 || !isAddressInUse(error)) throw error;
    return start(0);
  }
}

/**
 * The fakes are loaded only here, on the demo path: their packages are development dependencies,
 * absent from a production install, where this says so instead of a stack trace.
 */
async function loadFake<T>(load: () => Promise<T>): Promise<T> {
  try {
    return await load();
  } catch (error) {
    if (isMissingPackage(error)) throw new Error(demoPackagesRefusal({ needed: demoPackages(env()) }), { cause: error });
    throw error;
  }
}

async function start(options: LocalServicesOptions): Promise<LocalServices> {
  const stops: (() => Promise<void>)[] = [];
  const started = { smtp: false, s3: false };
  const stopAll = async () => {
    await Promise.allSettled(stops.map((stopOne) => stopOne()));
    if (started.smtp) recordLocalEndpoints({ smtpUrl: undefined, mailCaptureFile: undefined });
    if (started.s3) recordLocalEndpoints({ objectStore: undefined });
  };
  const settings = env();
  try {
    if (!settings.SMTP_URL) {
      const { startFakeSmtp } = await loadFake(() => import("../mail/fake-smtp"));
      const smtp = await onPreferredOrFreePort(options.smtpPort ?? DEFAULT_SMTP_PORT, (port) => startFakeSmtp({ port, host: "127.0.0.1" }));
      stops.push(smtp.stop);
      started.smtp = true;
      recordLocalEndpoints({ smtpUrl: smtp.url, mailCaptureFile: path.join(options.dataDir, "mailroom.json") });
    }
    if (!settings.S3_ENDPOINT) {
      const { objectStoreCredentials, startFakeS3 } = await loadFake(() => import("../storage/fake-s3"));
      ensurePrivateFolder(options.dataDir);
      const credentials = objectStoreCredentials(objectStoreCredentialsFile(options.dataDir));
      const s3 = await onPreferredOrFreePort(options.s3Port ?? DEFAULT_S3_PORT, (port) =>
        startFakeS3({ port, directory: path.join(options.dataDir, "objects"), credentials }),
      );
      stops.push(s3.stop);
      started.s3 = true;
      recordLocalEndpoints({ objectStore: { endpoint: s3.endpoint, bucket: s3.bucket, ...credentials } });
    }
    const stop = async () => {
      await stopAll();
      delete (globalThis as Guarded)[GUARD_KEY];
    };
    return { started, stop };
  } catch (error) {
    await stopAll();
    throw error;
  }
}

/**
 * Starts the local SMTP and S3 fakes, except where SMTP_URL / S3_ENDPOINT name hosted services,
 * and records their addresses for lib/mail and lib/storage (the environment is left alone).
 * Demo mode only: a production start has its own services. Once per process: later calls get
 * the same services until stop().
 */
export function startLocalServices(options: LocalServicesOptions): Promise<LocalServices> {
  if (!env().demoMode) {
    return Promise.reject(new Error("The local mail and storage fakes run only in demo mode (development, tests, or DEMO=1)."));
  }
  const holder = globalThis as Guarded;
  holder[GUARD_KEY] ??= start(options).catch((error: unknown) => {
    delete holder[GUARD_KEY];
    throw error;
  });
  return holder[GUARD_KEY];
}

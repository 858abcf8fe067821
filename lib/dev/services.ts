import path from "node:path";
import { MAIL_CAPTURE_FILE_ENV } from "../mail/captured-mail";
import { startFakeSmtp } from "../mail/fake-smtp";
import { startFakeS3 } from "../storage/fake-s3";
import { DEFAULT_S3_PORT } from "../storage/object-store";

export const DEFAULT_SMTP_PORT = 2525;

export type LocalServices = {
  smtpUrl: string;
  s3Endpoint: string;
  /** Which fakes this call started; false where SMTP_URL or S3_ENDPOINT named a real service. */
  started: { smtp: boolean; s3: boolean };
  stop(): Promise<void>;
};

export type LocalServicesOptions = {
  /** The app's data folder; objects go to <dataDir>/objects, captured mail to <dataDir>/mailroom.json. */
  dataDir: string;
  /** Preferred ports (a busy one falls back to a free one); 0 takes any free port. */
  smtpPort?: number;
  s3Port?: number;
};

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

async function start(options: LocalServicesOptions): Promise<LocalServices> {
  const stops: (() => Promise<void>)[] = [];
  const restoreEnv: Record<string, string | undefined> = {};
  const setEnv = (name: string, value: string) => {
    restoreEnv[name] = process.env[name];
    process.env[name] = value;
  };
  const started = { smtp: false, s3: false };
  const stopAll = async () => {
    await Promise.allSettled(stops.map((stopOne) => stopOne()));
    for (const [name, value] of Object.entries(restoreEnv)) {
      if (value === undefined) delete process.env[name];
      else process.env[name] = value;
    }
  };
  try {
    let smtpUrl = process.env.SMTP_URL;
    if (!smtpUrl) {
      const smtp = await onPreferredOrFreePort(options.smtpPort ?? DEFAULT_SMTP_PORT, (port) =>
        startFakeSmtp({ port, host: "127.0.0.1" }),
      );
      stops.push(smtp.stop);
      started.smtp = true;
      smtpUrl = smtp.url;
      setEnv("SMTP_URL", smtpUrl);
      // The Next server may run in a child process: it inherits this and reads the same list.
      if (!process.env[MAIL_CAPTURE_FILE_ENV]) {
        setEnv(MAIL_CAPTURE_FILE_ENV, path.join(options.dataDir, "mailroom.json"));
      }
    }
    let s3Endpoint = process.env.S3_ENDPOINT;
    if (!s3Endpoint) {
      const s3 = await onPreferredOrFreePort(options.s3Port ?? DEFAULT_S3_PORT, (port) =>
        startFakeS3({ port, directory: path.join(options.dataDir, "objects") }),
      );
      stops.push(s3.stop);
      started.s3 = true;
      s3Endpoint = s3.endpoint;
      setEnv("S3_ENDPOINT", s3Endpoint);
    }
    const stop = async () => {
      await stopAll();
      delete (globalThis as Guarded)[GUARD_KEY];
    };
    return { smtpUrl, s3Endpoint, started, stop };
  } catch (error) {
    await stopAll();
    throw error;
  }
}

/**
 * Starts the local SMTP and S3 fakes unless SMTP_URL / S3_ENDPOINT already name hosted
 * services, and points those variables at the fakes. Once per process: later calls get the
 * same services until stop().
 */
export function startLocalServices(options: LocalServicesOptions): Promise<LocalServices> {
  const holder = globalThis as Guarded;
  holder[GUARD_KEY] ??= start(options).catch((error: unknown) => {
    delete holder[GUARD_KEY];
    throw error;
  });
  return holder[GUARD_KEY];
}

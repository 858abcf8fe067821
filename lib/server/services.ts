import "server-only";
import { dataDir } from "@/db/client";
import { startLocalServices } from "@/lib/dev/services";

// Read once at load, before the local fakes write their own addresses into the environment.
const operatorSmtp = Boolean(process.env.SMTP_URL);

/**
 * Starts the local SMTP and S3 fakes inside this server process the first time mail or storage is
 * needed, unless the operator configured hosted services (SMTP_URL, S3_ENDPOINT).
 */
export async function ensureLocalServices(): Promise<void> {
  await startLocalServices({ dataDir: dataDir() });
}

/** The Mailroom exists only while the local SMTP fake catches the mail. */
export function mailroomEnabled(): boolean {
  return !operatorSmtp;
}

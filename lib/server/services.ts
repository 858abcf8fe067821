import "server-only";
import { dataDir } from "@/db/client";
import { startLocalServices } from "@/lib/dev/services";
import { env } from "@/lib/env";

/**
 * In demo mode, starts the local SMTP and S3 fakes inside this server process the first time mail
 * or storage is needed, except where SMTP_URL / S3_ENDPOINT name hosted services. In production
 * (not a demo) nothing starts: env() has already required those settings.
 */
export async function ensureLocalServices(): Promise<void> {
  if (!env().demoMode) return;
  await startLocalServices({ dataDir: dataDir() });
}

/** The Mailroom exists only in demo mode while the local SMTP fake catches the mail. */
export function mailroomEnabled(): boolean {
  return env().demoMode && !env().SMTP_URL;
}

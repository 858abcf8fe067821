import nodemailer, { type Transporter } from "nodemailer";
import { z } from "zod";
import { env } from "../env";
import { localEndpoints } from "../runtime/local-endpoints";

export const DEFAULT_MAIL_FROM = "Ratecourt <noreply@ratecourt.invalid>";

const singleLine = /^[^\r\n]*$/;

export const mailMessageSchema = z.object({
  to: z.union([z.email(), z.array(z.email()).min(1)]),
  subject: z.string().trim().min(1).max(300).regex(singleLine, "subject must be one line"),
  text: z.string(),
  html: z.string().optional(),
});

export type MailMessage = z.infer<typeof mailMessageSchema>;

export type RetryPolicy = {
  /** Sends tried in all, the first included. */
  attempts: number;
  /** Wait before the second attempt; doubles after each failure. */
  backoffMs: number;
};

export const DEFAULT_RETRY: RetryPolicy = { attempts: 4, backoffMs: 1000 };

/** The operator's mail server (SMTP_URL), else the local fake while it runs; read at each send. */
export function getMailConfig(): { smtpUrl: string | undefined; from: string } {
  const settings = env();
  return {
    smtpUrl: settings.SMTP_URL ?? localEndpoints().smtpUrl,
    from: settings.MAIL_FROM ?? DEFAULT_MAIL_FROM,
  };
}

// One transport per SMTP URL, kept across module copies and dev reloads.
const STATE_KEY = Symbol.for("ratecourt.mail.sender");
type SenderState = { transports: Map<string, Transporter>; pending: Set<Promise<void>> };

function state(): SenderState {
  const holder = globalThis as typeof globalThis & { [STATE_KEY]?: SenderState };
  holder[STATE_KEY] ??= { transports: new Map(), pending: new Set() };
  return holder[STATE_KEY];
}

function transportFor(smtpUrl: string): Transporter {
  const { transports } = state();
  let transport = transports.get(smtpUrl);
  if (!transport) {
    transport = nodemailer.createTransport({
      url: smtpUrl,
      // Defaults wait minutes; a notice is retried instead.
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      socketTimeout: 30_000,
    });
    transports.set(smtpUrl, transport);
  }
  return transport;
}

/** Sends now and throws on failure. Actions should use queueMail instead. */
export async function sendMail(message: MailMessage): Promise<{ messageId: string }> {
  const parsed = mailMessageSchema.parse(message);
  const { smtpUrl, from } = getMailConfig();
  if (!smtpUrl) throw new Error("No mail server to send through: set SMTP_URL, or run in demo mode where the local one starts with the server");
  const info = await transportFor(smtpUrl).sendMail({ from, ...parsed });
  return { messageId: String(info.messageId) };
}

function reasonOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

// A 5xx reply (unknown recipient, refused sender) will not change on a retry.
function isPermanent(error: unknown): boolean {
  const code = (error as { responseCode?: unknown } | null)?.responseCode;
  return typeof code === "number" && code >= 500 && code < 600;
}

const sleep = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms));

async function deliver(message: MailMessage, retry: RetryPolicy): Promise<void> {
  const label = `"${message.subject}"`;
  for (let attempt = 1; ; attempt += 1) {
    try {
      await sendMail(message);
      return;
    } catch (error) {
      if (attempt >= retry.attempts || isPermanent(error)) {
        console.warn(`[mail] gave up on ${label} after ${attempt} attempt(s): ${reasonOf(error)}`);
        return;
      }
      const delay = retry.backoffMs * 2 ** (attempt - 1);
      console.warn(`[mail] ${label} failed (attempt ${attempt}/${retry.attempts}), retrying in ${delay} ms: ${reasonOf(error)}`);
      await sleep(delay);
    }
  }
}

/**
 * Sends in the background and returns at once. A notice that cannot be sent is retried with
 * backoff and then dropped with a warning; nothing here ever throws into the caller.
 */
export function queueMail(message: MailMessage, retry: Partial<RetryPolicy> = {}): void {
  const checked = mailMessageSchema.safeParse(message);
  if (!checked.success) {
    console.warn(`[mail] not queued, invalid message: ${z.prettifyError(checked.error)}`);
    return;
  }
  const { pending } = state();
  const job = deliver(checked.data, { ...DEFAULT_RETRY, ...retry }).finally(() => pending.delete(job));
  pending.add(job);
}

/** Waits until every queued notice was sent or given up on, including ones queued meanwhile. */
export async function flushMail(): Promise<void> {
  const { pending } = state();
  while (pending.size > 0) await Promise.all(pending);
}

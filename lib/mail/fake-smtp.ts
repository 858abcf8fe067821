import { randomUUID } from "node:crypto";
import type { AddressInfo } from "node:net";
import { simpleParser, type AddressObject } from "mailparser";
import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from "smtp-server";
import { recordCapturedMail } from "./captured-mail";

export type FakeSmtp = {
  host: string;
  port: number;
  /** What SMTP_URL should be for the app to send here. */
  url: string;
  stop(): Promise<void>;
};

const MAX_MESSAGE_BYTES = 30 * 1024 * 1024;

function addressText(header: AddressObject | AddressObject[] | undefined): string {
  if (!header) return "";
  return (Array.isArray(header) ? header : [header]).map((entry) => entry.text).join(", ");
}

async function capture(stream: SMTPServerDataStream, session: SMTPServerSession): Promise<void> {
  const parsed = await simpleParser(stream);
  const envelopeFrom = session.envelope.mailFrom ? session.envelope.mailFrom.address : "";
  recordCapturedMail({
    id: randomUUID(),
    from: addressText(parsed.from) || envelopeFrom,
    // The envelope says who actually received it (Bcc included), which is what a mailroom shows.
    to: session.envelope.rcptTo.map((recipient) => recipient.address),
    subject: parsed.subject ?? "",
    text: parsed.text ?? "",
    html: typeof parsed.html === "string" ? parsed.html : null,
    receivedAt: new Date().toISOString(),
  });
}

/**
 * A local SMTP server that accepts everything (no auth, no TLS) and keeps what it receives
 * for the Mailroom. Port 0 picks a free port; a busy port rejects with EADDRINUSE.
 */
export function startFakeSmtp(options: { port: number; host?: string }): Promise<FakeSmtp> {
  const host = options.host ?? "127.0.0.1";
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    size: MAX_MESSAGE_BYTES,
    closeTimeout: 1000,
    onData(stream, session, callback) {
      capture(stream, session).then(
        () => callback(),
        (error: unknown) => {
          console.warn("[mail] fake SMTP could not parse a message:", error);
          stream.resume();
          callback(new Error("message could not be parsed"));
        },
      );
    },
  });

  return new Promise((resolve, reject) => {
    const onError = (error: Error) => reject(error);
    server.once("error", onError);
    server.listen(options.port, host, () => {
      server.off("error", onError);
      // A broken client connection must not crash the process that hosts the fake.
      server.on("error", (error) => console.warn("[mail] fake SMTP error:", error.message));
      const { port } = server.server.address() as AddressInfo;
      resolve({
        host,
        port,
        url: `smtp://${host}:${port}`,
        stop: () => new Promise<void>((done) => server.close(() => done())),
      });
    });
  });
}

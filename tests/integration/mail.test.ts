import { mkdtempSync, existsSync, rmSync } from "node:fs";
import { createServer, type AddressInfo } from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";
import { SMTPServer } from "smtp-server";
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { clearCapturedMail, DEFAULT_MAIL_FROM, flushMail, listCapturedMail, queueMail, sendMail } from "@/lib/mail";
import { MAX_CAPTURED_MAIL, recordCapturedMail, type CapturedMail } from "@/lib/mail/captured-mail";
import { startFakeSmtp, type FakeSmtp } from "@/lib/mail/fake-smtp";
import { recordLocalEndpoints } from "@/lib/runtime/local-endpoints";

let fake: FakeSmtp;

async function closedPortUrl(): Promise<string> {
  const probe = createServer();
  await new Promise<void>((resolve) => probe.listen(0, "127.0.0.1", resolve));
  const { port } = probe.address() as AddressInfo;
  await new Promise<void>((resolve) => probe.close(() => resolve()));
  return `smtp://127.0.0.1:${port}`;
}

function sample(id: string): CapturedMail {
  return { id, from: "a@example.test", to: ["b@example.test"], subject: id, text: "", html: null, receivedAt: new Date().toISOString() };
}

beforeAll(async () => {
  fake = await startFakeSmtp({ port: 0, host: "127.0.0.1" });
});

afterAll(async () => {
  await fake.stop();
});

beforeEach(() => {
  recordLocalEndpoints({ smtpUrl: fake.url, mailCaptureFile: undefined });
  clearCapturedMail();
});

afterEach(() => {
  vi.restoreAllMocks();
});

describe("sending through the fake SMTP server", () => {
  it("captures subject, recipients, text and html of a message sent with nodemailer", async () => {
    await sendMail({
      to: ["vendor@example.test", "second@example.test"],
      subject: "Award notice: Pumps 2031",
      text: "Your offer was awarded.",
      html: "<p>Your offer was <b>awarded</b>.</p>",
    });
    const [mail] = listCapturedMail();
    expect(listCapturedMail()).toHaveLength(1);
    expect(mail.subject).toBe("Award notice: Pumps 2031");
    expect(mail.to).toEqual(["vendor@example.test", "second@example.test"]);
    expect(mail.text.trim()).toBe("Your offer was awarded.");
    expect(mail.html).toContain("<b>awarded</b>");
    expect(mail.from).toContain("noreply@ratecourt.invalid");
    expect(DEFAULT_MAIL_FROM).toContain("Ratecourt");
  });

  it("lists newest first and keeps only the most recent messages", async () => {
    await sendMail({ to: "v@example.test", subject: "first", text: "1" });
    await sendMail({ to: "v@example.test", subject: "second", text: "2" });
    expect(listCapturedMail().map((mail) => mail.subject)).toEqual(["second", "first"]);

    for (let index = 0; index < MAX_CAPTURED_MAIL + 5; index += 1) recordCapturedMail(sample(`m${index}`));
    const listed = listCapturedMail();
    expect(listed).toHaveLength(MAX_CAPTURED_MAIL);
    expect(listed[0].id).toBe(`m${MAX_CAPTURED_MAIL + 4}`);
    expect(listed.some((mail) => mail.subject === "second")).toBe(false);
  });

  it("rejects a subject that could inject headers", async () => {
    await expect(sendMail({ to: "v@example.test", subject: "hi\r\nBcc: x@example.test", text: "" })).rejects.toThrow();
    expect(listCapturedMail()).toHaveLength(0);
  });
});

describe("queueMail", () => {
  it("delivers in the background and flushMail waits for it", async () => {
    queueMail({ to: "v@example.test", subject: "Queued", text: "later" });
    await flushMail();
    expect(listCapturedMail().map((mail) => mail.subject)).toEqual(["Queued"]);
  });

  it("neither throws nor blocks when the server is unreachable, retries with backoff, then gives up", async () => {
    recordLocalEndpoints({ smtpUrl: await closedPortUrl() });
    // Each failed attempt says so: the test waits for those words, not for the clock.
    const messages: string[] = [];
    let heard = () => {};
    const warn = vi.spyOn(console, "warn").mockImplementation((message: unknown) => {
      messages.push(String(message));
      heard();
    });
    const nextWarning = () => new Promise<void>((resolve) => (heard = resolve));
    // The backoff's waits run on a fake clock; the refused connections stay real.
    vi.useFakeTimers({ toFake: ["setTimeout"] });
    try {
      const failed = nextWarning();
      expect(() => queueMail({ to: "v@example.test", subject: "Regret notice", text: "x" }, { attempts: 3, backoffMs: 100 })).not.toThrow();
      // It returned before its first attempt even failed: sending never holds up the action.
      expect(warn).not.toHaveBeenCalled();
      await failed;
      // No next attempt until the wait has passed, then one; the wait doubles each time.
      for (const [i, wait] of [100, 200].entries()) {
        expect(messages[i]).toMatch(new RegExp(`attempt ${i + 1}/3.*retrying in ${wait} ms`));
        const next = nextWarning();
        await vi.advanceTimersByTimeAsync(wait - 1);
        expect(messages).toHaveLength(i + 1);
        await vi.advanceTimersByTimeAsync(1);
        await next;
      }
      await flushMail();
    } finally {
      vi.useRealTimers();
    }
    expect(messages).toHaveLength(3);
    expect(messages[2]).toMatch(/gave up on "Regret notice" after 3 attempt/);
    expect(listCapturedMail()).toHaveLength(0);
  });

  it("does not retry a permanent refusal (5xx)", async () => {
    const refusing = new SMTPServer({
      authOptional: true,
      disabledCommands: ["STARTTLS"],
      logger: false,
      onRcptTo(_address, _session, callback) {
        callback(Object.assign(new Error("No such user"), { responseCode: 550 }));
      },
    });
    await new Promise<void>((resolve) => refusing.listen(0, "127.0.0.1", resolve));
    recordLocalEndpoints({ smtpUrl: `smtp://127.0.0.1:${(refusing.server.address() as AddressInfo).port}` });
    const warn = vi.spyOn(console, "warn").mockImplementation(() => {});
    try {
      queueMail({ to: "nobody@example.test", subject: "Refused", text: "x" }, { attempts: 4, backoffMs: 5_000 });
      await flushMail();
      expect(warn).toHaveBeenCalledTimes(1);
      expect(String(warn.mock.calls[0][0])).toMatch(/gave up on "Refused" after 1 attempt/);
    } finally {
      await new Promise<void>((resolve) => refusing.close(() => resolve()));
    }
  });

  it("drops an invalid message with a warning instead of throwing", async () => {
    const warn = vi.spyOn(console, "warn").mockImplementation(() => {});
    expect(() => queueMail({ to: "not an address", subject: "x", text: "" })).not.toThrow();
    await flushMail();
    expect(warn).toHaveBeenCalledTimes(1);
    expect(listCapturedMail()).toHaveLength(0);
  });
});

describe("captured store", () => {
  it("is shared by a second copy of the module in the same process", async () => {
    vi.resetModules();
    const copy = await import("@/lib/mail/captured-mail");
    expect(copy.recordCapturedMail).not.toBe(recordCapturedMail);

    copy.recordCapturedMail(sample("from-the-copy"));
    expect(listCapturedMail().map((mail) => mail.id)).toEqual(["from-the-copy"]);
    await sendMail({ to: "v@example.test", subject: "from-the-fake", text: "" });
    expect(copy.listCapturedMail().map((mail) => mail.subject)).toEqual(["from-the-fake", "from-the-copy"]);
    copy.clearCapturedMail();
    expect(listCapturedMail()).toEqual([]);
  });

  it("goes through the data folder's file while the local fake records one, so the Mailroom survives restarts", async () => {
    const folder = mkdtempSync(path.join(tmpdir(), "ratecourt-mail-"));
    const file = path.join(folder, "nested", "mailroom.json");
    recordLocalEndpoints({ mailCaptureFile: file });
    try {
      await sendMail({ to: "v@example.test", subject: "On file", text: "" });
      expect(existsSync(file)).toBe(true);
      expect(listCapturedMail().map((mail) => mail.subject)).toEqual(["On file"]);
      recordLocalEndpoints({ mailCaptureFile: undefined });
      expect(listCapturedMail()).toEqual([]); // nothing went to memory
      recordLocalEndpoints({ mailCaptureFile: file });
      clearCapturedMail();
      expect(existsSync(file)).toBe(false);
      expect(listCapturedMail()).toEqual([]);
    } finally {
      recordLocalEndpoints({ mailCaptureFile: undefined });
      rmSync(folder, { recursive: true, force: true });
    }
  });
});

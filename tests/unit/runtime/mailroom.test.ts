import { afterEach, describe, expect, it } from "vitest";
import { mailroomEnabled } from "@/lib/server/services";
import { setEnv } from "../../support/env";

const production = {
  NODE_ENV: "production",
  BETTER_AUTH_SECRET: "s".repeat(32),
  BETTER_AUTH_URL: "https://ratecourt.example.org",
  LEDGER_KEY: "k".repeat(32),
  SMTP_URL: "smtp://mail.example.org:25",
  MAIL_FROM: "rc@example.org",
  S3_ENDPOINT: "https://objects.example.org",
  S3_BUCKET: "ratecourt",
  S3_ACCESS_KEY_ID: "key",
  S3_SECRET_ACCESS_KEY: "secret",
};

let restore = () => {};
afterEach(() => restore());

describe("the Mailroom", () => {
  it("exists in demo mode while the local fake catches the mail", () => {
    restore = setEnv({ SMTP_URL: undefined });
    expect(mailroomEnabled()).toBe(true);
  });

  it("is gone in demo mode when SMTP_URL names a real mail server", () => {
    restore = setEnv({ SMTP_URL: "smtp://mail.example.org:25" });
    expect(mailroomEnabled()).toBe(false);
  });

  it("never exists in production", () => {
    restore = setEnv({ ...production, DEMO: undefined });
    expect(mailroomEnabled()).toBe(false);
  });
});

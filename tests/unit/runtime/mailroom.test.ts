import { afterEach, describe, expect, it } from "vitest";
import { mailroomEnabled } from "@/lib/server/services";
import { PRODUCTION_SETTINGS, setEnv } from "../../support/env";

const production = PRODUCTION_SETTINGS;

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

import { describe, expect, it } from "vitest";
import { demoMarkerFor } from "@/app/_components/demo-marker";
import { parseEnv } from "@/lib/env";

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

describe("the demo marker", () => {
  it("shows in development and tests", () => {
    for (const NODE_ENV of ["development", "test"]) {
      expect(demoMarkerFor(parseEnv({ NODE_ENV }))?.props).toMatchObject({ "data-testid": "demo-marker", children: "demo" });
    }
  });

  it("shows in a production build started with DEMO=1, even with every production setting given", () => {
    expect(demoMarkerFor(parseEnv({ NODE_ENV: "production", DEMO: "1" }))).not.toBeNull();
    expect(demoMarkerFor(parseEnv({ ...production, DEMO: "1" }))).not.toBeNull();
  });

  it("never shows in production", () => {
    expect(demoMarkerFor(parseEnv(production))).toBeNull();
    expect(demoMarkerFor(parseEnv({ ...production, DEMO: "0" }))).toBeNull();
  });
});

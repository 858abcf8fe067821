import { createRequire } from "node:module";
import os from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { demoPackages, demoPackagesRefusal, missingDemoPackages } from "@/lib/dev/demo-packages";
import { EnvError, parseEnv, productionProblems, productionRefusal } from "@/lib/env";
import { PRODUCTION_VARIABLES } from "../../support/env";

const production = { NODE_ENV: "production" } as const;
const complete = {
  ...production,
  BETTER_AUTH_SECRET: "s".repeat(40),
  BETTER_AUTH_URL: "https://ratecourt.example.org",
  LEDGER_KEY: "k".repeat(40),
  SMTP_URL: "smtps://mailer:pw@mail.example.org:465",
  MAIL_FROM: "Ratecourt <ratecourt@example.org>",
  S3_ENDPOINT: "https://objects.example.org",
  S3_BUCKET: "ratecourt",
  S3_ACCESS_KEY_ID: "key",
  S3_SECRET_ACCESS_KEY: "secret",
};

describe("settings", () => {
  it("development is a demo with demo data by default", () => {
    const env = parseEnv({});
    expect(env.demoMode).toBe(true);
    expect(env.seedDemo).toBe(true);
    expect(env.appUrl).toBe("http://localhost:3000");
    expect(productionProblems(env)).toEqual([]);
  });

  it("a production start names every missing variable", () => {
    const problems = productionProblems(parseEnv(production));
    expect(problems.map((line) => line.split(":")[0])).toEqual(PRODUCTION_VARIABLES);
    expect(productionRefusal(problems)).toContain("DEMO=1");
  });

  it("production loads no demo data unless asked for, and needs nothing more when complete", () => {
    const env = parseEnv(complete);
    expect(productionProblems(env)).toEqual([]);
    expect(env.demoMode).toBe(false);
    expect(env.seedDemo).toBe(false);
    expect(parseEnv({ ...complete, SEED: "demo" }).seedDemo).toBe(true);
  });

  it("DEMO=1 makes a production build a demo: fakes allowed, demo data loaded", () => {
    const env = parseEnv({ ...production, DEMO: "1" });
    expect(env.demoMode).toBe(true);
    expect(env.seedDemo).toBe(true);
    expect(productionProblems(env)).toEqual([]);
    expect(parseEnv({ ...production, DEMO: "1", SEED: "none" }).seedDemo).toBe(false);
  });

  it("refuses bad values with the variable's name, and treats empty as unset", () => {
    expect(() => parseEnv({ PORT: "http" })).toThrow(EnvError);
    expect(() => parseEnv({ PORT: "70000" })).toThrow(/PORT/);
    expect(() => parseEnv({ SEED: "all" })).toThrow(/SEED/);
    expect(() => parseEnv({ BETTER_AUTH_SECRET: "short" })).toThrow(/BETTER_AUTH_SECRET: must be at least 32/);
    expect(() => parseEnv({ DATABASE_URL: "mysql://x" })).toThrow(/DATABASE_URL/);
    expect(parseEnv({ SMTP_URL: "", PORT: "" }).SMTP_URL).toBeUndefined();
    expect(parseEnv({ PORT: "4000" }).appUrl).toBe("http://localhost:4000");
  });
});

describe("env() during the build", () => {
  it("needs no production settings while Next.js builds, and refuses a production start without them", async () => {
    const { env, resetEnvForTests } = await import("@/lib/env");
    const saved = { ...process.env };
    try {
      for (const name of Object.keys(process.env)) if (/^(DEMO|SEED|BETTER_AUTH_|LEDGER_KEY|SMTP_|MAIL_|S3_)/.test(name)) delete process.env[name];
      Object.assign(process.env, { NODE_ENV: "production", NEXT_PHASE: "phase-production-build" });
      resetEnvForTests();
      expect(env().demoMode).toBe(false);
      process.env.NEXT_PHASE = "phase-production-server";
      resetEnvForTests();
      expect(() => env()).toThrow(/BETTER_AUTH_SECRET/);
    } finally {
      process.env = saved;
      resetEnvForTests();
    }
  });
});

describe("the demo's development packages", () => {
  const here = createRequire(import.meta.url).resolve;
  // A folder with no node_modules above it: nothing resolves from there.
  const nowhere = createRequire(path.join(os.tmpdir(), "rc-no-packages", "x.js")).resolve;

  it("are asked for only by the fakes a demo starts", () => {
    expect(demoPackages(parseEnv({}))).toEqual(["smtp-server", "mailparser", "s3rver", "@smithy/signature-v4"]);
    expect(demoPackages(parseEnv({ SMTP_URL: complete.SMTP_URL }))).toEqual(["s3rver", "@smithy/signature-v4"]);
    expect(demoPackages(parseEnv({ S3_ENDPOINT: complete.S3_ENDPOINT }))).toEqual(["smtp-server", "mailparser"]);
    expect(demoPackages(parseEnv(complete))).toEqual([]);
  });

  it("are found in a development install, missing from one without them, and the refusal says what to do", () => {
    expect(missingDemoPackages(parseEnv({}), here)).toEqual([]);
    const missing = missingDemoPackages(parseEnv({ ...production, DEMO: "1" }), nowhere);
    expect(missing).toEqual(["smtp-server", "mailparser", "s3rver", "@smithy/signature-v4"]);
    expect(demoPackagesRefusal({ missing })).toContain("demo mode needs the development packages: run npm install (missing: smtp-server, mailparser");
  });
});

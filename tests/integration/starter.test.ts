// The starter behind `npm run dev` and `npm start` refuses before Next.js is even started. It runs
// here as `npm start` runs it: bundled by lib/runtime/bundle.mjs and started with plain node.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { spawnSync } from "node:child_process";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PRODUCTION_VARIABLES } from "../support/env";

const root = path.resolve(import.meta.dirname, "../..");
// Inside the project, so that the bundle finds node_modules as .next/ratecourt/start.mjs does.
fs.mkdirSync(path.join(root, ".build"), { recursive: true });
const bundleDir = fs.mkdtempSync(path.join(root, ".build", "starter-test-"));
const starter = path.join(bundleDir, "start.mjs");

/** A production install: the packages without the development ones the demo's fakes need. */
const productionInstall = fs.mkdtempSync(path.join(os.tmpdir(), "rc-starter-install-"));
const devOnly = new Set(["s3rver", "smtp-server", "mailparser", "tsx", ".bin"]);

beforeAll(() => {
  const bundled = spawnSync(process.execPath, ["lib/runtime/bundle.mjs", bundleDir], { cwd: root, encoding: "utf8", timeout: 120_000 });
  expect(bundled.stderr).toBe("");
  expect(bundled.status).toBe(0);
  fs.mkdirSync(path.join(productionInstall, "node_modules"));
  for (const name of fs.readdirSync(path.join(root, "node_modules"))) {
    if (!devOnly.has(name)) fs.symlinkSync(path.join(root, "node_modules", name), path.join(productionInstall, "node_modules", name));
  }
  fs.copyFileSync(starter, path.join(productionInstall, "start.mjs"));
}, 120_000);

afterAll(() => {
  fs.rmSync(bundleDir, { recursive: true, force: true });
  fs.rmSync(productionInstall, { recursive: true, force: true });
});

function start(mode: "dev" | "start", env: Record<string, string>, script = starter) {
  const clean = Object.fromEntries(
    Object.entries(process.env).filter(([name]) => !/^(NODE_ENV|DEMO|SEED|BETTER_AUTH_|LEDGER_KEY|SMTP_|MAIL_|S3_|DB_MEMORY|DATABASE_URL)/.test(name)),
  );
  const result = spawnSync(process.execPath, [script, mode], {
    cwd: root,
    env: { ...clean, ...env } as NodeJS.ProcessEnv,
    encoding: "utf8",
    timeout: 60_000,
  });
  return { code: result.status, output: `${result.stdout}${result.stderr}` };
}

describe("the starter", () => {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), "rc-starter-"));

  it("refuses a production start without its settings, naming each one", () => {
    const { code, output } = start("start", { DATA_DIR: dataDir });
    expect(code).toBe(1);
    for (const name of PRODUCTION_VARIABLES) {
      expect(output).toContain(`${name}:`);
    }
    expect(output).toContain("DEMO=1");
    expect(fs.existsSync(path.join(dataDir, "server.lock"))).toBe(false);
  });

  it("refuses bad settings with the variable's name", () => {
    const { code, output } = start("dev", { DATA_DIR: dataDir, PORT: "eighty" });
    expect(code).toBe(1);
    expect(output).toContain("PORT:");
  });

  it("refuses a second server on a data folder that a running process holds", () => {
    // The parent of this test process is alive for the whole test.
    fs.writeFileSync(path.join(dataDir, "server.lock"), JSON.stringify({ pid: process.ppid, what: "npm run dev", since: "earlier" }));
    const { code, output } = start("dev", { DATA_DIR: dataDir });
    expect(code).toBe(1);
    expect(output).toContain(`in use by process ${process.ppid} (npm run dev`);
    fs.rmSync(path.join(dataDir, "server.lock"));
  });

  it("refuses the demo on an install without the development packages, saying to install them", () => {
    const { code, output } = start("start", { DATA_DIR: dataDir, DEMO: "1" }, path.join(productionInstall, "start.mjs"));
    expect(code).toBe(1);
    expect(output).toContain("demo mode needs the development packages: run npm install (missing: smtp-server, mailparser, s3rver)");
    expect(output).not.toMatch(/\n\s+at /);
    expect(fs.existsSync(path.join(dataDir, "server.lock"))).toBe(false);
  });

  it("on that install, still names the missing production settings first", () => {
    const { code, output } = start("start", { DATA_DIR: dataDir }, path.join(productionInstall, "start.mjs"));
    expect(code).toBe(1);
    expect(output).toContain("Ratecourt refuses to start in production without these settings:");
    expect(output).toContain("S3_ENDPOINT:");
  });

  it("is reached through the launcher npm start uses, which passes the mode on", () => {
    const launcher = path.join(root, "lib/runtime/built.mjs");
    const run = spawnSync(process.execPath, [launcher, "start", "start"], {
      cwd: root,
      env: { PATH: process.env.PATH, NODE_ENV: "production", DATA_DIR: dataDir, RATECOURT_BUILT_DIR: bundleDir },
      encoding: "utf8",
      timeout: 60_000,
    });
    expect(run.status).toBe(1);
    expect(`${run.stdout}${run.stderr}`).toContain("Ratecourt refuses to start in production without these settings:");
  });

  it("says to build first when there is no compiled copy, instead of a module-not-found trace", () => {
    const launcher = path.join(root, "lib/runtime/built.mjs");
    const empty = fs.mkdtempSync(path.join(os.tmpdir(), "rc-unbuilt-"));
    for (const name of ["start", "backup", "restore", "create-admin"]) {
      const run = spawnSync(process.execPath, [launcher, name], {
        cwd: root,
        env: { PATH: process.env.PATH, NODE_ENV: "production", RATECOURT_BUILT_DIR: empty },
        encoding: "utf8",
      });
      expect(run.status).toBe(1);
      expect(run.stderr).toContain("is not built yet");
      expect(run.stderr).toContain("run npm run build first");
      expect(run.stderr).not.toMatch(/\n\s+at /);
    }
    fs.rmSync(empty, { recursive: true, force: true });
  });
});

// The starter behind `npm run dev` and `npm start` refuses before Next.js is even started.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { spawnSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { PRODUCTION_VARIABLES } from "../support/env";

const root = path.resolve(import.meta.dirname, "../..");
const tsx = path.join(root, "node_modules/.bin/tsx");

function start(mode: "dev" | "start", env: Record<string, string>) {
  const clean = Object.fromEntries(
    Object.entries(process.env).filter(([name]) => !/^(NODE_ENV|DEMO|SEED|BETTER_AUTH_|LEDGER_KEY|SMTP_|MAIL_|S3_|DB_MEMORY|DATABASE_URL)/.test(name)),
  );
  const result = spawnSync(tsx, ["lib/runtime/start.ts", mode], {
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
});

import { defineConfig } from "@playwright/test";
import path from "node:path";

const root = path.resolve(import.meta.dirname, "../..");
const port = Number(process.env.E2E_PORT ?? 3100);
const baseURL = `http://localhost:${port}`;
const dataDir = path.join(root, ".data", "e2e");

export default defineConfig({
  testDir: import.meta.dirname,
  testMatch: "**/*.spec.ts",
  // One demo database for the whole run: the tender journey goes review -> comparison -> award
  // on the gauges tender, in that order; the other journeys use their own tenders.
  projects: [
    {
      name: "pages",
      testMatch: [
        "foundation.spec.ts",
        "explorer.spec.ts",
        "tender-draft.spec.ts",
        "offer.spec.ts",
        "sensitivity.spec.ts",
        "runtime.spec.ts",
        "accessibility.spec.ts",
      ],
    },
    { name: "review", testMatch: "review.spec.ts", dependencies: ["pages"] },
    { name: "comparison", testMatch: "comparison.spec.ts", dependencies: ["review"] },
    { name: "deadlock", testMatch: "deadlock.spec.ts", dependencies: ["comparison"] },
    { name: "award", testMatch: "award.spec.ts", dependencies: ["deadlock"] },
    { name: "ledger", testMatch: "ledger-check.spec.ts", dependencies: ["award"] },
  ],
  workers: 1,
  fullyParallel: false,
  retries: process.env.CI ? 1 : 0,
  timeout: 90_000,
  expect: { timeout: 15_000 },
  reporter: process.env.CI ? [["list"]] : [["list"]],
  outputDir: path.join(root, "test-results"),
  use: {
    baseURL,
    trace: "retain-on-failure",
    launchOptions: {
      // Debian's chromium; the project never downloads a browser.
      executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
      args: [
        "--no-sandbox",
        "--headless",
        "--disable-gpu",
        "--disable-quic",
        "--no-first-run",
        "--disable-background-networking",
        "--disable-component-update",
        "--disable-sync",
      ],
    },
  },
  webServer: {
    // Browser tests run against a production build on a fresh demo database of their own.
    // E2E_SKIP_BUILD=1 reuses the last build while iterating on the specs alone.
    command: `rm -rf "${dataDir}" && ${process.env.E2E_SKIP_BUILD ? "" : "npm run build && "}npm start`,
    cwd: root,
    url: `${baseURL}/sign-in`,
    timeout: 600_000,
    reuseExistingServer: false,
    stdout: "pipe",
    stderr: "pipe",
    env: {
      // A production build in demo mode: local fakes and the invented demo data.
      DEMO: "1",
      // Every journey signs in from this one address, many times a minute.
      SIGN_IN_ATTEMPTS_PER_MINUTE: "1000",
      DATA_DIR: dataDir,
      PORT: String(port),
      BETTER_AUTH_URL: baseURL,
      AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: "true",
      NEXT_TELEMETRY_DISABLED: "1",
    },
  },
});

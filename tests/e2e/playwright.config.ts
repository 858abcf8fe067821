import { defineConfig } from "@playwright/test";
import path from "node:path";

const root = path.resolve(import.meta.dirname, "../..");
const port = Number(process.env.E2E_PORT ?? 3100);
const baseURL = `http://localhost:${port}`;
const dataDir = path.join(root, ".data", "e2e");

export default defineConfig({
  testDir: import.meta.dirname,
  testMatch: "**/*.spec.ts",
  // One database for the whole run: the demo data, read by the page journeys, and one tender per
  // tender journey (review, comparison, deadlock, award, ledger check), each written in that
  // journey's starting state by prepare.ts before the server starts. No journey waits for another,
  // so a failure in one cannot skip or break the next.
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
    // Browser tests run against a production build on a fresh demo database of their own, with the
    // journeys' tenders written into it (and the database closed) before the server takes the folder.
    // E2E_SKIP_BUILD=1 reuses the last build while iterating on the specs alone.
    command: `rm -rf "${dataDir}" && ${process.env.E2E_SKIP_BUILD ? "" : "npm run build && "}npx tsx --conditions=react-server tests/e2e/prepare.ts && npm start`,
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

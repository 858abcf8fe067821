import fc from "fast-check";
import { TEST_LEDGER_KEY } from "./ledger-key";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";

// Every vitest file runs in its own process: an in-memory PGlite unless DATABASE_URL names a server.
process.env.DB_MEMORY ??= "1";
process.env.LEDGER_KEY ??= TEST_LEDGER_KEY;
process.env.BETTER_AUTH_URL ??= "http://localhost:3000";
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = "true";
// A cold engine worker starts in a few seconds on a loaded machine; tests that time a deadline set their own.
process.env.ENGINE_DEADLINE_MS ??= "60000";
// The local mail and object-store fakes (started by the first notice or upload) write into the data
// folder: each test process gets one of its own, never the working tree's .data/.
if (!process.env.DATA_DIR) {
  const folder = mkdtempSync(path.join(tmpdir(), "ratecourt-test-"));
  process.env.DATA_DIR = folder;
  process.on("exit", () => rmSync(folder, { recursive: true, force: true }));
}

// Property tests draw the same cases on every run (fast-check prints the seed and the shrunk
// counterexample when one fails); FC_SEED=<n> replays or varies them on purpose.
fc.configureGlobal({ seed: Number(process.env.FC_SEED ?? 20261202) });

import { TEST_LEDGER_KEY } from "./ledger-key";

// Every vitest file runs in its own process: an in-memory PGlite unless DATABASE_URL names a server.
process.env.DB_MEMORY ??= "1";
process.env.LEDGER_KEY ??= TEST_LEDGER_KEY;
process.env.BETTER_AUTH_URL ??= "http://localhost:3000";
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = "true";
// A cold engine worker starts in a few seconds on a loaded machine; tests that time a deadline set their own.
process.env.ENGINE_DEADLINE_MS ??= "60000";

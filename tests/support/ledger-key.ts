/**
 * The ledger checkpoint key of every test process: the snapshot that global-setup.ts seeds is
 * signed with it, and each test file verifies with it (an in-memory database otherwise makes a
 * random key per process).
 */
export const TEST_LEDGER_KEY = "test-ledger-key-".padEnd(64, "0");

import { describe, expect, it } from "vitest";
import { checkpointDue, checkpointProblem, CHECKPOINT_EVERY, signatureHolds, signCheckpoint } from "@/lib/ledger/anchors";
import { headLine } from "@/lib/ledger/head";
import { parseEnv, productionProblems } from "@/lib/env";

const KEY = "k".repeat(40);
const HEAD = { seq: 40, hash: "ab".repeat(32) };
const AT = new Date("2027-03-04T10:15:00.000Z");

describe("signed checkpoints", () => {
  it("hold only with the key they were signed with, and only for the head, time and reason signed", () => {
    const checkpoint = signCheckpoint(KEY, HEAD, "schedule", AT);
    expect(checkpoint).toMatchObject({ seq: 40, hash: HEAD.hash, at: AT.toISOString(), reason: "schedule" });
    expect(checkpoint.signature).toMatch(/^[0-9a-f]{64}$/);
    expect(signatureHolds(KEY, checkpoint)).toBe(true);
    expect(signatureHolds("another key of forty characters, or more", checkpoint)).toBe(false);
    for (const change of [{ seq: 41 }, { hash: "cd".repeat(32) }, { at: new Date(0).toISOString() }, { reason: "award" as const }, { signature: "0" }]) {
      expect(signatureHolds(KEY, { ...checkpoint, ...change })).toBe(false);
    }
  });

  it("are due when the entry before a new one is a schedule's length past the last checkpoint", () => {
    expect(checkpointDue(null, 0)).toBe(false);
    expect(checkpointDue({ seq: CHECKPOINT_EVERY - 1, hash: "" }, 0)).toBe(false);
    expect(checkpointDue({ seq: CHECKPOINT_EVERY, hash: "" }, 0)).toBe(true);
    expect(checkpointDue({ seq: 2 * CHECKPOINT_EVERY, hash: "" }, CHECKPOINT_EVERY + 1)).toBe(false);
  });

  it("name what they show about the chain as it stands", () => {
    const checkpoint = signCheckpoint(KEY, HEAD, "verified", AT);
    const at = "the checkpoint signed at entry #40 (2027-03-04T10:15:00.000Z)";
    expect(checkpointProblem(KEY, checkpoint, HEAD.hash, 45)).toBeNull();
    expect(checkpointProblem(KEY, checkpoint, "ef".repeat(32), 45)).toBe(
      `entry #40 no longer has the hash signed at ${at}: entries up to it were rewritten and their hashes recomputed`,
    );
    expect(checkpointProblem(KEY, checkpoint, undefined, 35)).toBe(
      `the ledger ends at entry #35, but ${at} shows it reached that far: the newest entries were removed`,
    );
    expect(checkpointProblem(KEY, checkpoint, undefined, 45)).toBe(`entry #40, signed at ${at}, is missing: entries were removed`);
    expect(checkpointProblem("another key of forty characters, or more", checkpoint, HEAD.hash, 45)).toBe(
      `${at} has a signature that does not match: it was forged or edited`,
    );
  });

  it("quote a head in memos and notices by its number and the first 12 digits of its hash", () => {
    expect(headLine(HEAD)).toBe("Ledger head when issued: entry #40, hash abababababab.");
    expect(headLine(null)).toBe("Ledger head when issued: the ledger was empty.");
  });
});

describe("the ledger key setting", () => {
  it("is required in production (not in the demo) and must be long enough", () => {
    expect(productionProblems(parseEnv({ NODE_ENV: "production" })).some((p) => p.startsWith("LEDGER_KEY: "))).toBe(true);
    expect(productionProblems(parseEnv({ NODE_ENV: "production", LEDGER_KEY: KEY })).some((p) => p.startsWith("LEDGER_KEY"))).toBe(false);
    expect(productionProblems(parseEnv({ NODE_ENV: "production", DEMO: "1" }))).toEqual([]);
    expect(() => parseEnv({ LEDGER_KEY: "short" })).toThrow(/LEDGER_KEY: must be at least 32 characters/);
  });
});

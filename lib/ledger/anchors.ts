import { createHmac, timingSafeEqual } from "node:crypto";
import type { Head } from "./head";

/**
 * Signed checkpoints of the ledger head. The key is never stored in the database, so whoever can
 * write to the database can delete entries or rehash them, but cannot sign a head that matches.
 */

/** Entries between two scheduled checkpoints: the most that can be cut off the end without trace. */
export const CHECKPOINT_EVERY = 20;

export type CheckpointReason = "schedule" | "award" | "verified";

export interface Checkpoint extends Head {
  /** ISO 8601, when it was signed. */
  at: string;
  reason: CheckpointReason;
  /** HMAC-SHA256 of the fields above, hex. */
  signature: string;
}

const signedText = (c: Omit<Checkpoint, "signature">) => `ratecourt ledger checkpoint 1\n${c.seq}\n${c.hash}\n${c.at}\n${c.reason}`;

export function signCheckpoint(key: string, head: Head, reason: CheckpointReason, at = new Date()): Checkpoint {
  const unsigned = { seq: head.seq, hash: head.hash, at: at.toISOString(), reason };
  return { ...unsigned, signature: createHmac("sha256", key).update(signedText(unsigned)).digest("hex") };
}

export function signatureHolds(key: string, checkpoint: Checkpoint): boolean {
  const expected = Buffer.from(createHmac("sha256", key).update(signedText(checkpoint)).digest("hex"));
  const given = Buffer.from(checkpoint.signature);
  return expected.length === given.length && timingSafeEqual(expected, given);
}

/** Whether the entry after `previous` should sign `previous` first (the scheduled checkpoints). */
export function checkpointDue(previous: Head | null, lastCheckpointSeq: number): boolean {
  return previous !== null && previous.seq - lastCheckpointSeq >= CHECKPOINT_EVERY;
}

/**
 * What a checkpoint says about the chain as it stands: null when the entry it signed is still
 * there with the same hash. `found` is the entry's current hash (undefined when it is gone) and
 * `end` the last entry's number.
 */
export function checkpointProblem(key: string, checkpoint: Checkpoint, found: string | undefined, end: number): string | null {
  const at = `the checkpoint signed at entry #${checkpoint.seq} (${checkpoint.at})`;
  if (!signatureHolds(key, checkpoint)) return `${at} has a signature that does not match: it was forged or edited`;
  if (found === checkpoint.hash) return null;
  if (found !== undefined)
    return `entry #${checkpoint.seq} no longer has the hash signed at ${at}: entries up to it were rewritten and their hashes recomputed`;
  if (checkpoint.seq > end) return `the ledger ends at entry #${end}, but ${at} shows it reached that far: the newest entries were removed`;
  return `entry #${checkpoint.seq}, signed at ${at}, is missing: entries were removed`;
}

/** Said beside every result: what checkpoints cannot show. */
export const ANCHOR_LIMIT =
  `Entries after the newest signed checkpoint can be removed without trace until the next checkpoint is signed ` +
  `(every ${CHECKPOINT_EVERY} entries, at each award and whenever the chain is verified); ` +
  `an entry edited without recomputing the hashes after it is found by the next full check.`;

/** The copy of the checkpoints kept outside the database, in the data folder, one JSON object a line. */
export const CHECKPOINT_FILE = "ledger-checkpoints.jsonl";

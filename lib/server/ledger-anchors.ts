import "server-only";
import fs from "node:fs";
import path from "node:path";
import { desc, gt, max } from "drizzle-orm";
import { z } from "zod";
import { dataDir, type Queryable } from "@/db/client";
import { ledgerCheckpoints, ledgerEntries } from "@/db/schema";
import { env } from "@/lib/env";
import { CHECKPOINT_FILE, checkpointDue, signCheckpoint, type Checkpoint, type CheckpointReason } from "@/lib/ledger/anchors";
import { headLine, type Head } from "@/lib/ledger/head";
import { ensurePrivateFolder } from "@/lib/runtime/data-lock";
import type { Notice } from "./notify";
import { keptSecret } from "./secrets";

/** LEDGER_KEY, or in demo mode a key made once in the data folder: never in the database. */
export const ledgerKey = () => keptSecret(env().LEDGER_KEY, "ledger-key", true);

const checkpointSchema = z.object({
  seq: z.number().int().positive(),
  hash: z.string(),
  at: z.string(),
  reason: z.enum(["schedule", "award", "verified"]),
  signature: z.string(),
});

// With an in-memory database (tests) the outside copy lives in the process, as the database does.
const MEMORY = Symbol.for("ratecourt.ledger-checkpoints");
const memoryCopy = () => ((globalThis as { [MEMORY]?: Checkpoint[] })[MEMORY] ??= []);
const outsideFile = () => (env().DB_MEMORY ? null : path.join(dataDir(), CHECKPOINT_FILE));

/** Tests that empty their database and start again: the in-process copy goes with it. */
export function forgetCheckpointsInMemory(): void {
  memoryCopy().length = 0;
}

function keepOutside(checkpoint: Checkpoint): void {
  const file = outsideFile();
  if (!file) {
    memoryCopy().push(checkpoint);
    return;
  }
  ensurePrivateFolder(path.dirname(file));
  fs.appendFileSync(file, `${JSON.stringify(checkpoint)}\n`, { mode: 0o600 });
}

interface OutsideCopy {
  file: string;
  /** Bytes of the file read so far (whole lines only). */
  size: number;
  checkpoints: Checkpoint[];
  unreadable: number;
}
const READ = Symbol.for("ratecourt.ledger-checkpoint-file");
const holder = globalThis as { [READ]?: OutsideCopy };

function readLines(copy: OutsideCopy, text: string): void {
  for (const line of text.split("\n")) {
    if (!line.trim()) continue;
    let parsed;
    try {
      parsed = checkpointSchema.safeParse(JSON.parse(line));
    } catch {
      parsed = null;
    }
    if (parsed?.success) copy.checkpoints.push(parsed.data);
    else copy.unreadable += 1;
  }
}

/**
 * The checkpoints kept outside the database; lines that are not checkpoints count as `unreadable`.
 * The file only grows, so a view reads only the lines added since the last read; `fresh` reads it all again.
 */
export function checkpointsOutside(fresh = false): { checkpoints: Checkpoint[]; unreadable: number } {
  const file = outsideFile();
  if (!file) return { checkpoints: [...memoryCopy()], unreadable: 0 };
  const size = fs.existsSync(file) ? fs.statSync(file).size : 0;
  let copy = holder[READ];
  if (fresh || !copy || copy.file !== file || size < copy.size) copy = holder[READ] = { file, size: 0, checkpoints: [], unreadable: 0 };
  if (size > copy.size) {
    const bytes = Buffer.alloc(size - copy.size);
    const fd = fs.openSync(file, "r");
    try {
      fs.readSync(fd, bytes, 0, bytes.length, copy.size);
    } finally {
      fs.closeSync(fd);
    }
    const whole = bytes.lastIndexOf(0x0a) + 1;
    readLines(copy, bytes.subarray(0, whole).toString("utf8"));
    copy.size += whole;
  }
  return { checkpoints: copy.checkpoints, unreadable: copy.unreadable };
}

export interface Anchors {
  /** The checkpoints after the given entry, and the newest of all, oldest first. */
  due: Checkpoint[];
  newest: Checkpoint | null;
  /** How many are kept outside the database. */
  outside: number;
  unreadable: number;
}

/** The checkpoints a check compares with the chain, from the database and from outside it. */
export async function anchorsAfter(db: Queryable, after: number, fresh = false): Promise<Anchors> {
  const outside = checkpointsOutside(fresh);
  const [inside, [newestInside]] = await Promise.all([
    db.select().from(ledgerCheckpoints).where(gt(ledgerCheckpoints.seq, after)),
    db.select().from(ledgerCheckpoints).orderBy(desc(ledgerCheckpoints.seq)).limit(1),
  ]);
  const all = [...outside.checkpoints, ...inside, ...(newestInside ? [newestInside] : [])];
  const newest = all.reduce<Checkpoint | null>((best, c) => (best === null || c.seq > best.seq ? c : best), null);
  // The same checkpoint kept in both places counts once.
  const unique = new Map<string, Checkpoint>();
  for (const c of all) if (c.seq > after || c === newest) unique.set(`${c.seq}:${c.signature}`, c);
  return { due: [...unique.values()].sort((a, b) => a.seq - b.seq), newest, outside: outside.checkpoints.length, unreadable: outside.unreadable };
}

/** Signs a head that is committed (or in the calling transaction, which commits it) and keeps the checkpoint in both places. */
export async function signHead(db: Queryable, head: Head, reason: CheckpointReason): Promise<Checkpoint> {
  const checkpoint = signCheckpoint(ledgerKey(), head, reason);
  await db.insert(ledgerCheckpoints).values(checkpoint).onConflictDoNothing();
  keepOutside(checkpoint);
  return checkpoint;
}

/** The newest entry, or null for an empty ledger. */
export async function currentHead(db: Queryable): Promise<Head | null> {
  const [last] = await db.select({ seq: ledgerEntries.seq, hash: ledgerEntries.hash }).from(ledgerEntries).orderBy(desc(ledgerEntries.seq)).limit(1);
  return last ?? null;
}

/**
 * The scheduled checkpoint, called by appendLedger under its lock before it appends: signs the
 * entry before the new one when enough entries have passed. Only an entry another transaction
 * committed is signed (`ownEarlier` says this transaction appended before), so a rollback never
 * leaves a checkpoint of an entry that does not exist.
 */
export async function checkpointIfDue(tx: Queryable, previous: Head | null, ownEarlier: boolean): Promise<void> {
  if (!previous || ownEarlier) return;
  const [row] = await tx.select({ seq: max(ledgerCheckpoints.seq) }).from(ledgerCheckpoints);
  if (checkpointDue(previous, row?.seq ?? 0)) await signHead(tx, previous, "schedule");
}

/** Signs the committed head now (after an award). Call outside any transaction. */
export async function checkpointNow(db: Queryable, reason: CheckpointReason): Promise<Head | null> {
  const head = await currentHead(db);
  if (head) await signHead(db, head, reason);
  return head;
}

/** Notices carry the ledger head they were sent at, so that a later truncation cannot hide behind them. */
export async function withLedgerHead(db: Queryable, notices: Notice | Notice[]): Promise<Notice[]> {
  const line = headLine(await currentHead(db));
  return (Array.isArray(notices) ? notices : [notices]).map((n) => ({ ...n, text: `${n.text}\n\n${line}` }));
}

import "server-only";
import { and, asc, eq, gt, inArray, lte } from "drizzle-orm";
import type { Queryable } from "@/db/client";
import { ledgerEntries, ledgerVerification } from "@/db/schema";
import { ANCHOR_LIMIT, checkpointProblem } from "@/lib/ledger/anchors";
import type { Head } from "@/lib/ledger/head";
import { entryProblem, GENESIS_HASH, type LedgerRow } from "@/lib/ledger/chain";
import { anchorsAfter, currentHead, ledgerKey, signHead, type Anchors } from "./ledger-anchors";

/** Entries read and hashed at a time. */
export const CHECK_BATCH = 5_000;
const STATE_ID = "chain";
const START: Head = { seq: 0, hash: GENESIS_HASH };

export interface Break {
  seq: number;
  reason: string;
}

export interface ChainCheck {
  ok: boolean;
  /** The newest entry known to be intact (entry 0 is the start of the chain). */
  verifiedThrough: Head;
  verifiedAt: string;
  /** Entries hashed by this check: only those after the last verified head. */
  checkedNow: number;
  brokenAt?: number;
  reason?: string;
  /** Signed checkpoints kept outside the database, the newest one (from either place), and what they cannot show. */
  anchors: { outside: number; newest: Head | null; limit: string };
  checkedAt: string;
}

/** Checks each link after `from`, up to entry `through`, at most `limit` entries; `checked` counts the intact ones. */
export async function checkLinks(db: Queryable, from: Head, through: number, limit = CHECK_BATCH) {
  const rows = (await db
    .select()
    .from(ledgerEntries)
    .where(and(gt(ledgerEntries.seq, from.seq), lte(ledgerEntries.seq, through)))
    .orderBy(asc(ledgerEntries.seq))
    .limit(limit)) as LedgerRow[];
  let last = from;
  for (const [index, row] of rows.entries()) {
    const reason = entryProblem(row, last.hash);
    if (reason) return { last, checked: index, problem: { seq: row.seq, reason } as Break };
    last = { seq: row.seq, hash: row.hash };
  }
  return { last, checked: rows.length, problem: null };
}

/**
 * Checks the signed checkpoints against the chain as it stands: every one newer than entry
 * `after`, and always the newest of all (which catches truncation and wholesale recomputation
 * even when the verified head itself was tampered with). `fresh` rereads the file outside the database.
 */
export async function checkAnchors(db: Queryable, after: number, fresh = false): Promise<{ problem: Break | null; anchors: Anchors }> {
  const anchors = await anchorsAfter(db, after, fresh);
  if (anchors.unreadable > 0) {
    return {
      anchors,
      problem: { seq: after, reason: `${anchors.unreadable} line(s) of the checkpoint file outside the database are not checkpoints: it was edited` },
    };
  }
  const end = (await currentHead(db))?.seq ?? 0;
  const seqs = [...new Set(anchors.due.map((c) => c.seq))];
  const found = new Map<number, string>();
  for (let i = 0; i < seqs.length; i += CHECK_BATCH) {
    const rows = await db
      .select({ seq: ledgerEntries.seq, hash: ledgerEntries.hash })
      .from(ledgerEntries)
      .where(inArray(ledgerEntries.seq, seqs.slice(i, i + CHECK_BATCH)));
    for (const row of rows) found.set(row.seq, row.hash);
  }
  const key = ledgerKey();
  for (const checkpoint of anchors.due) {
    const reason = checkpointProblem(key, checkpoint, found.get(checkpoint.seq), end);
    if (reason) return { anchors, problem: { seq: Math.min(checkpoint.seq, end + 1), reason } };
  }
  return { anchors, problem: null };
}

async function readState(db: Queryable) {
  const [row] = await db.select().from(ledgerVerification).where(eq(ledgerVerification.id, STATE_ID));
  return row ?? null;
}

/** Records the newest verified head, or a break (which stays until a full check finds the chain intact). */
export async function saveState(db: Queryable, head: Head, broken: Break | null) {
  const values = { seq: head.seq, hash: head.hash, verifiedAt: new Date(), brokenAt: broken?.seq ?? null, reason: broken?.reason ?? null };
  await db
    .insert(ledgerVerification)
    .values({ id: STATE_ID, ...values })
    .onConflictDoUpdate({ target: ledgerVerification.id, set: values });
}

function report(verified: Head, verifiedAt: Date, checkedNow: number, broken: Break | null, anchors: Anchors): ChainCheck {
  const newest = anchors.newest;
  return {
    ok: broken === null,
    verifiedThrough: verified,
    verifiedAt: verifiedAt.toISOString(),
    checkedNow,
    ...(broken ? { brokenAt: broken.seq, reason: broken.reason } : {}),
    anchors: { outside: anchors.outside, newest: newest ? { seq: newest.seq, hash: newest.hash } : null, limit: ANCHOR_LIMIT },
    checkedAt: new Date().toISOString(),
  };
}

/** Whether the verified head is still the entry it was: gone or rehashed means entries were removed or rewritten. */
async function headProblem(db: Queryable, head: Head): Promise<Break | null> {
  if (head.seq === 0) return null;
  const [row] = await db.select({ hash: ledgerEntries.hash }).from(ledgerEntries).where(eq(ledgerEntries.seq, head.seq));
  if (!row) return { seq: head.seq, reason: `entry #${head.seq}, verified earlier, is gone: entries were removed` };
  if (row.hash !== head.hash)
    return { seq: head.seq, reason: `entry #${head.seq} no longer has the hash it was verified with: entries up to it were rewritten` };
  return null;
}

/**
 * The check every view makes: hashes only the entries added since the last verified head, checks
 * that head and the signed checkpoints, then moves the head and signs it. A break found is kept.
 */
export async function verifyNew(db: Queryable): Promise<ChainCheck> {
  const state = await readState(db);
  const start: Head = state ? { seq: state.seq, hash: state.hash } : START;
  if (state?.brokenAt != null) {
    return report(start, state.verifiedAt, 0, { seq: state.brokenAt, reason: state.reason ?? "" }, await anchorsAfter(db, start.seq));
  }
  let head = start;
  let checked = 0;
  let problem = await headProblem(db, start);
  while (!problem) {
    const step = await checkLinks(db, head, Number.MAX_SAFE_INTEGER);
    checked += step.checked;
    head = step.last;
    problem = step.problem;
    if (step.checked < CHECK_BATCH) break;
  }
  const { anchors, problem: anchorProblem } = await checkAnchors(db, start.seq);
  problem ??= anchorProblem;
  if (problem) {
    await saveState(db, start, problem);
    return report(start, state?.verifiedAt ?? new Date(), checked, problem, anchors);
  }
  // Nothing new: a view writes nothing.
  const moved = !state || head.seq !== start.seq;
  if (moved) await saveState(db, head, null);
  if (head.seq > (anchors.newest?.seq ?? 0)) {
    anchors.newest = await signHead(db, head, "verified");
    anchors.outside += 1;
  }
  return report(head, moved ? new Date() : state.verifiedAt, checked, null, anchors);
}

export interface IssuedHead extends Head {
  /** The entry is still there with this hash, and the chain is verified up to it. */
  inVerifiedChain: boolean;
  /** The same, in words. */
  standing: string;
}

/** Where a head quoted in a memo or notice stands in the chain now (after checking what is new). */
export async function issuedHead(db: Queryable, head: Head): Promise<IssuedHead> {
  const check = await verifyNew(db);
  const [row] = await db.select({ hash: ledgerEntries.hash }).from(ledgerEntries).where(eq(ledgerEntries.seq, head.seq));
  const entry = `Entry #${head.seq}`;
  let standing: string;
  let inVerifiedChain = false;
  if (!row) standing = `${entry} is no longer in the ledger: entries were removed.`;
  else if (row.hash !== head.hash) standing = `${entry} no longer has the hash it had at issue: the ledger was rewritten.`;
  else if (check.brokenAt !== undefined && check.brokenAt <= head.seq)
    standing = `The ledger is broken at entry #${check.brokenAt}, at or before this one: ${check.reason}.`;
  else {
    inVerifiedChain = true;
    standing =
      check.brokenAt === undefined
        ? `${entry} is in the ledger with the same hash, and the chain is verified through entry #${check.verifiedThrough.seq}.`
        : `${entry} is in the ledger with the same hash and the chain holds up to it; it is broken later, at entry #${check.brokenAt}.`;
  }
  return { seq: head.seq, hash: head.hash, inVerifiedChain, standing };
}

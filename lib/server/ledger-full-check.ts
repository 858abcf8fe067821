import "server-only";
import { and, count, desc, eq, lte } from "drizzle-orm";
import { getDb, type Queryable } from "./database";
import { ledgerEntries, ledgerFullChecks, ledgerVerification, users } from "@/db/schema";
import { ANCHOR_LIMIT } from "@/lib/ledger/anchors";
import { GENESIS_HASH } from "@/lib/ledger/chain";
import { NotFoundError } from "./errors";
import { currentHead, signHead } from "./ledger-anchors";
import { CHECK_BATCH, checkAnchors, checkLinks, saveState, type Break } from "./ledger-check";
import { authorize, type Viewer } from "./session";

export type FullCheck = typeof ledgerFullChecks.$inferSelect & { startedByName: string; limit: string };

const MAY = "Only admins run a full check of the ledger.";

async function load(db: Queryable, id: string): Promise<FullCheck> {
  const [row] = await db
    .select({ check: ledgerFullChecks, name: users.name })
    .from(ledgerFullChecks)
    .innerJoin(users, eq(users.id, ledgerFullChecks.startedBy))
    .where(eq(ledgerFullChecks.id, id));
  if (!row) throw new NotFoundError("There is no such ledger check.");
  return { ...row.check, startedByName: row.name, limit: ANCHOR_LIMIT };
}

/** Starts a full re-verification of every entry up to the current head; run it with stepFullCheck. */
export async function startFullCheck(viewer: Viewer): Promise<FullCheck> {
  authorize(viewer, "verify", "Ledger", MAY);
  const db = await getDb();
  const through = (await currentHead(db))?.seq ?? 0;
  const [{ n }] = await db.select({ n: count() }).from(ledgerEntries).where(lte(ledgerEntries.seq, through));
  const [row] = await db
    .insert(ledgerFullChecks)
    .values({ startedBy: viewer.actor.id, throughSeq: through, total: n, checkedSeq: 0, checkedHash: GENESIS_HASH, checked: 0, status: "running" })
    .returning();
  return load(db, row.id);
}

/** The end of a check: all signed checkpoints against the chain, then the verified head. */
async function finish(db: Queryable, check: FullCheck, last: { seq: number; hash: string }): Promise<Break | null> {
  if (last.seq < check.throughSeq) {
    return {
      seq: last.seq + 1,
      reason: `the ledger reached entry #${check.throughSeq} when this check started, and now ends at entry #${last.seq}: entries were removed`,
    };
  }
  const { problem } = await checkAnchors(db, 0, true);
  if (problem) return problem;
  const [state] = await db.select().from(ledgerVerification);
  // A view may have verified further meanwhile, on top of this head: keep that.
  if (!state || state.brokenAt !== null || state.seq <= last.seq) await saveState(db, last, null);
  if (last.seq > 0) await signHead(db, last, "verified");
  return null;
}

/** Verifies the next batch of a running check and says how far it got; a finished check is returned as it is. */
export async function stepFullCheck(viewer: Viewer, id: string, entries = CHECK_BATCH): Promise<FullCheck> {
  authorize(viewer, "verify", "Ledger", MAY);
  const db = await getDb();
  const check = await load(db, id);
  if (check.status !== "running") return check;
  const step = await checkLinks(db, { seq: check.checkedSeq, hash: check.checkedHash }, check.throughSeq, entries);
  const done = step.problem !== null || step.last.seq >= check.throughSeq || step.checked < entries;
  const problem = step.problem ?? (done ? await finish(db, check, step.last) : null);
  if (problem) {
    // The head verified before stays as it was; the break is named on every view until a check finds the chain intact.
    const [state] = await db.select().from(ledgerVerification);
    await saveState(db, state ?? { seq: 0, hash: GENESIS_HASH }, problem);
  }
  await db
    .update(ledgerFullChecks)
    .set({
      checkedSeq: step.last.seq,
      checkedHash: step.last.hash,
      checked: check.checked + step.checked,
      ...(done ? { status: problem ? "broken" : "intact", brokenAt: problem?.seq ?? null, reason: problem?.reason ?? null, finishedAt: new Date() } : {}),
    })
    // Two steps sent at once: only the first moves the check on.
    .where(and(eq(ledgerFullChecks.id, id), eq(ledgerFullChecks.checkedSeq, check.checkedSeq)));
  return load(db, id);
}

/** The most recent full checks, newest first. */
export async function recentFullChecks(viewer: Viewer, limit = 5): Promise<FullCheck[]> {
  authorize(viewer, "verify", "Ledger", MAY);
  const db = await getDb();
  const rows = await db.select({ id: ledgerFullChecks.id }).from(ledgerFullChecks).orderBy(desc(ledgerFullChecks.createdAt)).limit(limit);
  return Promise.all(rows.map((r) => load(db, r.id)));
}

export async function getFullCheck(viewer: Viewer, id: string): Promise<FullCheck> {
  authorize(viewer, "verify", "Ledger", MAY);
  return load(await getDb(), id);
}

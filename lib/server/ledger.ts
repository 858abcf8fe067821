import "server-only";
import { asc, desc, eq, sql } from "drizzle-orm";
import type { Queryable } from "@/db/client";
import { ADVISORY_LOCKS } from "@/db/locks";
import { ledgerEntries } from "@/db/schema";
import { entryHash, GENESIS_HASH, verifyChain, type ChainReport, type LedgerBody } from "@/lib/ledger/chain";
import { checkpointIfDue } from "./ledger-anchors";
import { checkAnchors } from "./ledger-check";

export interface LedgerInput {
  tenderId?: string | null;
  actor: { id: string; label: string } | null;
  action: string;
  subjectType: string;
  subjectId?: string | null;
  data?: Record<string, unknown>;
}

/** Transactions that have appended already: their earlier entries are not committed yet. */
const appendedIn = new WeakSet<Queryable>();

/** Takes the append lock and returns the head to chain onto, signing a checkpoint first when one is due. */
async function lockHead(tx: Queryable) {
  await tx.execute(sql`select pg_advisory_xact_lock(${ADVISORY_LOCKS.ledgerAppend})`);
  const [last] = await tx.select({ seq: ledgerEntries.seq, hash: ledgerEntries.hash }).from(ledgerEntries).orderBy(desc(ledgerEntries.seq)).limit(1);
  await checkpointIfDue(tx, last ?? null, appendedIn.has(tx));
  appendedIn.add(tx);
  return last?.hash ?? GENESIS_HASH;
}

/** The row for one entry chained onto prevHash. */
function chained(prevHash: string, input: LedgerInput) {
  const body: LedgerBody = {
    tenderId: input.tenderId ?? null,
    actorId: input.actor?.id ?? null,
    actorLabel: input.actor?.label ?? "system",
    action: input.action,
    subjectType: input.subjectType,
    subjectId: input.subjectId ?? null,
    data: JSON.parse(JSON.stringify(input.data ?? {})),
    at: new Date().toISOString(),
  };
  return { ...body, at: new Date(body.at), prevHash, hash: entryHash(prevHash, body) };
}

/** Appends one entry. Call it inside the transaction that makes the change it records. */
export async function appendLedger(tx: Queryable, input: LedgerInput) {
  const [row] = await tx
    .insert(ledgerEntries)
    .values(chained(await lockHead(tx), input))
    .returning();
  return row;
}

/** Rows per insert statement in appendLedgerMany (10 parameters each, far below PostgreSQL's limit). */
const MANY_CHUNK = 500;

/**
 * Appends several entries in the given order under one lock, chained as appendLedger would chain
 * them one by one, in a few multi-row statements (bulk writers such as the scale seed). Same rules:
 * inside the transaction that makes the changes they record.
 */
export async function appendLedgerMany(tx: Queryable, inputs: LedgerInput[]): Promise<void> {
  if (inputs.length === 0) return;
  let prevHash = await lockHead(tx);
  const rows = inputs.map((input) => {
    const row = chained(prevHash, input);
    prevHash = row.hash;
    return row;
  });
  // A multi-row VALUES list takes its serial numbers in order, so seq follows the chain.
  for (let i = 0; i < rows.length; i += MANY_CHUNK) await tx.insert(ledgerEntries).values(rows.slice(i, i + MANY_CHUNK));
}

export async function listLedger(db: Queryable, tenderId?: string) {
  const query = db.select().from(ledgerEntries);
  return (tenderId ? query.where(eq(ledgerEntries.tenderId, tenderId)) : query).orderBy(asc(ledgerEntries.seq));
}

/** Re-verifies every entry and every signed checkpoint at once (scripts and tests; views use verifyNew). */
export async function verifyLedger(db: Queryable): Promise<ChainReport> {
  const rows = await listLedger(db);
  const report = verifyChain(rows);
  if (!report.ok) return report;
  const { problem } = await checkAnchors(db, 0, true);
  if (!problem) return report;
  return { ok: false, entries: report.entries, brokenAt: problem.seq, position: rows.filter((r) => r.seq <= problem.seq).length, reason: problem.reason };
}

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

/** Appends one entry. Call it inside the transaction that makes the change it records. */
export async function appendLedger(tx: Queryable, input: LedgerInput) {
  await tx.execute(sql`select pg_advisory_xact_lock(${ADVISORY_LOCKS.ledgerAppend})`);
  const [last] = await tx
    .select({ seq: ledgerEntries.seq, hash: ledgerEntries.hash })
    .from(ledgerEntries)
    .orderBy(desc(ledgerEntries.seq))
    .limit(1);
  await checkpointIfDue(tx, last ?? null, appendedIn.has(tx));
  appendedIn.add(tx);
  const prevHash = last?.hash ?? GENESIS_HASH;
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
  const hash = entryHash(prevHash, body);
  const [row] = await tx
    .insert(ledgerEntries)
    .values({ ...body, at: new Date(body.at), prevHash, hash })
    .returning();
  return row;
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

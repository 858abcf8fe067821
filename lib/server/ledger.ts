import "server-only";
import { asc, desc, eq, sql } from "drizzle-orm";
import type { Queryable } from "@/db/client";
import { ADVISORY_LOCKS } from "@/db/locks";
import { ledgerEntries } from "@/db/schema";
import { entryHash, GENESIS_HASH, verifyChain, type LedgerBody } from "@/lib/ledger/chain";

export interface LedgerInput {
  tenderId?: string | null;
  actor: { id: string; label: string } | null;
  action: string;
  subjectType: string;
  subjectId?: string | null;
  data?: Record<string, unknown>;
}

/** Appends one entry. Call it inside the transaction that makes the change it records. */
export async function appendLedger(tx: Queryable, input: LedgerInput) {
  await tx.execute(sql`select pg_advisory_xact_lock(${ADVISORY_LOCKS.ledgerAppend})`);
  const [last] = await tx
    .select({ hash: ledgerEntries.hash })
    .from(ledgerEntries)
    .orderBy(desc(ledgerEntries.seq))
    .limit(1);
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

export async function verifyLedger(db: Queryable) {
  return verifyChain(await listLedger(db));
}

// What someone with write access to the database (and not to the ledger key) can do to the ledger.
import { asc, gt, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { ledgerEntries } from "@/db/schema";
import { bodyOf, entryHash, GENESIS_HASH, type LedgerRow } from "@/lib/ledger/chain";

export type Entry = typeof ledgerEntries.$inferSelect;

export const allEntries = (db: Db): Promise<Entry[]> => db.select().from(ledgerEntries).orderBy(asc(ledgerEntries.seq));

/** Puts the ledger back exactly as it was (as a restore from a backup would). */
export async function restoreEntries(db: Db, rows: Entry[]) {
  await db.delete(ledgerEntries);
  for (let i = 0; i < rows.length; i += 500) await db.insert(ledgerEntries).values(rows.slice(i, i + 500));
}

/** Deletes the newest entries, and the checkpoints and verified head the database holds, to hide it. */
export async function truncateAfter(db: Db, seq: number) {
  await db.delete(ledgerEntries).where(gt(ledgerEntries.seq, seq));
  await db.execute(sql`delete from ledger_checkpoints`);
  await db.execute(sql`delete from ledger_verification`);
}

/** Edits one entry's data and recomputes its hash and every later one, so that each link holds again. */
export async function rewriteFrom(db: Db, seq: number, data: Record<string, unknown>) {
  const rows = await allEntries(db);
  let prevHash = "";
  for (const [index, row] of rows.entries()) {
    if (row.seq < seq) continue;
    const prev = prevHash || (rows[index - 1]?.hash ?? GENESIS_HASH);
    const edited = { ...row, data: row.seq === seq ? data : row.data, prevHash: prev } as LedgerRow;
    const hash = entryHash(prev, bodyOf(edited));
    await db.execute(sql`update ledger_entries set data = ${JSON.stringify(edited.data)}::jsonb, prev_hash = ${prev}, hash = ${hash} where seq = ${row.seq}`);
    prevHash = hash;
  }
  await db.execute(sql`delete from ledger_checkpoints`);
  await db.execute(sql`delete from ledger_verification`);
}

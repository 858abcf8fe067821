import { createHash } from "node:crypto";

/** The hash the first entry of the ledger points back to. */
export const GENESIS_HASH = "0".repeat(64);

export interface LedgerBody {
  tenderId: string | null;
  actorId: string | null;
  actorLabel: string;
  action: string;
  subjectType: string;
  subjectId: string | null;
  data: Record<string, unknown>;
  /** ISO 8601 with milliseconds, UTC. */
  at: string;
}

export interface LedgerRow extends Omit<LedgerBody, "at"> {
  seq: number;
  at: Date | string;
  prevHash: string;
  hash: string;
}

/** JSON with object keys sorted at every depth, so that a jsonb round trip hashes the same. */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(",")}]`;
  if (value && typeof value === "object") {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(",")}}`;
  }
  return JSON.stringify(value ?? null);
}

export function entryHash(prevHash: string, body: LedgerBody): string {
  return createHash("sha256").update(prevHash).update("\n").update(canonicalJson(body)).digest("hex");
}

export function bodyOf(row: LedgerRow): LedgerBody {
  return {
    tenderId: row.tenderId,
    actorId: row.actorId,
    actorLabel: row.actorLabel,
    action: row.action,
    subjectType: row.subjectType,
    subjectId: row.subjectId,
    data: row.data,
    at: new Date(row.at).toISOString(),
  };
}

export type ChainReport =
  | { ok: true; entries: number }
  | { ok: false; entries: number; brokenAt: number; position: number; reason: string };

/** Re-verifies rows in ledger order: each must point at its predecessor and hash to what it says. */
export function verifyChain(rows: LedgerRow[]): ChainReport {
  let prev = GENESIS_HASH;
  for (const [index, row] of rows.entries()) {
    const fail = (reason: string): ChainReport => ({
      ok: false,
      entries: rows.length,
      brokenAt: row.seq,
      position: index + 1,
      reason,
    });
    if (row.prevHash !== prev) return fail("it does not point at the entry before it");
    if (entryHash(prev, bodyOf(row)) !== row.hash) return fail("its content no longer matches its hash");
    prev = row.hash;
  }
  return { ok: true, entries: rows.length };
}

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

export type ChainReport = { ok: true; entries: number } | { ok: false; entries: number; brokenAt: number; position: number; reason: string };

/** Why one entry breaks the chain, given the hash of the entry before it; null when it holds. */
export function entryProblem(row: LedgerRow, prevHash: string): string | null {
  if (row.prevHash !== prevHash) return "it does not point at the entry before it";
  if (entryHash(prevHash, bodyOf(row)) !== row.hash) return "its content no longer matches its hash";
  return null;
}

/**
 * Re-verifies rows in ledger order: each must point at its predecessor and hash to what it says.
 * With `only`, just the entries it selects are checked (each against its predecessor in the whole
 * chain) and positions count among them, as a tender's own ledger does.
 */
export function verifyChain(rows: LedgerRow[], only: (row: LedgerRow) => boolean = () => true): ChainReport {
  let position = 0;
  for (const [index, row] of rows.entries()) {
    if (!only(row)) continue;
    position += 1;
    const reason = entryProblem(row, index === 0 ? GENESIS_HASH : rows[index - 1].hash);
    if (reason) return { ok: false, entries: rows.filter(only).length, brokenAt: row.seq, position, reason };
  }
  return { ok: true, entries: position };
}

import { bigint, bigserial, index, integer, jsonb, pgTable, text, timestamp } from "drizzle-orm/pg-core";
import { createdAt, id } from "./columns";
import { users } from "./people";

/** Append-only; each entry's hash covers its content and the previous entry's hash. */
export const ledgerEntries = pgTable(
  "ledger_entries",
  {
    seq: bigserial("seq", { mode: "number" }).primaryKey(),
    tenderId: text("tender_id"),
    actorId: text("actor_id"),
    actorLabel: text("actor_label").notNull(),
    action: text("action").notNull(),
    subjectType: text("subject_type").notNull(),
    subjectId: text("subject_id"),
    data: jsonb("data").$type<Record<string, unknown>>().notNull(),
    at: timestamp("at", { withTimezone: true }).notNull(),
    prevHash: text("prev_hash").notNull(),
    hash: text("hash").notNull().unique(),
  },
  // A tender's entries newest first (the Ledger tab's pages) and its head (the comparison's cache key).
  (t) => [index("ledger_tender_idx").on(t.tenderId), index("ledger_tender_seq_idx").on(t.tenderId, t.seq)],
);

/**
 * Signed heads of the chain (lib/ledger/anchors.ts). A copy of each is also kept outside the
 * database (lib/server/ledger-anchors.ts), so deleting rows here hides nothing.
 */
export const ledgerCheckpoints = pgTable("ledger_checkpoints", {
  seq: bigint("seq", { mode: "number" }).primaryKey(),
  hash: text("hash").notNull(),
  at: text("at").notNull(),
  reason: text("reason", { enum: ["schedule", "award", "verified"] }).notNull(),
  signature: text("signature").notNull(),
});

/** One row: how far the chain has been checked, and the first break found, if any. */
export const ledgerVerification = pgTable("ledger_verification", {
  id: text("id").primaryKey(),
  seq: bigint("seq", { mode: "number" }).notNull(),
  hash: text("hash").notNull(),
  verifiedAt: timestamp("verified_at", { withTimezone: true }).notNull(),
  brokenAt: bigint("broken_at", { mode: "number" }),
  reason: text("reason"),
});

/** Full re-verifications started by an admin, run batch by batch. */
export const ledgerFullChecks = pgTable("ledger_full_checks", {
  id: id(),
  startedBy: text("started_by")
    .notNull()
    .references(() => users.id),
  createdAt: createdAt(),
  /** The head when the check started: it checks every entry up to this one. */
  throughSeq: bigint("through_seq", { mode: "number" }).notNull(),
  total: integer("total").notNull(),
  checkedSeq: bigint("checked_seq", { mode: "number" }).notNull(),
  checkedHash: text("checked_hash").notNull(),
  checked: integer("checked").notNull(),
  status: text("status", { enum: ["running", "intact", "broken"] }).notNull(),
  brokenAt: bigint("broken_at", { mode: "number" }),
  reason: text("reason"),
  finishedAt: timestamp("finished_at", { withTimezone: true }),
});

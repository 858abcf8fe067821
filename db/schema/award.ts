import { bigint, customType, index, timestamp, integer, jsonb, numeric, pgTable, text, uniqueIndex } from "drizzle-orm/pg-core";
import { tenderRef } from "./refs";
import { id, createdAt, oneOf, updatedAt } from "./columns";
import { users } from "./people";
import { tenders } from "./tenders";
import { offers } from "./offers";

/** Value bands: how many approvals a recommendation of this value needs, and the least limit each approver holds. */
export const approvalBands = pgTable("approval_bands", {
  id: id(),
  currency: text("currency").notNull(),
  minValue: numeric("min_value", { precision: 16, scale: 2, mode: "number" }).notNull(),
  maxValue: numeric("max_value", { precision: 16, scale: 2, mode: "number" }),
  approvalsNeeded: integer("approvals_needed").notNull(),
  minApproverLimit: numeric("min_approver_limit", { precision: 16, scale: 2, mode: "number" }).notNull(),
  updatedAt: updatedAt(),
});

export const RECOMMENDATION_STATUSES = ["pending", "returned", "approved", "superseded", "withdrawn"] as const;
export type RecommendationStatus = (typeof RECOMMENDATION_STATUSES)[number];

export const recommendations = pgTable(
  "recommendations",
  {
    id: id(),
    tenderId: tenderRef(),
    offerId: text("offer_id")
      .notNull()
      .references(() => offers.id),
    quantity: integer("quantity").notNull(),
    value: numeric("value", { precision: 16, scale: 2, mode: "number" }).notNull(),
    /** The offer's price at the recommended quantity (price breaks applied); null on rows older than it. */
    computedValue: numeric("computed_value", { precision: 16, scale: 2, mode: "number" }),
    /** Why the award value differs from the computed one (null when it does not). */
    valueReason: text("value_reason"),
    /** Why the quantity exceeds the tender's (null when it does not). */
    quantityReason: text("quantity_reason"),
    currency: text("currency").notNull(),
    justification: text("justification").notNull(),
    status: text("status").$type<RecommendationStatus>().notNull().default("pending"),
    /** The band rule in force when it was submitted: later changes to the bands never apply to it. */
    approvalsNeeded: integer("approvals_needed"),
    minApproverLimit: numeric("min_approver_limit", { precision: 16, scale: 2, mode: "number" }),
    scoreSheet: jsonb("score_sheet").$type<Record<string, unknown>>(),
    preparedBy: text("prepared_by")
      .notNull()
      .references(() => users.id),
    preparedAt: createdAt(),
    /** The buyer's reason for withdrawing it from approval. */
    withdrawReason: text("withdraw_reason"),
  },
  (t) => [index("recommendations_tender_idx").on(t.tenderId), oneOf("recommendations_status_check", t.status, RECOMMENDATION_STATUSES)],
);

export const approvals = pgTable(
  "approvals",
  {
    id: id(),
    recommendationId: text("recommendation_id")
      .notNull()
      .references(() => recommendations.id),
    tenderId: tenderRef(),
    approverId: text("approver_id")
      .notNull()
      .references(() => users.id),
    decision: text("decision").$type<"approved" | "returned">().notNull(),
    comment: text("comment").notNull().default(""),
    decidedAt: createdAt(),
  },
  (t) => [uniqueIndex("approvals_once_idx").on(t.recommendationId, t.approverId)],
);

export const memos = pgTable("memos", {
  id: id(),
  identifier: text("identifier").notNull().unique(),
  tenderId: text("tender_id")
    .notNull()
    .unique()
    .references(() => tenders.id),
  recommendationId: text("recommendation_id")
    .notNull()
    .references(() => recommendations.id),
  sha256: text("sha256").notNull().unique(),
  storageKey: text("storage_key").notNull(),
  size: integer("size").notNull(),
  /** The ledger head the memo was issued at, printed in it (null when the ledger was empty). */
  ledgerSeq: bigint("ledger_seq", { mode: "number" }),
  ledgerHash: text("ledger_hash"),
  createdAt: createdAt(),
});

/** Raw bytes (PGlite hands back a Uint8Array, node-postgres a Buffer: both leave as a Uint8Array). */
const bytes = customType<{ data: Uint8Array; driverData: Uint8Array }>({
  dataType: () => "bytea",
  fromDriver: (value) => new Uint8Array(value),
});

/**
 * The rendered preview of a recommendation's memo, kept for the inputs it was rendered from: the
 * Sign-off tab shows it again until anything the memo prints changes (lib/server/memo-preview.ts).
 * One row per recommendation, replaced when its inputs change; never the issued memo.
 */
export const memoPreviews = pgTable("memo_previews", {
  recommendationId: text("recommendation_id")
    .primaryKey()
    .references(() => recommendations.id),
  /** SHA-256 of everything the memo prints except its date. */
  inputsHash: text("inputs_hash").notNull(),
  pdf: bytes("pdf").notNull(),
  renderedAt: timestamp("rendered_at", { withTimezone: true }).notNull().defaultNow(),
});

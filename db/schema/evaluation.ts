import { doublePrecision, index, pgTable, primaryKey, text, timestamp } from "drizzle-orm/pg-core";
import { tenderRef, vendorRef } from "./refs";
import { id, createdAt, oneOf } from "./columns";
import { users } from "./people";
import { tenders } from "./tenders";
import { claims } from "./offers";

export const MARKS = ["accepted", "rejected-impossible", "evidence-requested", "clarification-requested"] as const;
export type MarkKind = (typeof MARKS)[number];

/** Every mark is kept; a claim's current mark is its latest. */
export const marks = pgTable(
  "marks",
  {
    id: id(),
    claimId: text("claim_id")
      .notNull()
      .references(() => claims.id),
    tenderId: tenderRef(),
    vendorOrgId: vendorRef(),
    mark: text("mark").$type<MarkKind>().notNull(),
    comment: text("comment").notNull().default(""),
    markedBy: text("marked_by")
      .notNull()
      .references(() => users.id),
    markedAt: createdAt(),
  },
  // A claim's current mark is its latest: the queue filters and pages on it.
  (t) => [
    index("marks_claim_idx").on(t.claimId),
    index("marks_claim_latest_idx").on(t.claimId, t.markedAt.desc().nullsFirst(), t.id.desc().nullsFirst()),
    oneOf("marks_mark_check", t.mark, MARKS),
  ],
);

export const threads = pgTable(
  "threads",
  {
    id: id(),
    tenderId: tenderRef(),
    vendorOrgId: vendorRef(),
    claimId: text("claim_id").references(() => claims.id),
    subject: text("subject").notNull(),
    createdBy: text("created_by")
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
    /** An evaluator may close a question that needs no answer, saying why. */
    closedAt: timestamp("closed_at", { withTimezone: true }),
    closedBy: text("closed_by").references(() => users.id),
    closeReason: text("close_reason"),
  },
  (t) => [index("threads_tender_idx").on(t.tenderId, t.vendorOrgId)],
);

export const threadMessages = pgTable(
  "thread_messages",
  {
    id: id(),
    threadId: text("thread_id")
      .notNull()
      .references(() => threads.id),
    authorId: text("author_id")
      .notNull()
      .references(() => users.id),
    authorLabel: text("author_label").notNull(),
    body: text("body").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("thread_messages_thread_idx").on(t.threadId)],
);

export const EVIDENCE_STATUSES = ["verified", "contradicted", "inconclusive"] as const;
export type EvidenceStatus = (typeof EVIDENCE_STATUSES)[number];

/** A lab run: x errors in N bits or frames at a stated channel condition. */
export const evidenceRuns = pgTable(
  "evidence_runs",
  {
    id: id(),
    claimId: text("claim_id")
      .notNull()
      .references(() => claims.id),
    tenderId: tenderRef(),
    vendorOrgId: vendorRef(),
    channelValue: doublePrecision("channel_value").notNull(),
    unit: text("unit").$type<"bits" | "frames">().notNull(),
    trials: doublePrecision("trials").notNull(),
    errors: doublePrecision("errors").notNull(),
    confidence: doublePrecision("confidence").notNull(),
    lower: doublePrecision("lower").notNull(),
    upper: doublePrecision("upper").notNull(),
    /** What the run counts for against the claim, after the channel rule (see lib/review/evidence). */
    status: text("status").$type<EvidenceStatus>().notNull(),
    /** The run's channel against the claim's, and what follows from it, in words. */
    finding: text("finding").notNull().default(""),
    errorFreeTrialsNeeded: doublePrecision("error_free_trials_needed"),
    source: text("source").$type<"manual" | "csv">().notNull().default("manual"),
    note: text("note").notNull().default(""),
    recordedBy: text("recorded_by")
      .notNull()
      .references(() => users.id),
    recordedAt: createdAt(),
  },
  (t) => [index("evidence_claim_idx").on(t.claimId), oneOf("evidence_status_check", t.status, EVIDENCE_STATUSES)],
);

/** One row per engineer who signed; a safety-relevant tender needs two before it moves on. */
export const technicalSignoffs = pgTable(
  "technical_signoffs",
  {
    tenderId: text("tender_id")
      .notNull()
      .references(() => tenders.id),
    signedBy: text("signed_by")
      .notNull()
      .references(() => users.id),
    statement: text("statement").notNull(),
    signedAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.tenderId, t.signedBy] })],
);

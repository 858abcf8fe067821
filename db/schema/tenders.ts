import { sql } from "drizzle-orm";
import { boolean, doublePrecision, index, integer, jsonb, numeric, pgTable, primaryKey, text, timestamp, uniqueIndex } from "drizzle-orm/pg-core";
import type { TenderState } from "@/policies/vocabulary";
import { id, createdAt, oneOf, updatedAt } from "./columns";
import { organisations, users } from "./people";

import { TENDER_STATES } from "@/policies/vocabulary";

export { TENDER_STATES };
export type { TenderState };

import type { ChannelModel } from "@/lib/bounds/vocabulary";
export type { ChannelModel };
export type NoticeDisclosure = "rank" | "rank-and-scores";
/**
 * A biawgn point stated as a receiver sees it: the input level (dBm, in `value`) at which the
 * buyer needs the packet error rate `targetPer` for `payloadBits`-bit packets at `bitRate`
 * information bits per second.
 */
export interface SensitivityPoint {
  bitRate: number;
  payloadBits: number;
  targetPer: number;
}
/**
 * One channel condition the buyer cares about: p for bsc, e for bec, Eb/N0 in dB for biawgn,
 * or, for biawgn with `sensitivity`, an input level in dBm.
 */
export interface OperatingPoint {
  label: string;
  value: number;
  sensitivity?: SensitivityPoint | null;
}
export interface ScoringWeights {
  technical: number;
  evidence: number;
  price: number;
  leadTime: number;
  warranty: number;
}

export const tenders = pgTable(
  "tenders",
  {
    id: id(),
    reference: text("reference").notNull().unique(),
    title: text("title").notNull(),
    description: text("description").notNull().default(""),
    state: text("state").$type<TenderState>().notNull().default("draft"),
    channelModel: text("channel_model").$type<ChannelModel>().notNull(),
    operatingPoints: jsonb("operating_points").$type<OperatingPoint[]>().notNull(),
    targetMetric: text("target_metric").$type<"bler" | "ber">().notNull(),
    targetValue: numeric("target_value", { mode: "number" }).notNull(),
    maxFrameBits: integer("max_frame_bits"),
    /** The receiver noise figure (dB) judged for plausibility where a vendor states none (sensitivity points). */
    assumedNoiseFigureDb: doublePrecision("assumed_noise_figure_db").notNull().default(6),
    quantity: integer("quantity").notNull(),
    currency: text("currency").notNull(),
    weights: jsonb("weights").$type<ScoringWeights>().notNull(),
    impossibleRule: text("impossible_rule").$type<"disqualify" | "penalty">().notNull().default("disqualify"),
    impossiblePenalty: numeric("impossible_penalty", { mode: "number" }).notNull().default(0),
    /** The radios serve a safety use: every accepted claim needs a verifying lab run, and two engineers sign. */
    safetyRelevant: boolean("safety_relevant").notNull().default(false),
    /** What the award and regret notices disclose: own rank and the winner's name, or also scores. */
    noticeDisclosure: text("notice_disclosure").$type<NoticeDisclosure>().notNull().default("rank"),
    /** Days after the award during which vendors may object; the award is final when they end. */
    standstillDays: integer("standstill_days").notNull().default(10),
    closesAt: timestamp("closes_at", { withTimezone: true }).notNull(),
    closesZone: text("closes_zone").notNull().default("UTC"),
    openedAt: timestamp("opened_at", { withTimezone: true }),
    technicalSignedAt: timestamp("technical_signed_at", { withTimezone: true }),
    envelopesOpenedAt: timestamp("envelopes_opened_at", { withTimezone: true }),
    awardedAt: timestamp("awarded_at", { withTimezone: true }),
    cancelReason: text("cancel_reason"),
    /** Cancelled before it reached its closing time: its offers were never unsealed and stay sealed to the buying side. */
    cancelledSealed: boolean("cancelled_sealed").notNull().default(false),
    createdBy: text("created_by")
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index("tenders_state_idx").on(t.state),
    // The Tenders list's order (newest first), so that a page is read from the index.
    index("tenders_list_order_idx").on(t.createdAt.desc().nullsFirst(), t.reference),
    oneOf("tenders_state_check", t.state, TENDER_STATES),
  ],
);

export const tenderInvitations = pgTable(
  "tender_invitations",
  {
    tenderId: text("tender_id")
      .notNull()
      .references(() => tenders.id),
    organisationId: text("organisation_id")
      .notNull()
      .references(() => organisations.id),
    invitedAt: createdAt(),
  },
  // By organisation too: a vendor's list asks which tenders invite its organisation.
  (t) => [primaryKey({ columns: [t.tenderId, t.organisationId] }), index("tender_invitations_org_idx").on(t.organisationId, t.tenderId)],
);

/** Conflict-of-interest declarations: one per person and tender, listing the vendors they are conflicted with. */
export const declarations = pgTable(
  "declarations",
  {
    id: id(),
    tenderId: text("tender_id")
      .notNull()
      .references(() => tenders.id),
    userId: text("user_id")
      .notNull()
      .references(() => users.id),
    conflictedOrgIds: jsonb("conflicted_org_ids")
      .$type<string[]>()
      .notNull()
      .default(sql`'[]'::jsonb`),
    statement: text("statement").notNull().default(""),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("declarations_tender_user_idx").on(t.tenderId, t.userId)],
);

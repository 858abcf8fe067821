import { sql } from "drizzle-orm";
import {
  bigserial,
  boolean,
  index,
  integer,
  jsonb,
  numeric,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
} from "drizzle-orm/pg-core";

const id = () =>
  text("id")
    .primaryKey()
    .$defaultFn(() => crypto.randomUUID());
const createdAt = () => timestamp("created_at", { withTimezone: true }).notNull().defaultNow();
const updatedAt = () =>
  timestamp("updated_at", { withTimezone: true })
    .notNull()
    .defaultNow()
    .$onUpdate(() => new Date());

// --- organisations and people -------------------------------------------------------------

export const ORGANISATION_KINDS = ["buyer", "vendor"] as const;
export type OrganisationKind = (typeof ORGANISATION_KINDS)[number];

export const organisations = pgTable("organisations", {
  id: id(),
  name: text("name").notNull().unique(),
  kind: text("kind").$type<OrganisationKind>().notNull(),
  country: text("country"),
  createdAt: createdAt(),
});

// The four tables below follow better-auth's core schema (user, session, account, verification);
// its schema CLI needs Node 22, so they are written here by hand.
export const users = pgTable(
  "user",
  {
    id: id(),
    name: text("name").notNull(),
    email: text("email").notNull().unique(),
    emailVerified: boolean("email_verified").notNull().default(false),
    image: text("image"),
    organisationId: text("organisation_id")
      .notNull()
      .references(() => organisations.id),
    active: boolean("active").notNull().default(true),
    // The largest award value this person may approve, in the tender currency (approvers only).
    approvalLimit: numeric("approval_limit", { precision: 16, scale: 2, mode: "number" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("user_organisation_idx").on(t.organisationId)],
);

export const sessions = pgTable(
  "session",
  {
    id: id(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    token: text("token").notNull().unique(),
    ipAddress: text("ip_address"),
    userAgent: text("user_agent"),
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("session_user_idx").on(t.userId)],
);

export const accounts = pgTable("account", {
  id: id(),
  accountId: text("account_id").notNull(),
  providerId: text("provider_id").notNull(),
  userId: text("user_id")
    .notNull()
    .references(() => users.id, { onDelete: "cascade" }),
  accessToken: text("access_token"),
  refreshToken: text("refresh_token"),
  idToken: text("id_token"),
  accessTokenExpiresAt: timestamp("access_token_expires_at", { withTimezone: true }),
  refreshTokenExpiresAt: timestamp("refresh_token_expires_at", { withTimezone: true }),
  scope: text("scope"),
  password: text("password"),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

export const verifications = pgTable("verification", {
  id: id(),
  identifier: text("identifier").notNull(),
  value: text("value").notNull(),
  expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

export const ROLE_NAMES = ["admin", "buyer", "engineer", "approver", "vendor"] as const;
export type RoleName = (typeof ROLE_NAMES)[number];

export const userRoles = pgTable(
  "user_roles",
  {
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: text("role").$type<RoleName>().notNull(),
    grantedAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.role] })],
);

// --- tenders ------------------------------------------------------------------------------

export const TENDER_STATES = [
  "draft",
  "open",
  "technical",
  "commercial",
  "approval",
  "awarded",
  "cancelled",
] as const;
export type TenderState = (typeof TENDER_STATES)[number];

export type ChannelModel = "bsc" | "bec" | "biawgn";
/** One channel condition the buyer cares about: p for bsc, e for bec, Eb/N0 in dB for biawgn. */
export interface OperatingPoint {
  label: string;
  value: number;
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
    quantity: integer("quantity").notNull(),
    currency: text("currency").notNull(),
    weights: jsonb("weights").$type<ScoringWeights>().notNull(),
    impossibleRule: text("impossible_rule").$type<"disqualify" | "penalty">().notNull().default("disqualify"),
    impossiblePenalty: numeric("impossible_penalty", { mode: "number" }).notNull().default(0),
    closesAt: timestamp("closes_at", { withTimezone: true }).notNull(),
    closesZone: text("closes_zone").notNull().default("UTC"),
    openedAt: timestamp("opened_at", { withTimezone: true }),
    cancelReason: text("cancel_reason"),
    createdBy: text("created_by")
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("tenders_state_idx").on(t.state)],
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
  (t) => [primaryKey({ columns: [t.tenderId, t.organisationId] })],
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
    conflictedOrgIds: jsonb("conflicted_org_ids").$type<string[]>().notNull().default(sql`'[]'::jsonb`),
    statement: text("statement").notNull().default(""),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("declarations_tender_user_idx").on(t.tenderId, t.userId)],
);

// --- the ledger ---------------------------------------------------------------------------

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
  (t) => [index("ledger_tender_idx").on(t.tenderId)],
);

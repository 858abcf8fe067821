import { sql } from "drizzle-orm";
import { doublePrecision, index, integer, jsonb, numeric, pgTable, text, timestamp, uniqueIndex } from "drizzle-orm/pg-core";
import { tenderRef, vendorRef } from "./refs";
import { id, createdAt, oneOf } from "./columns";
import { users } from "./people";
import type { RadioClaim } from "@/lib/offers/radio";
import { VERDICTS, type Verdict } from "@/lib/bounds/vocabulary";

export const OFFER_STATUSES = ["submitted", "superseded", "withdrawn"] as const;
export type OfferStatus = (typeof OFFER_STATUSES)[number];
export interface PriceBreak {
  minQuantity: number;
  unitPrice: number;
}

/**
 * One row per submitted version: a resubmission supersedes the previous row, nothing is deleted.
 * The sealed envelope (unit price, currency, lead time, warranty, price breaks) lives on the row;
 * policies/ decide who may read those fields.
 */
export const offers = pgTable(
  "offers",
  {
    id: id(),
    tenderId: tenderRef(),
    vendorOrgId: vendorRef(),
    version: integer("version").notNull(),
    status: text("status").$type<OfferStatus>().notNull().default("submitted"),
    moduleName: text("module_name").notNull(),
    partNumber: text("part_number").notNull(),
    codeFamily: text("code_family").notNull(),
    decision: text("decision").$type<"hard" | "soft">().notNull(),
    n: integer("n"),
    k: integer("k"),
    rate: doublePrecision("rate"),
    overhead: doublePrecision("overhead"),
    unitPrice: numeric("unit_price", { precision: 14, scale: 2, mode: "number" }).notNull(),
    currency: text("currency").notNull(),
    leadTimeWeeks: integer("lead_time_weeks").notNull(),
    warrantyMonths: integer("warranty_months").notNull(),
    priceBreaks: jsonb("price_breaks")
      .$type<PriceBreak[]>()
      .notNull()
      .default(sql`'[]'::jsonb`),
    submittedBy: text("submitted_by")
      .notNull()
      .references(() => users.id),
    submittedAt: timestamp("submitted_at", { withTimezone: true }).notNull().defaultNow(),
    withdrawnAt: timestamp("withdrawn_at", { withTimezone: true }),
  },
  (t) => [
    uniqueIndex("offers_version_idx").on(t.tenderId, t.vendorOrgId, t.version),
    index("offers_tender_idx").on(t.tenderId),
    oneOf("offers_status_check", t.status, OFFER_STATUSES),
  ],
);

export const CLAIM_METRICS = ["bler", "ber", "ncg"] as const;
export type ClaimMetric = (typeof CLAIM_METRICS)[number];
export { VERDICTS, type Verdict };

/** One claim per operating point of the tender, with the engine's verdict stored beside it. */
export const claims = pgTable(
  "claims",
  {
    id: id(),
    offerId: text("offer_id")
      .notNull()
      .references(() => offers.id),
    tenderId: tenderRef(),
    vendorOrgId: vendorRef(),
    pointIndex: integer("point_index").notNull(),
    pointLabel: text("point_label").notNull(),
    /** The operating point's channel condition, in the tender's unit (p, e, or Eb/N0 dB). */
    channelValue: doublePrecision("channel_value").notNull(),
    metric: text("metric").$type<ClaimMetric>().notNull(),
    /** The claimed residual error (BER or BLER), or the net coding gain in dB for metric "ncg". */
    value: doublePrecision("value").notNull(),
    /** For "ncg" claims: the output BER at which the gain is stated. */
    ncgOutputBer: doublePrecision("ncg_output_ber"),
    verdict: text("verdict").$type<Verdict>().notNull(),
    result: jsonb("result").$type<Record<string, unknown>>().notNull(),
    /** A sensitivity claim (and its waterfall curve, each point judged), on a point stated in dBm; null otherwise. */
    radio: jsonb("radio").$type<RadioClaim>(),
    engineVersion: text("engine_version").notNull(),
    evaluatedAt: timestamp("evaluated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("claims_offer_idx").on(t.offerId), index("claims_tender_idx").on(t.tenderId), oneOf("claims_verdict_check", t.verdict, VERDICTS)],
);

export const documents = pgTable(
  "documents",
  {
    id: id(),
    offerId: text("offer_id").references(() => offers.id),
    tenderId: tenderRef(),
    vendorOrgId: vendorRef(),
    kind: text("kind").$type<"datasheet" | "test-report">().notNull(),
    fileName: text("file_name").notNull(),
    contentType: text("content_type").notNull(),
    size: integer("size").notNull(),
    sha256: text("sha256").notNull(),
    storageKey: text("storage_key").notNull().unique(),
    uploadedBy: text("uploaded_by")
      .notNull()
      .references(() => users.id),
    uploadedAt: createdAt(),
  },
  (t) => [index("documents_tender_idx").on(t.tenderId, t.vendorOrgId)],
);

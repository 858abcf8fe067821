import { z } from "zod";
import { isValidZone, LOCAL_DATE_TIME, localTimeExists } from "@/lib/tenders/closing";
import { TENDER_STATES } from "@/policies/vocabulary";
import { optionalChoice, optionalFilter, pagingSchema } from "./paging";

import { CHANNEL_MODELS, type ChannelModel as ChannelModelName } from "@/lib/bounds/vocabulary";

export { CHANNEL_MODELS, type ChannelModelName };

/** The channel condition each model accepts at an operating point, with its words for the form. */
export const CONDITION_RANGES: Record<ChannelModelName, { min: number; max: number; minOpen: boolean; maxOpen: boolean; words: string }> = {
  bsc: { min: 0, max: 0.5, minOpen: true, maxOpen: false, words: "raw BER p must be above 0 and at most 0.5" },
  bec: { min: 0, max: 1, minOpen: true, maxOpen: true, words: "erasure probability e must be between 0 and 1" },
  biawgn: { min: -5, max: 20, minOpen: false, maxOpen: false, words: "Eb/N0 must be from -5 to 20 dB" },
};

export function conditionInRange(model: ChannelModelName, value: number): boolean {
  const r = CONDITION_RANGES[model];
  if (!Number.isFinite(value)) return false;
  const aboveMin = r.minOpen ? value > r.min : value >= r.min;
  const belowMax = r.maxOpen ? value < r.max : value <= r.max;
  return aboveMin && belowMax;
}

/** What notices disclose: each vendor's own rank and the winner's name; or, in addition, the scores. */
export const NOTICE_DISCLOSURES = ["rank", "rank-and-scores"] as const;
export const DEFAULT_STANDSTILL_DAYS = 10;

const num = (what: string) => z.number({ error: `Enter ${what} as a number.` });

/** A biawgn point stated as an input level: the buyer's bit rate, payload and packet error rate. */
export const sensitivityPointSchema = z.object({
  bitRate: num("the information bit rate in bit/s").gt(0, "The information bit rate must be above 0 bit/s.").max(1e12, "At most 1e12 bit/s."),
  payloadBits: num("the payload in bits").int("A whole number of payload bits.").min(1, "At least 1 payload bit.").max(10_000_000, "At most 10,000,000 bits."),
  targetPer: num("the target packet error rate").gt(0, "The packet error rate must be above 0.").lt(1, "The packet error rate must be below 1."),
});

/** The input level range a sensitivity point accepts (dBm). */
export const SENSITIVITY_RANGE = { min: -200, max: 30, words: "input level must be from -200 to +30 dBm" } as const;
/** The receiver noise figure a buyer may assume for vendors that state none (dB). */
export const DEFAULT_ASSUMED_NF_DB = 6;

export const operatingPointSchema = z.object({
  label: z.string().trim().min(1, "Name the operating point.").max(80),
  value: num("the channel condition"),
  /** Present on a biawgn point stated as an input level in dBm (then `value` is that level). */
  sensitivity: sensitivityPointSchema.nullable().optional(),
});

export const WEIGHT_KEYS = ["technical", "evidence", "price", "leadTime", "warranty"] as const;

export const weightsSchema = z
  .object(
    Object.fromEntries(WEIGHT_KEYS.map((k) => [k, num("the weight").min(0, "Weights are zero or more.").max(1000)])) as Record<
      (typeof WEIGHT_KEYS)[number],
      z.ZodNumber
    >,
  )
  .refine((w) => WEIGHT_KEYS.reduce((sum, k) => sum + w[k], 0) > 0, "At least one weight must be above zero.");

/** The fields of a tender's requirements, each checked alone (the PATCH body is any part of it). */
export const tenderFieldsSchema = z.object({
  title: z.string().trim().min(3, "Give the tender a title.").max(160),
  description: z.string().trim().max(4000),
  channelModel: z.enum(CHANNEL_MODELS, { error: "Choose a channel model." }),
  operatingPoints: z.array(operatingPointSchema).max(12, "At most 12 operating points."),
  targetMetric: z.enum(["bler", "ber"], { error: "Choose BLER or BER." }),
  targetValue: num("the residual error").gt(0, "Must be above 0.").lt(1, "Must be below 1."),
  maxFrameBits: z.number().int("Whole bits.").positive("Must be at least 1 bit.").max(10_000_000).nullable(),
  /** Plausibility of sensitivity claims is judged at this noise figure where the vendor states none. */
  assumedNoiseFigureDb: num("the assumed noise figure in dB").min(0, "A noise figure is at least 0 dB (an ideal receiver).").max(40, "At most 40 dB."),
  quantity: num("the quantity").int("A whole number of units.").positive("At least one unit.").max(100_000_000),
  currency: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{3}$/, "Three letters (ISO 4217), e.g. EUR."),
  weights: weightsSchema,
  impossibleRule: z.enum(["disqualify", "penalty"], { error: "Choose what a confirmed impossible claim costs." }),
  impossiblePenalty: num("the penalty").min(0, "Zero or more points.").max(100, "At most 100 points."),
  /** The radios serve a safety use: verifying lab runs for every accepted claim, two engineers sign. */
  safetyRelevant: z.boolean({ error: "Say whether the tender is safety-relevant (true or false)." }),
  noticeDisclosure: z.enum(NOTICE_DISCLOSURES, { error: "Choose what the award notices tell the vendors." }),
  standstillDays: num("the standstill period").int("Whole days.").min(1, "At least one day.").max(60, "At most 60 days."),
  closesLocal: z.string().regex(LOCAL_DATE_TIME, "Enter the closing date and time."),
  closesZone: z.string().refine(isValidZone, "Choose a time zone."),
  invitedOrgIds: z
    .array(z.string().min(1))
    .max(50)
    .refine((ids) => new Set(ids).size === ids.length, "Each organisation once."),
});

type Fields = z.infer<typeof tenderFieldsSchema>;

/** The checks that read several fields at once. */
function crossChecks(value: Fields, ctx: z.RefinementCtx) {
  value.operatingPoints.forEach((point, i) => {
    if (point.sensitivity) {
      if (value.channelModel !== "biawgn")
        ctx.addIssue({
          code: "custom",
          path: ["operatingPoints", i, "sensitivity"],
          message: "An input level in dBm is stated only on a BI-AWGN (soft-decision) tender.",
        });
      else if (!(point.value >= SENSITIVITY_RANGE.min && point.value <= SENSITIVITY_RANGE.max))
        ctx.addIssue({ code: "custom", path: ["operatingPoints", i, "value"], message: `Out of range: ${SENSITIVITY_RANGE.words}.` });
      return;
    }
    if (!conditionInRange(value.channelModel, point.value)) {
      ctx.addIssue({ code: "custom", path: ["operatingPoints", i, "value"], message: `Out of range: ${CONDITION_RANGES[value.channelModel].words}.` });
    }
  });
  const labels = value.operatingPoints.map((p) => p.label.toLowerCase());
  labels.forEach((label, i) => {
    if (labels.indexOf(label) !== i)
      ctx.addIssue({ code: "custom", path: ["operatingPoints", i, "label"], message: "Each operating point needs its own name." });
  });
  if (value.impossibleRule === "penalty" && value.impossiblePenalty <= 0) {
    ctx.addIssue({ code: "custom", path: ["impossiblePenalty"], message: "A penalty needs some points." });
  }
  if (LOCAL_DATE_TIME.test(value.closesLocal) && isValidZone(value.closesZone) && !localTimeExists(value.closesLocal, value.closesZone)) {
    ctx.addIssue({ code: "custom", path: ["closesLocal"], message: "That time does not exist in this zone (the clocks go forward)." });
  }
}

/** A whole draft, as the form and POST /api/v1/tenders send it; the optional parts have defaults. */
export const tenderInputSchema = tenderFieldsSchema
  .extend({
    description: tenderFieldsSchema.shape.description.default(""),
    maxFrameBits: tenderFieldsSchema.shape.maxFrameBits.default(null),
    assumedNoiseFigureDb: tenderFieldsSchema.shape.assumedNoiseFigureDb.default(DEFAULT_ASSUMED_NF_DB),
    impossibleRule: tenderFieldsSchema.shape.impossibleRule.default("disqualify"),
    impossiblePenalty: tenderFieldsSchema.shape.impossiblePenalty.default(0),
    safetyRelevant: tenderFieldsSchema.shape.safetyRelevant.default(false),
    invitedOrgIds: tenderFieldsSchema.shape.invitedOrgIds.default([]),
    noticeDisclosure: tenderFieldsSchema.shape.noticeDisclosure.default("rank"),
    standstillDays: tenderFieldsSchema.shape.standstillDays.default(DEFAULT_STANDSTILL_DAYS),
  })
  .superRefine(crossChecks);
export type TenderInput = z.infer<typeof tenderInputSchema>;
/** What the form holds before parsing (the currency may still be lower case). */
export type TenderFormValues = z.input<typeof tenderInputSchema>;

/** PATCH: any of the fields, no defaults; the server checks the merged draft with tenderInputSchema. */
export const tenderPatchSchema = tenderFieldsSchema.partial().refine((v) => Object.keys(v).length > 0, "Send at least one field to change.");
export type TenderPatch = z.infer<typeof tenderPatchSchema>;

export const cancelTenderSchema = z.object({
  reason: z.string().trim().min(10, "Say why, in at least 10 characters.").max(2000),
});
export type CancelTenderInput = z.infer<typeof cancelTenderSchema>;

/** The Tenders list's filters, as they appear in the URL: a state, and text in the reference or title. */
export const tenderListFiltersSchema = z.object({
  state: optionalChoice(TENDER_STATES, "state"),
  q: optionalFilter(),
});
export type TenderListFilters = z.infer<typeof tenderListFiltersSchema>;
/** GET /api/v1/tenders: filters and a page. */
export const tenderListQuerySchema = tenderListFiltersSchema.extend(pagingSchema.shape);

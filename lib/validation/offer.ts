import { z } from "zod";
import { MAX_N } from "@/lib/bounds/schema";

// The offer form's schema: the vendor's form and the API share it, so both refuse the same input.

const PROBABILITY = "a probability strictly between 0 and 1 (e.g. 1e-5)";

const optionalNumber = (schema: z.ZodNumber) => schema.nullable().optional();

export const offerCodeSchema = z
  .object({
    family: z.string().trim().min(1, "Name the code family (e.g. LDPC, BCH, RS, polar).").max(60),
    decision: z.enum(["hard", "soft"], { error: () => 'Choose "hard" or "soft" decision.' }),
    n: optionalNumber(z.number().int("Must be a whole number of bits.").min(1, "Must be at least 1 bit.").max(MAX_N, `Must be at most ${MAX_N} bits.`)),
    k: optionalNumber(z.number().int("Must be a whole number of bits.").min(1, "Must be at least 1 bit.")),
    rate: optionalNumber(z.number().gt(0, "Must be above 0.").max(1, "Must be at most 1.")),
    overhead: optionalNumber(z.number().min(0, "Must be at least 0 (n/k - 1).").max(1000, "Must be at most 1000.")),
  })
  .superRefine((code, ctx) => {
    const has = (v: number | null | undefined) => v !== null && v !== undefined;
    const forms = [has(code.k), has(code.rate), has(code.overhead)].filter(Boolean).length;
    if (forms !== 1) {
      ctx.addIssue({ code: "custom", path: ["k"], message: "Give exactly one of: k (with n), a code rate, or an overhead." });
    } else if (has(code.k) && !has(code.n)) {
      ctx.addIssue({ code: "custom", path: ["n"], message: "Give the block length n with k." });
    } else if (has(code.k) && has(code.n) && code.k! > code.n!) {
      ctx.addIssue({ code: "custom", path: ["k"], message: `k must be at most n (${code.n}): a code cannot carry more information bits than it sends.` });
    }
  });

export const offerClaimSchema = z
  .object({
    pointIndex: z.number().int().min(0),
    metric: z.enum(["bler", "ber", "ncg"], { error: () => 'Choose BLER, BER or net coding gain.' }),
    value: z.number({ error: () => "Enter the claimed value." }),
    ncgOutputBer: optionalNumber(z.number()),
  })
  .superRefine((claim, ctx) => {
    if (claim.metric === "ncg") {
      if (!(claim.value > 0 && claim.value <= 40)) {
        ctx.addIssue({ code: "custom", path: ["value"], message: "A net coding gain is in dB, above 0 and at most 40." });
      }
      const out = claim.ncgOutputBer;
      if (out === null || out === undefined || !(out > 0 && out < 1)) {
        ctx.addIssue({ code: "custom", path: ["ncgOutputBer"], message: `Give the output BER at which the gain is stated: ${PROBABILITY}.` });
      }
    } else if (!(claim.value > 0 && claim.value < 1)) {
      ctx.addIssue({ code: "custom", path: ["value"], message: `The claimed ${claim.metric.toUpperCase()} must be ${PROBABILITY}.` });
    }
  });

export const priceBreakSchema = z.object({
  minQuantity: z.number({ error: () => "Enter the quantity." }).int("A whole number of units.").min(1, "At least 1 unit."),
  unitPrice: z.number({ error: () => "Enter the unit price." }).gt(0, "Must be above 0.").max(1e9),
});

export const envelopeSchema = z.object({
  unitPrice: z.number({ error: () => "Enter the unit price." }).gt(0, "The unit price must be above 0.").max(1e9),
  currency: z.string().trim().toUpperCase().regex(/^[A-Z]{3}$/, "A three-letter currency code, e.g. EUR."),
  leadTimeWeeks: z.number({ error: () => "Enter the lead time in weeks." }).int("Whole weeks.").min(0, "At least 0 weeks.").max(520),
  warrantyMonths: z.number({ error: () => "Enter the warranty in months." }).int("Whole months.").min(0, "At least 0 months.").max(240),
  priceBreaks: z
    .array(priceBreakSchema)
    .max(20, "At most 20 price breaks.")
    .superRefine((breaks, ctx) => {
      for (let i = 1; i < breaks.length; i++) {
        if (breaks[i].minQuantity <= breaks[i - 1].minQuantity) {
          ctx.addIssue({ code: "custom", path: [i, "minQuantity"], message: "Price breaks go in ascending order of quantity." });
        }
      }
    }),
});

export const offerSchema = z.object({
  moduleName: z.string().trim().min(1, "Name the module.").max(120),
  partNumber: z.string().trim().min(1, "Give the part number.").max(80),
  code: offerCodeSchema,
  claims: z.array(offerClaimSchema).min(1, "Give one claim per operating point.").max(16),
  envelope: envelopeSchema,
});

export type OfferInput = z.infer<typeof offerSchema>;
export type OfferFormValues = z.input<typeof offerSchema>;

export const documentKindSchema = z.enum(["datasheet", "test-report"], {
  error: () => 'The kind must be "datasheet" or "test-report".',
});
export type DocumentKind = z.infer<typeof documentKindSchema>;

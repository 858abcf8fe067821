import { z } from "zod";
import { MAX_N } from "@/lib/bounds/schema";
import { CURVE_METRICS, CURVE_UNITS, MAX_CURVE_POINTS, type CurveMetric, type CurveUnit } from "@/lib/offers/radio";

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

/** One point of a waterfall curve: Eb/N0 (dB) or input level (dBm) against BLER, BER or PER. */
export const curvePointSchema = z
  .object({
    x: z.number({ error: () => "Enter the point's Eb/N0 (dB) or input level (dBm) as a number." }),
    unit: z.enum(CURVE_UNITS as [CurveUnit, ...CurveUnit[]], { error: () => 'The unit must be "ebn0Db" (Eb/N0 in dB) or "dBm" (input level).' }),
    metric: z.enum(CURVE_METRICS as [CurveMetric, ...CurveMetric[]], { error: () => 'The metric must be "bler", "ber" or "per".' }),
    value: z
      .number({ error: () => "Enter the error rate." })
      .gt(0, `Must be ${PROBABILITY}.`)
      .lt(1, `Must be ${PROBABILITY}.`),
  })
  .superRefine((p, ctx) => {
    const [lo, hi, words] = p.unit === "dBm" ? [-250, 30, "an input level from -250 to +30 dBm"] : [-50, 50, "an Eb/N0 from -50 to 50 dB"];
    if (!(p.x >= lo && p.x <= hi)) ctx.addIssue({ code: "custom", path: ["x"], message: `Out of range: ${words}.` });
  });

/** A receiver sensitivity claim at a point stated in dBm: the level, optionally the noise figure, modulation, n and k, and a curve. */
export const sensitivityClaimSchema = z
  .object({
    dbm: z
      .number({ error: () => "Enter the sensitivity in dBm." })
      .min(-250, "Must be at least -250 dBm.")
      .max(30, "A sensitivity must be at most +30 dBm."),
    noiseFigureDb: optionalNumber(z.number().min(0, "A noise figure is at least 0 dB (an ideal receiver).").max(40, "At most 40 dB.")),
    modulation: z
      .enum(["bpsk", "qpsk"], { error: () => 'Choose "bpsk" or "qpsk" (Gray-mapped).' })
      .nullable()
      .optional(),
    n: optionalNumber(z.number().int("Must be a whole number of bits.").min(1, "Must be at least 1 bit.").max(MAX_N, `Must be at most ${MAX_N} bits.`)),
    k: optionalNumber(z.number().int("Must be a whole number of bits.").min(1, "Must be at least 1 bit.")),
    curve: z.array(curvePointSchema).max(MAX_CURVE_POINTS, `At most ${MAX_CURVE_POINTS} curve points.`).nullable().optional(),
  })
  .superRefine((s, ctx) => {
    const has = (v: number | null | undefined) => v !== null && v !== undefined;
    if (has(s.n) !== has(s.k)) ctx.addIssue({ code: "custom", path: [has(s.n) ? "k" : "n"], message: "Give the code's n and k together, or neither." });
    else if (has(s.n) && s.k! > s.n!) ctx.addIssue({ code: "custom", path: ["k"], message: `k must be at most n (${s.n}).` });
  });

export const offerClaimSchema = z
  .object({
    pointIndex: z.number().int().min(0),
    metric: z.enum(["bler", "ber", "ncg"], { error: () => "Choose BLER, BER or net coding gain." }),
    value: z.number({ error: () => "Enter the claimed value." }),
    ncgOutputBer: optionalNumber(z.number()),
    /** Only at a point stated in dBm: then metric is "bler" (the packet error rate) and value the PER the sensitivity is stated at. */
    sensitivity: sensitivityClaimSchema.nullable().optional(),
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
    } else if (claim.sensitivity && claim.metric !== "bler") {
      ctx.addIssue({
        code: "custom",
        path: ["metric"],
        message: 'A sensitivity is stated at a packet error rate: use metric "bler" (the PER of the payload packet).',
      });
    } else if (!(claim.value > 0 && claim.value < 1)) {
      ctx.addIssue({ code: "custom", path: ["value"], message: `The claimed ${claim.metric.toUpperCase()} must be ${PROBABILITY}.` });
    }
  });

export const priceBreakSchema = z.object({
  minQuantity: z
    .number({ error: () => "Enter the quantity." })
    .int("A whole number of units.")
    .min(1, "At least 1 unit."),
  unitPrice: z
    .number({ error: () => "Enter the unit price." })
    .gt(0, "Must be above 0.")
    .max(1e9),
});

export const envelopeSchema = z.object({
  unitPrice: z
    .number({ error: () => "Enter the unit price." })
    .gt(0, "The unit price must be above 0.")
    .max(1e9),
  currency: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{3}$/, "A three-letter currency code, e.g. EUR."),
  leadTimeWeeks: z
    .number({ error: () => "Enter the lead time in weeks." })
    .int("Whole weeks.")
    .min(0, "At least 0 weeks.")
    .max(520),
  warrantyMonths: z
    .number({ error: () => "Enter the warranty in months." })
    .int("Whole months.")
    .min(0, "At least 0 months.")
    .max(240),
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

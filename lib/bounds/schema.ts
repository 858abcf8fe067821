// The claim contract shared by the CLI and the HTTP API: zod schemas, inferred types, messages.
import { z } from "zod";

export const MAX_N = 10_000_000;

/** A number field whose messages name the allowed range. */
function num(range: string) {
  return z.number({
    error: (iss) => (iss.input === undefined ? `is required (${range})` : `must be a number (${range})`),
  });
}

const P_RANGE = "a raw bit error rate from 0 to 0.5";
const E_RANGE = "an erasure probability from 0 to below 1";
const DB_RANGE = "dB from -50 to 50";
const NCG_RANGE = "a net coding gain in dB from -20 to 40";

const channelSchema = z.discriminatedUnion(
  "model",
  [
    z.object({
      model: z.literal("bsc"),
      p: num(P_RANGE).min(0, `must be at least 0 (${P_RANGE})`).max(0.5, `must be at most 0.5 (${P_RANGE})`).optional(),
      ncgDb: num(NCG_RANGE).min(-20, `must be at least -20 (${NCG_RANGE})`).max(40, `must be at most 40 (${NCG_RANGE})`).optional(),
    }),
    z.object({
      model: z.literal("bec"),
      e: num(E_RANGE).min(0, `must be at least 0 (${E_RANGE})`).lt(1, `must be below 1 (${E_RANGE})`),
    }),
    z.object({
      model: z.literal("biawgn"),
      ebn0Db: num(DB_RANGE).min(-50, `must be at least -50 (${DB_RANGE})`).max(50, `must be at most 50 (${DB_RANGE})`).optional(),
      esn0Db: num(DB_RANGE).min(-50, `must be at least -50 (${DB_RANGE})`).max(50, `must be at most 50 (${DB_RANGE})`).optional(),
      ncgDb: num(NCG_RANGE).min(-20, `must be at least -20 (${NCG_RANGE})`).max(40, `must be at most 40 (${NCG_RANGE})`).optional(),
    }),
  ],
  {
    error: (iss) =>
      iss.input === undefined
        ? 'is required (an object with model "bsc", "bec" or "biawgn")'
        : typeof iss.input === "object" && iss.input !== null
          ? 'must be one of "bsc", "bec", "biawgn"'
          : 'must be an object with model "bsc", "bec" or "biawgn"',
  },
);

const N_RANGE = `an integer from 1 to ${MAX_N}`;
const nField = num(N_RANGE)
  .int(`must be an integer (${N_RANGE})`)
  .min(1, `must be at least 1 (${N_RANGE})`)
  .max(MAX_N, `must be at most ${MAX_N} (${N_RANGE})`);

/** Messages for a missing or mistyped object field. */
function obj(what: string) {
  return { error: (iss: { input?: unknown }) => (iss.input === undefined ? `is required (${what})` : `must be an object (${what})`) };
}

const codeSchema = z.object({
  n: nField.optional(),
  k: num("an integer from 1 to n").int("must be an integer (from 1 to n)").min(1, "must be at least 1 (from 1 to n)").optional(),
  rate: num("a code rate above 0 and at most 1").gt(0, "must be above 0 (a code rate above 0 and at most 1)").max(1, "must be at most 1 (a code rate above 0 and at most 1)").optional(),
  overhead: num("an overhead n/k - 1 from 0 to 1000").min(0, "must be at least 0 (an overhead n/k - 1 from 0 to 1000)").max(1000, "must be at most 1000 (an overhead n/k - 1 from 0 to 1000)").optional(),
}, obj("n and k, or rate, or overhead"));

const targetSchema = z.object({
  metric: z.enum(["bler", "ber"], { error: () => 'must be "bler" or "ber"' }),
  value: num("a probability strictly between 0 and 1").gt(0, "must be above 0 (strictly between 0 and 1)").lt(1, "must be below 1 (strictly between 0 and 1)"),
}, obj('metric "bler" or "ber" and value'));

export const claimSchema = z
  .object({ channel: channelSchema, code: codeSchema, target: targetSchema }, obj("a claim with channel, code and target"))
  .superRefine((c, ctx) => {
    const ch = c.channel as Record<string, unknown>;
    const given = (keys: string[]) => keys.filter((key) => ch[key] !== undefined);
    const wanted = c.channel.model === "bsc" ? ["p", "ncgDb"] : c.channel.model === "biawgn" ? ["ebn0Db", "esn0Db", "ncgDb"] : ["e"];
    if (given(wanted).length !== 1)
      ctx.addIssue({ code: "custom", path: ["channel", wanted[0]], message: `give exactly one of ${wanted.join(", ")}` });
    if (ch.ncgDb !== undefined && c.target.value >= 0.5)
      ctx.addIssue({ code: "custom", path: ["target", "value"], message: "must be below 0.5 with a net coding gain (the coding gain is defined at an output BER below 0.5)" });
    const { n, k, rate, overhead } = c.code;
    const forms = [k !== undefined, rate !== undefined, overhead !== undefined].filter(Boolean).length;
    if (forms !== 1)
      ctx.addIssue({ code: "custom", path: ["code"], message: "give exactly one of k (with n), rate or overhead" });
    else if (k !== undefined && n === undefined)
      ctx.addIssue({ code: "custom", path: ["code", "n"], message: `is required with k (${N_RANGE})` });
    else if (k !== undefined && n !== undefined && k > n)
      ctx.addIssue({ code: "custom", path: ["code", "k"], message: `must be at most n (${n})` });
    else if (n !== undefined && k === undefined) {
      const r = rate ?? 1 / (1 + (overhead ?? 0));
      if (n * r < 1)
        ctx.addIssue({ code: "custom", path: ["code", rate !== undefined ? "rate" : "overhead"], message: `leaves fewer than 1 information bit at n = ${n}` });
    }
  });

export type ClaimInput = z.infer<typeof claimSchema>;

const finding = z.object({
  code: z.string(),
  severity: z.enum(["violation", "gap", "support", "info"]),
  message: z.string(),
  source: z.string(),
});
const bound = z.object({ log10Bler: z.number(), bler: z.number() }).nullable();

export const claimResultSchema = z.object({
  verdict: z.enum(["impossible", "needs-evidence", "plausible"]),
  findings: z.array(finding),
  rate: z.number(),
  capacity: z.number(),
  converse: bound,
  achievable: bound,
  normal: z.object({ rate: z.number(), log10Bler: z.number(), bler: z.number() }).nullable(),
  thresholds: z.object({
    capacity: z.number(),
    shannon: z.number(),
    converse: z.number().nullable(),
    achievable: z.number().nullable(),
    normal: z.number().nullable(),
    unit: z.enum(["p", "e", "ebn0Db", "esn0Db"]),
  }),
  margins: z.object({
    rateGapBits: z.number().nullable(),
    rateGapFraction: z.number().nullable(),
    channelKind: z.enum(["ratio", "dB"]),
    channel: z.object({
      capacity: z.number().nullable(),
      converse: z.number().nullable(),
      achievable: z.number().nullable(),
      normal: z.number().nullable(),
    }),
  }),
  channel: z.object({
    model: z.enum(["bsc", "bec", "biawgn"]),
    p: z.number().optional(),
    e: z.number().optional(),
    esn0Db: z.number().optional(),
    ebn0Db: z.number().optional(),
    ncgDb: z.number().optional(),
  }),
  n: z.number().nullable(),
  k: z.number().nullable(),
  target: z.object({ metric: z.enum(["bler", "ber"]), value: z.number(), log10: z.number() }),
  dispersion: z.number(),
  gallager: z.object({ exponent: z.number(), log10Bler: z.number().nullable() }),
  engineVersion: z.string(),
});

export type ClaimResult = z.infer<typeof claimResultSchema>;

/** One line naming each offending field, e.g. "code.k: must be at most n (1944)". */
export function formatClaimError(error: z.ZodError): string {
  return error.issues
    .map((iss) => `${iss.path.length ? iss.path.map(String).join(".") : "claim"}: ${iss.message}`)
    .join("; ");
}

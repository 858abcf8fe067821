// The claim contract shared by the CLI and the HTTP API: zod schemas, inferred types, messages.
import { z } from "zod";
import { THERMAL_DBM_PER_HZ } from "./thermal";
import { channelModelList, type ChannelModel } from "./vocabulary";

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
const SENS_RANGE = "an input level in dBm from -250 to 30";
const RB_RANGE = "an information bit rate in bit/s from 0.001 to 1e12";
const NF_RANGE = "a noise figure in dB from 0 to 40";

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
      sensitivityDbm: num(SENS_RANGE).min(-250, `must be at least -250 (${SENS_RANGE})`).max(30, `must be at most 30 (${SENS_RANGE})`).optional(),
      bitRate: num(RB_RANGE)
        .gt(0, `must be above 0 (${RB_RANGE})`)
        .min(1e-3, `must be at least 0.001 (${RB_RANGE})`)
        .max(1e12, `must be at most 1e12 (${RB_RANGE})`)
        .optional(),
      noiseFigureDb: num(NF_RANGE).min(0, `must be at least 0 (${NF_RANGE})`).max(40, `must be at most 40 (${NF_RANGE})`).optional(),
      assumedNoiseFigureDb: num(NF_RANGE).min(0, `must be at least 0 (${NF_RANGE})`).max(40, `must be at most 40 (${NF_RANGE})`).optional(),
    }),
  ],
  {
    error: (iss) =>
      iss.input === undefined
        ? `is required (an object with model ${channelModelList()})`
        : typeof iss.input === "object" && iss.input !== null
          ? `must be one of ${channelModelList(", ")}`
          : `must be an object with model ${channelModelList()}`,
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

const codeSchema = z.object(
  {
    n: nField.optional(),
    k: num("an integer from 1 to n").int("must be an integer (from 1 to n)").min(1, "must be at least 1 (from 1 to n)").optional(),
    rate: num("a code rate above 0 and at most 1")
      .gt(0, "must be above 0 (a code rate above 0 and at most 1)")
      .max(1, "must be at most 1 (a code rate above 0 and at most 1)")
      .optional(),
    overhead: num("an overhead n/k - 1 from 0 to 1000")
      .min(0, "must be at least 0 (an overhead n/k - 1 from 0 to 1000)")
      .max(1000, "must be at most 1000 (an overhead n/k - 1 from 0 to 1000)")
      .optional(),
    modulation: z.enum(["bpsk", "qpsk"], { error: () => 'must be "bpsk" or "qpsk" (Gray-mapped)' }).optional(),
  },
  obj("n and k, or rate, or overhead"),
);

const targetSchema = z.object(
  {
    metric: z.enum(["bler", "ber"], { error: () => 'must be "bler" or "ber"' }),
    value: num("a probability strictly between 0 and 1")
      .gt(0, "must be above 0 (strictly between 0 and 1)")
      .lt(1, "must be below 1 (strictly between 0 and 1)"),
  },
  obj('metric "bler" or "ber" and value'),
);

export const claimSchema = z
  .object({ channel: channelSchema, code: codeSchema, target: targetSchema }, obj("a claim with channel, code and target"))
  .superRefine((c, ctx) => {
    const ch = c.channel as Record<string, unknown>;
    const given = (keys: string[]) => keys.filter((key) => ch[key] !== undefined);
    const wanted = c.channel.model === "bsc" ? ["p", "ncgDb"] : c.channel.model === "biawgn" ? ["ebn0Db", "esn0Db", "ncgDb", "sensitivityDbm"] : ["e"];
    if (given(wanted).length !== 1) ctx.addIssue({ code: "custom", path: ["channel", wanted[0]], message: `give exactly one of ${wanted.join(", ")}` });
    const sensitivity = ch.sensitivityDbm !== undefined;
    if (sensitivity && ch.bitRate === undefined)
      ctx.addIssue({ code: "custom", path: ["channel", "bitRate"], message: `is required with sensitivityDbm (${RB_RANGE}: the payload bits per second)` });
    if (sensitivity && typeof ch.bitRate === "number") {
      const s = ch.sensitivityDbm as number;
      const ebn0 = (nf: unknown) => s - THERMAL_DBM_PER_HZ - 10 * Math.log10(ch.bitRate as number) - ((nf as number | undefined) ?? 0);
      if ([ebn0(ch.noiseFigureDb), ebn0(ch.assumedNoiseFigureDb)].some((x) => x < -100 || x > 100))
        ctx.addIssue({
          code: "custom",
          path: ["channel", "sensitivityDbm"],
          message: "with this bit rate and noise figure implies an Eb/N0 outside -100 to 100 dB; check the units (dBm, information bits per second)",
        });
    }
    for (const key of ["bitRate", "noiseFigureDb", "assumedNoiseFigureDb"])
      if (!sensitivity && ch[key] !== undefined)
        ctx.addIssue({ code: "custom", path: ["channel", key], message: "goes only with sensitivityDbm (a receiver sensitivity in dBm)" });
    if (c.code.modulation !== undefined && c.channel.model !== "biawgn")
      ctx.addIssue({ code: "custom", path: ["code", "modulation"], message: 'applies only to the "biawgn" channel' });
    if (ch.ncgDb !== undefined && c.target.value >= 0.5)
      ctx.addIssue({
        code: "custom",
        path: ["target", "value"],
        message: "must be below 0.5 with a net coding gain (the coding gain is defined at an output BER below 0.5)",
      });
    const { n, k, rate, overhead } = c.code;
    const forms = [k !== undefined, rate !== undefined, overhead !== undefined].filter(Boolean).length;
    if (forms !== 1) ctx.addIssue({ code: "custom", path: ["code"], message: "give exactly one of k (with n), rate or overhead" });
    else if (k !== undefined && n === undefined && !(ch.ebn0Db !== undefined || sensitivity))
      ctx.addIssue({
        code: "custom",
        path: ["code", "n"],
        message: `is required with k (${N_RANGE}), except for a BI-AWGN claim in ebn0Db or sensitivityDbm, where k alone is a payload`,
      });
    else if (k !== undefined && n !== undefined && k > n) ctx.addIssue({ code: "custom", path: ["code", "k"], message: `must be at most n (${n})` });
    else if (n !== undefined && k === undefined) {
      const r = rate ?? 1 / (1 + (overhead ?? 0));
      if (n * r < 1)
        ctx.addIssue({ code: "custom", path: ["code", rate !== undefined ? "rate" : "overhead"], message: `leaves fewer than 1 information bit at n = ${n}` });
    }
  });

export type ClaimInput = z.infer<typeof claimSchema>;

/** A channel stated by its model's own parameter: p (BSC), e (BEC) or Eb/N0 in dB (BI-AWGN). */
export const channelAt = (model: ChannelModel, x: number): ClaimInput["channel"] =>
  model === "bsc" ? { model, p: x } : model === "bec" ? { model, e: x } : { model, ebn0Db: x };

export { claimResultSchema, type ClaimResult } from "./result";

/** One line naming each offending field, e.g. "code.k: must be at most n (1944)". */
export function formatClaimError(error: z.ZodError): string {
  return error.issues.map((iss) => `${iss.path.length ? iss.path.map(String).join(".") : "claim"}: ${iss.message}`).join("; ");
}

import { z } from "zod";
import { parseCount, parseDecimal } from "@/lib/numbers";
import { CHANNEL_MODELS } from "@/lib/bounds/vocabulary";

export const EXPLORER_DEFAULTS = {
  bsc: { x: 5e-3, n: 2048, k: 1640 },
  bec: { x: 0.05, n: 1024, k: 900 },
  biawgn: { x: 2, n: 1944, k: 972 },
} as const;

/**
 * A number from the address, read as typed ("0,00001" is a decimal comma; in a count every comma
 * groups thousands); an empty or non-numeric text gets the sentence given, not a validator's message.
 */
const readIn = (parse: (raw: string) => number | null) => (what: string) =>
  z.preprocess((v) => (v === undefined ? undefined : (parse(String(v)) ?? undefined)), z.number({ error: `${what} must be a number` }).optional());
const numberIn = readIn(parseDecimal);
const countIn = readIn(parseCount);

/** Most vendor curve points the explorer overlays (a datasheet waterfall has a handful). */
export const CURVE_MAX_POINTS = 12;
export const CURVE_METRICS = ["bler", "ber", "per"] as const;
export type CurveMetric = (typeof CURVE_METRICS)[number];

/**
 * A vendor's waterfall as typed in the explorer and kept in the address: "Eb/N0:rate" pairs
 * separated by commas or semicolons, e.g. "1.5:1e-2, 2:1e-4". Returns the points or, for the
 * first bad one, what is wrong with it in words.
 */
export function parseCurveText(text: string): { points: { ebn0Db: number; value: number }[] } | { error: string } {
  const parts = text
    .split(/[;,]/)
    .map((p) => p.trim())
    .filter((p) => p !== "");
  if (parts.length > CURVE_MAX_POINTS) return { error: `the vendor curve may have at most ${CURVE_MAX_POINTS} points` };
  const points: { ebn0Db: number; value: number }[] = [];
  for (const [i, part] of parts.entries()) {
    const m = /^(-?[\d.]+(?:e-?\d+)?)\s*:\s*([\d.]+(?:e-?\d+)?)$/i.exec(part);
    const ebn0Db = m ? Number(m[1]) : NaN;
    const value = m ? Number(m[2]) : NaN;
    if (!Number.isFinite(ebn0Db) || !Number.isFinite(value))
      return { error: `vendor curve point ${i + 1} ("${part}") must be written as Eb/N0 in dB, a colon and the error rate, e.g. 2.5:1e-4` };
    if (ebn0Db < -5 || ebn0Db > 20) return { error: `vendor curve point ${i + 1} must have Eb/N0 from -5 to 20 dB` };
    if (!(value > 0 && value < 0.5)) return { error: `vendor curve point ${i + 1} must have an error rate above 0 and below 0.5` };
    points.push({ ebn0Db, value });
  }
  return { points };
}

/** The Bound explorer's view, as it lives in the URL's search parameters. */
export const explorerSchema = z
  .object({
    model: z.enum(CHANNEL_MODELS, { error: "the channel must be hard decision, erasures or soft decision" }).default("bsc"),
    x: numberIn("the channel value"),
    n: countIn("the block length n"),
    k: countIn("the information bits k"),
    target: numberIn("the target BLER"),
    curve: z.string().optional(),
    metric: z.enum(CURVE_METRICS, { error: "the vendor curve's error rate must be BLER, BER or PER" }).optional(),
  })
  .transform((v) => {
    const d = EXPLORER_DEFAULTS[v.model];
    const parsed = parseCurveText(v.curve ?? "");
    const metric = v.metric ?? "bler";
    const curve = "points" in parsed ? parsed.points.map((p) => ({ ...p, metric })) : [];
    const curveError = "error" in parsed ? parsed.error : undefined;
    return { model: v.model, x: v.x ?? d.x, n: v.n ?? d.n, k: v.k ?? d.k, target: v.target ?? 1e-4, curve, curveError };
  })
  .superRefine((v, ctx) => {
    const issue = (path: string, message: string) => ctx.addIssue({ code: "custom", path: [path], message });
    if (!Number.isInteger(v.n) || v.n < 2 || v.n > 1_000_000) issue("n", "the block length n must be a whole number of bits from 2 to 1,000,000");
    else if (!Number.isInteger(v.k) || v.k < 1 || v.k > v.n) issue("k", `the information bits k must be a whole number from 1 to n (${v.n})`);
    if (!(v.target > 0 && v.target < 0.5)) issue("target", "the target BLER must be above 0 and below 0.5");
    if (v.model === "bsc" && !(v.x > 0 && v.x <= 0.5)) issue("x", "the raw BER p must be above 0 and at most 0.5");
    if (v.model === "bec" && !(v.x > 0 && v.x < 1)) issue("x", "the erasure probability e must be above 0 and below 1");
    if (v.model === "biawgn" && !(v.x >= -5 && v.x <= 20)) issue("x", "Eb/N0 must be from -5 to 20 dB");
    if (v.curveError) issue("curve", v.curveError);
  });
export type ExplorerView = z.output<typeof explorerSchema>;

/** The sensitivity calculator's inputs (from the address): a level in dBm or an Eb/N0, with what turns one into the other. */
export const sensitivitySchema = z
  .object({
    level: numberIn("the input level"),
    ebn0: numberIn("Eb/N0"),
    rb: numberIn("the bit rate"),
    nf: numberIn("the noise figure"),
    payload: countIn("the payload"),
    per: numberIn("the target PER"),
  })
  .transform((v) => ({
    level: v.level ?? (v.ebn0 === undefined ? -120 : undefined),
    ebn0: v.ebn0,
    rb: v.rb ?? 1200,
    nf: v.nf ?? 0,
    payload: v.payload ?? 160,
    per: v.per ?? 1e-2,
  }))
  .superRefine((v, ctx) => {
    const issue = (path: string, message: string) => ctx.addIssue({ code: "custom", path: [path], message });
    if (v.level !== undefined && !(v.level >= -250 && v.level <= 30)) issue("level", "the input level must be from -250 to 30 dBm");
    if (v.ebn0 !== undefined && !(v.ebn0 >= -50 && v.ebn0 <= 50)) issue("ebn0", "Eb/N0 must be from -50 to 50 dB");
    if (v.level !== undefined && v.ebn0 !== undefined) issue("level", "give either the input level or Eb/N0, not both");
    if (!(v.rb >= 1e-3 && v.rb <= 1e12)) issue("rb", "the information bit rate must be from 0.001 to 10^12 bit/s");
    if (!(v.nf >= 0 && v.nf <= 40)) issue("nf", "the noise figure must be from 0 to 40 dB");
    if (!Number.isInteger(v.payload) || v.payload < 1 || v.payload > 10_000_000)
      issue("payload", "the payload must be a whole number of bits from 1 to 10,000,000");
    if (!(v.per > 0 && v.per < 0.5)) issue("per", "the target PER must be above 0 and below 0.5");
  });
export type SensitivityView = z.output<typeof sensitivitySchema>;

/** The issues of a failed parse as sentences in words, one per field. */
export function explorerIssues(error: z.ZodError): string[] {
  return [...new Set(error.issues.map((i) => `${i.message[0].toUpperCase()}${i.message.slice(1)}.`))];
}

/** Search parameters as Next.js gives them to a page. */
export type SearchParams = Record<string, string | string[] | undefined>;
/** A search parameter's text: its first value, or "" when absent. */
export const paramText = (v: string | string[] | undefined) => (Array.isArray(v) ? (v[0] ?? "") : (v ?? ""));

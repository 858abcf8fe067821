import { z } from "zod";
import { typedCount, typedDecimal } from "./numbers";

const amount = (what: string) =>
  z
    .number({
      error: (iss) => (iss.input === undefined || iss.input === null ? `Enter ${what}.` : `${what[0].toUpperCase()}${what.slice(1)} must be a number.`),
    })
    .nonnegative("Must be zero or more.")
    .max(1e13, "Too large.");
/** An amount as typed ("1 250,5" too). */
const money = (what: string) => typedDecimal(amount(what));

/** One value band: [minValue, maxValue) in a currency, with its approval rule. */
export const approvalBandSchema = z
  .object({
    currency: z
      .string()
      .trim()
      .toUpperCase()
      .regex(/^[A-Z]{3}$/, "A three-letter currency code, e.g. EUR."),
    minValue: money("the lower value"),
    maxValue: typedDecimal(amount("the upper value").nullable()),
    approvalsNeeded: typedCount(
      z
        .number({ error: () => "Enter how many approvals the band needs." })
        .int("A whole number.")
        .min(1, "At least one approval.")
        .max(5, "At most five approvals."),
    ),
    minApproverLimit: money("the least approval limit"),
  })
  .refine((b) => b.maxValue === null || b.maxValue > b.minValue, {
    path: ["maxValue"],
    message: "The upper value must be above the lower value (or leave it open).",
  });
export type ApprovalBandInput = z.infer<typeof approvalBandSchema>;

/** Approve (comment optional) or return (comment required) the recommendation awaiting approval. */
export const decisionSchema = z.discriminatedUnion(
  "decision",
  [
    z.object({ decision: z.literal("approve"), comment: z.string().trim().max(2000, "At most 2,000 characters.").default("") }),
    z.object({
      decision: z.literal("return"),
      comment: z
        .string({ error: () => "Say why you return it." })
        .trim()
        .min(3, "Say why you return it (a comment is required).")
        .max(2000, "At most 2,000 characters."),
    }),
  ],
  { error: () => 'Choose "approve" or "return".' },
);
export type DecisionInput = z.infer<typeof decisionSchema>;

export const SHA256_PATTERN = /^[0-9a-f]{64}$/;

/** A pasted fingerprint: 64 hexadecimal characters (spaces and case forgiven). */
export const fingerprintSchema = z.object({
  sha256: z
    .string({ error: () => "Paste a SHA-256 fingerprint." })
    .transform((s) => s.replace(/\s+/g, "").toLowerCase())
    .pipe(
      z
        .string()
        .min(1, "Paste a SHA-256 fingerprint.")
        .regex(/^[0-9a-f]*$/, "A fingerprint has only the characters 0-9 and a-f.")
        .length(64, "A SHA-256 fingerprint has exactly 64 characters."),
    ),
});
export type FingerprintInput = z.infer<typeof fingerprintSchema>;

export const MAX_MEMO_BYTES = 20 * 1024 * 1024;

import { z } from "zod";
import { MARKS } from "@/db/schema/evaluation";
import { VERDICTS } from "@/db/schema/offers";
import { commentRequired } from "@/lib/review/marks";
import { optionalChoice, optionalFilter, pagingSchema } from "./paging";

const text = (max: number) => z.string().trim().max(max, `At most ${max} characters.`);

export const declarationSchema = z
  .object({
    conflict: z.enum(["none", "some"], { error: () => "Say whether you have a conflict of interest." }),
    conflictedOrgIds: z.array(z.string().min(1)).max(50).default([]),
    statement: text(2000).min(10, "Write a statement of at least 10 characters."),
  })
  .superRefine((v, ctx) => {
    if (v.conflict === "some" && v.conflictedOrgIds.length === 0)
      ctx.addIssue({ code: "custom", path: ["conflictedOrgIds"], message: "Name the vendors you have a conflict with." });
    if (v.conflict === "none" && v.conflictedOrgIds.length > 0)
      ctx.addIssue({ code: "custom", path: ["conflictedOrgIds"], message: "No conflict was declared, so name no vendor." });
  });
export type DeclarationInput = z.infer<typeof declarationSchema>;

export const markSchema = z
  .object({
    mark: z.enum(MARKS, { error: () => "Choose a mark." }),
    comment: text(4000).default(""),
    /** For clarification-requested: the subject of the thread opened with the vendor. */
    subject: text(200).optional(),
  })
  .superRefine((v, ctx) => {
    if (commentRequired(v.mark) && v.comment.length === 0)
      ctx.addIssue({ code: "custom", path: ["comment"], message: "Say why: a comment is required for every mark but accepted." });
    if (v.mark === "clarification-requested" && !v.subject) ctx.addIssue({ code: "custom", path: ["subject"], message: "Give the question a subject." });
  });
export type MarkInput = z.infer<typeof markSchema>;

export const threadSchema = z.object({
  subject: text(200).min(3, "Give the question a subject."),
  body: text(4000).min(1, "Write the question."),
});
export type ThreadInput = z.infer<typeof threadSchema>;

export const messageSchema = z.object({ body: text(4000).min(1, "Write a message.") });
export type MessageInput = z.infer<typeof messageSchema>;

/** An evaluator closes a question that needs no answer (any more), saying why. */
export const closeThreadSchema = z.object({ reason: text(1000).min(10, "Say why the question is closed, in at least 10 characters.") });
export type CloseThreadInput = z.infer<typeof closeThreadSchema>;

const count = (what: string) =>
  z
    .number({ error: () => `${what} must be a number.` })
    .int(`${what} must be a whole number.`)
    .min(0, `${what} cannot be negative.`)
    .max(1e15, `${what} is too large.`);

export const evidenceRunSchema = z
  .object({
    channelValue: z
      .number({ error: () => "Give the channel condition as a number." })
      .min(-50)
      .max(50),
    unit: z.enum(["bits", "frames"], { error: () => 'Choose "bits" or "frames".' }),
    trials: count("Trials").min(1, "At least 1 bit or frame."),
    errors: count("Errors"),
    confidence: z.union([z.literal(0.9), z.literal(0.95), z.literal(0.99)], { error: () => "Confidence must be 0.9, 0.95 or 0.99." }),
    note: text(500).default(""),
  })
  .refine((v) => v.errors <= v.trials, { path: ["errors"], message: "More errors than trials." });
export type EvidenceRunInput = z.infer<typeof evidenceRunSchema>;

export const evidenceImportSchema = z.object({
  csv: z.string().min(1, "The file is empty.").max(1_000_000, "At most 1 MB of CSV."),
  /** Check every row and say what it would count for, writing nothing. */
  preview: z.boolean().default(false),
});

export const signoffSchema = z.object({
  statement: text(2000).min(10, "Write a statement of at least 10 characters."),
});
export type SignoffInput = z.infer<typeof signoffSchema>;

/** The queue's filters, as they appear in the URL. */
export const claimQueueFiltersSchema = z.object({
  tenderId: optionalFilter(),
  vendor: optionalFilter(),
  verdict: optionalChoice(VERDICTS, "verdict"),
  mark: optionalChoice([...MARKS, "unmarked"], "mark"),
});
export type ClaimQueueFilters = z.infer<typeof claimQueueFiltersSchema>;
/** GET /api/v1/claims: the filters and a page (?page=&size=). */
export const claimQueueSchema = claimQueueFiltersSchema.extend(pagingSchema.shape);

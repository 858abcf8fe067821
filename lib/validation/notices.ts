import { z } from "zod";

const words = (what: string, min: number, max: number) =>
  z
    .string({ error: `Write ${what}.` })
    .trim()
    .min(min, `Write ${what} of at least ${min} characters.`)
    .max(max, `At most ${max} characters.`);

/** A vendor's written objection to an award. */
export const objectionSchema = z.object({ body: words("the objection", 20, 8000) });
export type ObjectionInput = z.infer<typeof objectionSchema>;

/** The buying team's written answer to an objection, sent to the vendor who lodged it. */
export const objectionAnswerSchema = z.object({ answer: words("the answer", 10, 8000) });
export type ObjectionAnswerInput = z.infer<typeof objectionAnswerSchema>;

/** An addendum to every invited vendor; threadId names the clarification it answers (never shown to vendors). */
export const addendumSchema = z.object({
  title: words("a title", 3, 160),
  body: words("the addendum", 10, 8000),
  threadId: z.string().min(1).optional(),
});
export type AddendumInput = z.infer<typeof addendumSchema>;

/** A page of a tender's ledger, from 1 (newest entries first). */
export const ledgerPageSchema = z.object({
  page: z.coerce.number({ error: "The page is a number." }).int("A whole page number.").min(1, "Pages start at 1.").default(1),
});

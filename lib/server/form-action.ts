import "server-only";
import { revalidatePath } from "next/cache";
import type { ZodType } from "zod";
import { fieldErrorsOf } from "@/lib/validation/messages";
import { BAD_TEXT_MESSAGE, findBadText } from "@/lib/validation/text";
import { AppError } from "@/lib/server/errors";
import { requireViewer, type Viewer } from "@/lib/server/session";

export interface FormResult {
  ok?: boolean;
  message?: string;
  fieldErrors?: Record<string, string[]>;
  values?: unknown;
}

/**
 * The arguments an action receives apart from its form values (the ids and paths it is bound to),
 * by name: `{ tenderId }`. They come from the client like any value and are checked the same way.
 */
export type BoundArgs = Record<string, unknown>;

/** Why the bound arguments are refused (not text, or bad text in them), or null. */
export function boundArgsProblem(args: BoundArgs): FormResult | null {
  for (const [name, value] of Object.entries(args)) {
    if (typeof value !== "string") return { message: `The ${name} of this request is missing or not text: reload the page and try again.` };
  }
  const bad = findBadText(args);
  return bad ? { message: `The ${bad} of this request ${BAD_TEXT_MESSAGE}` } : null;
}

/**
 * The recipe of every form's server action: parse with the same zod schema as the API, then run
 * one lib/server function; typed failures come back to the form as messages, anything else is a
 * real error. Redirects belong after it, outside any try/catch. Every argument the action takes
 * besides its values goes in `bound`, so that nothing reaches lib/server unchecked.
 */
export async function attemptForm<I, T>(
  schema: ZodType<I>,
  values: unknown,
  work: (viewer: Viewer, input: I) => Promise<T>,
  bound: BoundArgs = {},
): Promise<{ ok: true; value: T } | { ok: false; result: FormResult }> {
  const refused = boundArgsProblem(bound);
  if (refused) return { ok: false, result: refused };
  const bad = findBadText(values);
  if (bad) return { ok: false, result: { message: `A field ${BAD_TEXT_MESSAGE}`, fieldErrors: { [bad]: [BAD_TEXT_MESSAGE] } } };
  const parsed = schema.safeParse(values);
  if (!parsed.success) return { ok: false, result: { message: "Check the highlighted fields.", fieldErrors: fieldErrorsOf(parsed.error), values } };
  try {
    return { ok: true, value: await work(await requireViewer(), parsed.data) };
  } catch (error) {
    if (error instanceof AppError) return { ok: false, result: { message: error.message, fieldErrors: error.fieldErrors, values } };
    throw error;
  }
}

/** attemptForm, then revalidate the given paths and say so. */
export async function runForm<T>(
  schema: ZodType<T>,
  values: unknown,
  work: (viewer: Viewer, input: T) => Promise<unknown>,
  paths: string[],
  okMessage: string,
  bound: BoundArgs = {},
): Promise<FormResult> {
  const outcome = await attemptForm(schema, values, work, bound);
  if (!outcome.ok) return outcome.result;
  for (const path of paths) revalidatePath(path);
  return { ok: true, message: okMessage };
}

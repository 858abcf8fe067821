import "server-only";
import { revalidatePath } from "next/cache";
import type { ZodType } from "zod";
import { fieldErrorsOf } from "@/lib/validation/messages";
import { AppError } from "@/lib/server/errors";
import { requireViewer, type Viewer } from "@/lib/server/session";

export interface FormResult {
  ok?: boolean;
  message?: string;
  fieldErrors?: Record<string, string[]>;
  values?: unknown;
}

/** The one recipe for the bench's forms: parse, call one lib/server function, revalidate. */
export async function runForm<T>(
  schema: ZodType<T>,
  values: unknown,
  work: (viewer: Viewer, input: T) => Promise<unknown>,
  paths: string[],
  okMessage: string,
): Promise<FormResult> {
  const parsed = schema.safeParse(values);
  if (!parsed.success) return { message: "Check the highlighted fields.", fieldErrors: fieldErrorsOf(parsed.error), values };
  try {
    await work(await requireViewer(), parsed.data);
  } catch (error) {
    if (error instanceof AppError) return { message: error.message, fieldErrors: error.fieldErrors, values };
    throw error;
  }
  for (const path of paths) revalidatePath(path);
  return { ok: true, message: okMessage };
}


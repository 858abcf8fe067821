"use server";

import { revalidatePath } from "next/cache";
import { z, type ZodType } from "zod";
import { redirect } from "next/navigation";
import { AppError } from "@/lib/server/errors";
import { requireViewer, type Viewer } from "@/lib/server/session";
import { cancelTender, createTender, openTender, updateTender } from "@/lib/server/tender-lifecycle";
import { fieldErrorsOf } from "@/lib/validation/messages";
import { cancelTenderSchema, tenderInputSchema } from "@/lib/validation/tender";

export interface TenderFormResult {
  ok?: boolean;
  message?: string;
  fieldErrors?: Record<string, string[]>;
}

/**
 * Parses the values with the same schema as the API, then runs one lib/server call; typed
 * failures come back to the form, anything else is a real error.
 */
async function attempt<I, T>(
  schema: ZodType<I>,
  values: unknown,
  work: (input: I, viewer: Viewer) => Promise<T>,
): Promise<{ value: T } | { failed: TenderFormResult }> {
  const parsed = schema.safeParse(values);
  if (!parsed.success) return { failed: { message: "Check the highlighted fields.", fieldErrors: fieldErrorsOf(parsed.error) } };
  try {
    return { value: await work(parsed.data, await requireViewer()) };
  } catch (error) {
    if (error instanceof AppError) return { failed: { message: error.message, fieldErrors: error.fieldErrors } };
    throw error;
  }
}

const nothing = z.unknown();

export async function createTenderAction(values: unknown): Promise<TenderFormResult> {
  const outcome = await attempt(tenderInputSchema, values, (input, viewer) => createTender(viewer, input));
  if ("failed" in outcome) return outcome.failed;
  revalidatePath("/tenders");
  redirect(`/tenders/${outcome.value.id}`);
}

export async function updateTenderAction(tenderId: string, values: unknown): Promise<TenderFormResult> {
  const outcome = await attempt(tenderInputSchema, values, (input, viewer) => updateTender(viewer, String(tenderId), input));
  if ("failed" in outcome) return outcome.failed;
  revalidatePath(`/tenders/${tenderId}`, "layout");
  redirect(`/tenders/${tenderId}`);
}

export async function openTenderAction(tenderId: string): Promise<TenderFormResult> {
  const outcome = await attempt(nothing, undefined, (_, viewer) => openTender(viewer, String(tenderId)));
  if ("failed" in outcome) return outcome.failed;
  revalidatePath(`/tenders/${tenderId}`, "layout");
  return { ok: true, message: "Tender opened; the invited vendors have been e-mailed." };
}

export async function cancelTenderAction(tenderId: string, values: unknown): Promise<TenderFormResult> {
  const outcome = await attempt(cancelTenderSchema, values, (input, viewer) => cancelTender(viewer, String(tenderId), input));
  if ("failed" in outcome) return outcome.failed;
  revalidatePath(`/tenders/${tenderId}`, "layout");
  return { ok: true, message: "Tender cancelled." };
}

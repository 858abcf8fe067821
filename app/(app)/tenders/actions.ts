"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { AppError } from "@/lib/server/errors";
import { requireViewer } from "@/lib/server/session";
import { cancelTender, createTender, openTender, updateTender } from "@/lib/server/tender-lifecycle";
import { fieldErrorsOf } from "@/lib/validation/messages";
import { cancelTenderSchema, tenderInputSchema } from "@/lib/validation/tender";

export interface TenderFormResult {
  ok?: boolean;
  message?: string;
  fieldErrors?: Record<string, string[]>;
}

const CHECK_FIELDS = "Check the highlighted fields.";

/** Runs one lib/server call; typed failures come back to the form, anything else is a real error. */
async function attempt<T>(work: () => Promise<T>): Promise<{ value: T } | { failed: TenderFormResult }> {
  try {
    return { value: await work() };
  } catch (error) {
    if (error instanceof AppError) return { failed: { message: error.message, fieldErrors: error.fieldErrors } };
    throw error;
  }
}

export async function createTenderAction(values: unknown): Promise<TenderFormResult> {
  const parsed = tenderInputSchema.safeParse(values);
  if (!parsed.success) return { message: CHECK_FIELDS, fieldErrors: fieldErrorsOf(parsed.error) };
  const outcome = await attempt(async () => createTender(await requireViewer(), parsed.data));
  if ("failed" in outcome) return outcome.failed;
  revalidatePath("/tenders");
  redirect(`/tenders/${outcome.value.id}`);
}

export async function updateTenderAction(tenderId: string, values: unknown): Promise<TenderFormResult> {
  const parsed = tenderInputSchema.safeParse(values);
  if (!parsed.success) return { message: CHECK_FIELDS, fieldErrors: fieldErrorsOf(parsed.error) };
  const outcome = await attempt(async () => updateTender(await requireViewer(), String(tenderId), parsed.data));
  if ("failed" in outcome) return outcome.failed;
  revalidatePath(`/tenders/${tenderId}`, "layout");
  redirect(`/tenders/${tenderId}`);
}

export async function openTenderAction(tenderId: string): Promise<TenderFormResult> {
  const outcome = await attempt(async () => openTender(await requireViewer(), String(tenderId)));
  if ("failed" in outcome) return outcome.failed;
  revalidatePath(`/tenders/${tenderId}`, "layout");
  return { ok: true, message: `Tender opened; the invited vendors have been e-mailed.` };
}

export async function cancelTenderAction(tenderId: string, values: unknown): Promise<TenderFormResult> {
  const parsed = cancelTenderSchema.safeParse(values);
  if (!parsed.success) return { message: CHECK_FIELDS, fieldErrors: fieldErrorsOf(parsed.error) };
  const outcome = await attempt(async () => cancelTender(await requireViewer(), String(tenderId), parsed.data));
  if ("failed" in outcome) return outcome.failed;
  revalidatePath(`/tenders/${tenderId}`, "layout");
  return { ok: true, message: "Tender cancelled." };
}

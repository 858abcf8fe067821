"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { redirect } from "next/navigation";
import { attemptForm, type FormResult } from "@/lib/server/form-action";
import { cancelTender, createTender, openTender, updateTender } from "@/lib/server/tender-lifecycle";
import { cancelTenderSchema, tenderInputSchema } from "@/lib/validation/tender";

export type TenderFormResult = FormResult;

const nothing = z.unknown();

export async function createTenderAction(values: unknown): Promise<TenderFormResult> {
  const outcome = await attemptForm(tenderInputSchema, values, (viewer, input) => createTender(viewer, input));
  if (!outcome.ok) return outcome.result;
  revalidatePath("/tenders");
  redirect(`/tenders/${outcome.value.id}`);
}

export async function updateTenderAction(tenderId: string, values: unknown): Promise<TenderFormResult> {
  const outcome = await attemptForm(tenderInputSchema, values, (viewer, input) => updateTender(viewer, String(tenderId), input), { tenderId });
  if (!outcome.ok) return outcome.result;
  revalidatePath(`/tenders/${tenderId}`, "layout");
  redirect(`/tenders/${tenderId}`);
}

export async function openTenderAction(tenderId: string): Promise<TenderFormResult> {
  const outcome = await attemptForm(nothing, undefined, (viewer) => openTender(viewer, String(tenderId)), { tenderId });
  if (!outcome.ok) return outcome.result;
  revalidatePath(`/tenders/${tenderId}`, "layout");
  return { ok: true, message: "Tender opened; the invited vendors have been e-mailed." };
}

export async function cancelTenderAction(tenderId: string, values: unknown): Promise<TenderFormResult> {
  const outcome = await attemptForm(cancelTenderSchema, values, (viewer, input) => cancelTender(viewer, String(tenderId), input), { tenderId });
  if (!outcome.ok) return outcome.result;
  revalidatePath(`/tenders/${tenderId}`, "layout");
  return { ok: true, message: "Tender cancelled." };
}

"use server";

import { revalidatePath } from "next/cache";
import { AppError } from "@/lib/server/errors";
import { submitOffer, withdrawOffer } from "@/lib/server/offers";
import { requireViewer } from "@/lib/server/session";
import { fieldErrorsOf } from "@/lib/validation/messages";
import { offerSchema } from "@/lib/validation/offer";

export interface OfferFormResult {
  ok?: boolean;
  message?: string;
  fieldErrors?: Record<string, string[]>;
}

function revalidateOffers(tenderId: string) {
  revalidatePath(`/tenders/${tenderId}/offer`);
  revalidatePath(`/tenders/${tenderId}/offers`);
}

/** Submits or resubmits; the page then shows the new version's verdicts, so the form stays as typed. */
export async function submitOfferAction(tenderId: string, values: unknown): Promise<OfferFormResult> {
  const parsed = offerSchema.safeParse(values);
  if (!parsed.success) return { message: "Check the highlighted fields.", fieldErrors: fieldErrorsOf(parsed.error) };
  let version: number | undefined;
  try {
    version = (await submitOffer(await requireViewer(), String(tenderId), parsed.data)).version;
  } catch (error) {
    if (error instanceof AppError) return { message: error.message, fieldErrors: error.fieldErrors };
    throw error;
  }
  revalidateOffers(tenderId);
  return { ok: true, message: `Version ${version} submitted. Its verdicts are shown below.` };
}

export async function withdrawOfferAction(tenderId: string, offerId: string): Promise<OfferFormResult> {
  try {
    await withdrawOffer(await requireViewer(), String(offerId));
  } catch (error) {
    if (error instanceof AppError) return { message: error.message };
    throw error;
  }
  revalidateOffers(tenderId);
  return { ok: true, message: "Your offer is withdrawn. It stays on record; you may submit again until closing." };
}

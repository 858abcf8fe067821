"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { attemptForm, type FormResult } from "@/lib/server/form-action";
import { submitOffer, withdrawOffer } from "@/lib/server/offers";
import { offerSchema } from "@/lib/validation/offer";

export type OfferFormResult = FormResult;

function revalidateOffers(tenderId: string) {
  revalidatePath(`/tenders/${tenderId}/offer`);
  revalidatePath(`/tenders/${tenderId}/offers`);
}

/** Submits or resubmits; the page then shows the new version's verdicts, so the form stays as typed. */
export async function submitOfferAction(tenderId: string, values: unknown): Promise<OfferFormResult> {
  const outcome = await attemptForm(offerSchema, values, (viewer, input) => submitOffer(viewer, String(tenderId), input), { tenderId });
  if (!outcome.ok) return { ...outcome.result, values: undefined };
  revalidateOffers(tenderId);
  return { ok: true, message: `Version ${outcome.value.version} submitted. Its verdicts are shown below.` };
}

export async function withdrawOfferAction(tenderId: string, offerId: string): Promise<OfferFormResult> {
  const outcome = await attemptForm(z.unknown(), undefined, (viewer) => withdrawOffer(viewer, String(offerId)), { tenderId, offerId });
  if (!outcome.ok) return { message: outcome.result.message };
  revalidateOffers(tenderId);
  return { ok: true, message: "Your offer is withdrawn. It stays on record; you may submit again until closing." };
}

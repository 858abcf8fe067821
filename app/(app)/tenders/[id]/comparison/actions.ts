"use server";

import { z } from "zod";
import { openEnvelopes } from "@/lib/server/comparison";
import { submitRecommendation } from "@/lib/server/recommendations";
import { recommendationSchema } from "@/lib/validation/comparison";
import { runForm, type FormResult } from "@/lib/server/form-action";

const tenderPaths = (tenderId: string) => [`/tenders/${tenderId}`, `/tenders/${tenderId}/comparison`, `/tenders/${tenderId}/ledger`, "/desk"];

export async function openEnvelopesAction(tenderId: string): Promise<FormResult> {
  return runForm(
    z.object({}),
    {},
    (viewer) => openEnvelopes(viewer, String(tenderId)),
    tenderPaths(tenderId),
    "Envelopes opened: prices, lead times and warranties are now scored.",
    { tenderId },
  );
}

export async function submitRecommendationAction(tenderId: string, values: unknown): Promise<FormResult> {
  return runForm(
    recommendationSchema,
    values,
    (viewer, input) => submitRecommendation(viewer, String(tenderId), input),
    tenderPaths(tenderId),
    "Recommendation submitted: the tender is now in approval.",
    { tenderId },
  );
}

"use server";

import { decideRecommendation } from "@/lib/server/approvals";
import { withdrawRecommendation } from "@/lib/server/recommendations";
import { decisionSchema } from "@/lib/validation/approvals";
import { withdrawalSchema } from "@/lib/validation/comparison";
import { runForm, type FormResult } from "@/lib/server/form-action";

export async function decideAction(tenderId: string, values: unknown): Promise<FormResult> {
  const id = String(tenderId);
  const decision = (values as { decision?: unknown } | null)?.decision;
  const message = decision === "return" ? "Returned to the buyer for revision." : "Approval recorded.";
  return runForm(
    decisionSchema,
    values,
    (viewer, input) => decideRecommendation(viewer, id, input),
    [`/tenders/${id}/sign-off`, `/tenders/${id}`, "/desk"],
    message,
    { tenderId },
  );
}

export async function withdrawAction(tenderId: string, values: unknown): Promise<FormResult> {
  const id = String(tenderId);
  return runForm(
    withdrawalSchema,
    values,
    (viewer, input) => withdrawRecommendation(viewer, id, input),
    [`/tenders/${id}/sign-off`, `/tenders/${id}`, `/tenders/${id}/comparison`, "/desk"],
    "Recommendation withdrawn: the tender is back in commercial evaluation.",
    { tenderId },
  );
}

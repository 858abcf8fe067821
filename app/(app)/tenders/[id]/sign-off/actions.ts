"use server";

import { decideRecommendation } from "@/lib/server/approvals";
import { decisionSchema } from "@/lib/validation/approvals";
import { runForm, type FormResult } from "@/lib/server/form-action";

export async function decideAction(tenderId: string, values: unknown): Promise<FormResult> {
  const id = String(tenderId);
  const decision = (values as { decision?: unknown } | null)?.decision;
  const message = decision === "return" ? "Returned to the buyer for revision." : "Approval recorded.";
  return runForm(decisionSchema, values, (viewer, input) => decideRecommendation(viewer, id, input), [`/tenders/${id}/sign-off`, `/tenders/${id}`, "/desk"], message);
}

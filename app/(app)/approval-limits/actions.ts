"use server";

import { z } from "zod";
import { createApprovalBand, removeApprovalBand, updateApprovalBand } from "@/lib/server/approval-bands";
import { approvalBandSchema } from "@/lib/validation/approvals";
import { runForm, type FormResult } from "@/lib/server/form-action";

const PATHS = ["/approval-limits"];
const idSchema = z.object({ id: z.string().min(1, "Choose a band.") });

export async function createBandAction(values: unknown): Promise<FormResult> {
  return runForm(approvalBandSchema, values, (viewer, input) => createApprovalBand(viewer, input), PATHS, "Band added.");
}

export async function updateBandAction(id: string, values: unknown): Promise<FormResult> {
  return runForm(approvalBandSchema, values, (viewer, input) => updateApprovalBand(viewer, String(id), input), PATHS, "Band saved.", { id });
}

export async function removeBandAction(id: string): Promise<FormResult> {
  return runForm(idSchema, { id }, (viewer, input) => removeApprovalBand(viewer, input.id), PATHS, "Band removed.", { id });
}

"use server";

import { evidenceRunSchema, markSchema, threadSchema } from "@/lib/validation/review";
import { recordEvidence } from "@/lib/server/evidence";
import { createMark } from "@/lib/server/marks";
import { openThread } from "@/lib/server/threads";
import { runForm, type FormResult } from "@/lib/server/form-action";

const claimPaths = (claimId: string) => [`/review/claims/${claimId}`, "/review"];

export async function markClaimAction(claimId: string, values: unknown): Promise<FormResult> {
  return runForm(markSchema, values, (viewer, input) => createMark(viewer, String(claimId), input), claimPaths(claimId), "Mark recorded.");
}

export async function recordEvidenceAction(claimId: string, values: unknown): Promise<FormResult> {
  return runForm(evidenceRunSchema, values, (viewer, input) => recordEvidence(viewer, String(claimId), input), claimPaths(claimId), "Lab run recorded.");
}

export async function openThreadAction(claimId: string, values: unknown): Promise<FormResult> {
  return runForm(threadSchema, values, (viewer, input) => openThread(viewer, String(claimId), input), claimPaths(claimId), "Question sent to the vendor.");
}

"use server";

import { evidenceRunSchema, markSchema, threadSchema } from "@/lib/validation/review";
import { recordEvidence } from "@/lib/server/evidence";
import { createMark } from "@/lib/server/marks";
import { openThread } from "@/lib/server/threads";
import { revalidatePath } from "next/cache";
import { EVIDENCE_LABELS } from "@/lib/review/labels";
import { attemptForm, runForm, type FormResult } from "@/lib/server/form-action";

const claimPaths = (claimId: string) => [`/review/claims/${claimId}`, "/review"];

export async function markClaimAction(claimId: string, values: unknown): Promise<FormResult> {
  return runForm(markSchema, values, (viewer, input) => createMark(viewer, String(claimId), input), claimPaths(claimId), "Mark recorded.", { claimId });
}

/** Says what the run counts for, and why, since a run at another channel may not count as its counts suggest. */
export async function recordEvidenceAction(claimId: string, values: unknown): Promise<FormResult> {
  const outcome = await attemptForm(evidenceRunSchema, values, (viewer, input) => recordEvidence(viewer, String(claimId), input), { claimId });
  if (!outcome.ok) return outcome.result;
  for (const path of claimPaths(claimId)) revalidatePath(path);
  const run = outcome.value;
  return { ok: true, message: `Lab run recorded: ${EVIDENCE_LABELS[run.status].toLowerCase()}. ${run.finding}` };
}

export async function openThreadAction(claimId: string, values: unknown): Promise<FormResult> {
  return runForm(threadSchema, values, (viewer, input) => openThread(viewer, String(claimId), input), claimPaths(claimId), "Question sent to the vendor.", {
    claimId,
  });
}

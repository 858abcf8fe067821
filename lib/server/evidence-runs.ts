import "server-only";
import type { Queryable } from "@/db/client";
import { evidenceRuns, type claims } from "@/db/schema";
import type { EvidenceResult } from "@/lib/bounds";
import type { EvidenceUnit } from "@/lib/review/evidence";

// The writer behind recording lab runs, apart from the reads and rules of ./evidence: it takes the
// caller's transaction and never opens the database, so the demo seed can use it too.

type ClaimRow = typeof claims.$inferSelect;

export interface NewRun {
  channelValue: number;
  unit: EvidenceUnit;
  trials: number;
  errors: number;
  confidence: number;
  note?: string;
}

/** Stores one assessed run; the caller's transaction also writes the ledger entry. */
export async function insertEvidenceRun(
  tx: Queryable,
  claim: Pick<ClaimRow, "id" | "tenderId" | "vendorOrgId">,
  run: NewRun,
  assessed: { result: EvidenceResult; finding: string },
  by: { userId: string; source: "manual" | "csv" },
) {
  const { result, finding } = assessed;
  const [row] = await tx
    .insert(evidenceRuns)
    .values({
      claimId: claim.id,
      tenderId: claim.tenderId,
      vendorOrgId: claim.vendorOrgId,
      channelValue: run.channelValue,
      unit: run.unit,
      trials: run.trials,
      errors: run.errors,
      confidence: run.confidence,
      lower: result.lower,
      upper: result.upper,
      status: result.status,
      finding,
      errorFreeTrialsNeeded: result.status === "contradicted" ? null : result.errorFreeTrialsNeeded,
      source: by.source,
      note: run.note ?? "",
      recordedBy: by.userId,
    })
    .returning();
  return { ...row, additionalTrialsNeeded: result.additionalTrialsNeeded };
}

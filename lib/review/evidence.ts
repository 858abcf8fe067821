import { assessEvidence, type EvidenceResult } from "@/lib/bounds";
import type { ClaimMetric } from "@/db/schema/offers";
import type { EvidenceStatus } from "@/db/schema/evaluation";
import type { EvidenceSummary } from "./labels";

export type { EvidenceSummary };

export type EvidenceUnit = "bits" | "frames";
export const CONFIDENCES = [0.9, 0.95, 0.99] as const;

interface ClaimForEvidence {
  metric: ClaimMetric;
  value: number;
  ncgOutputBer: number | null;
}

/** BER claims are tested with bit counts, BLER claims with frame counts; a gain claim by its output BER. */
export function unitForMetric(metric: ClaimMetric): EvidenceUnit {
  return metric === "bler" ? "frames" : "bits";
}

/** The error rate a run is tested against. */
export function claimedRate(claim: ClaimForEvidence): number | null {
  const rate = claim.metric === "ncg" ? claim.ncgOutputBer : claim.value;
  return rate !== null && rate > 0 && rate < 1 ? rate : null;
}

export type RunAssessment = { ok: true; result: EvidenceResult } | { ok: false; field: string; message: string };

/** One lab run against its claim, or the reason it cannot be counted (wrong unit, impossible counts). */
export function assessRun(
  claim: ClaimForEvidence,
  run: { unit: EvidenceUnit; trials: number; errors: number; confidence: number },
): RunAssessment {
  const unit = unitForMetric(claim.metric);
  if (run.unit !== unit) {
    const metric = claim.metric === "bler" ? "a BLER claim" : claim.metric === "ber" ? "a BER claim" : "a coding-gain claim (its output BER)";
    return { ok: false, field: "unit", message: `This is ${metric}: count ${unit}, not ${run.unit}.` };
  }
  if (!Number.isInteger(run.trials) || run.trials < 1) return { ok: false, field: "trials", message: "Trials must be a whole number of at least 1." };
  if (!Number.isInteger(run.errors) || run.errors < 0) return { ok: false, field: "errors", message: "Errors must be a whole number of 0 or more." };
  if (run.errors > run.trials) return { ok: false, field: "errors", message: `More errors (${run.errors}) than ${unit} sent (${run.trials}).` };
  if (!(CONFIDENCES as readonly number[]).includes(run.confidence)) {
    return { ok: false, field: "confidence", message: "Confidence must be 0.9, 0.95 or 0.99." };
  }
  const claimed = claimedRate(claim);
  if (claimed === null) return { ok: false, field: "claim", message: "This claim states no error rate that a count could test." };
  return { ok: true, result: assessEvidence({ errors: run.errors, trials: run.trials, claimed, confidence: run.confidence }) };
}

/**
 * One status for a claim from its runs. A contradicting run outweighs the rest (the claim failed
 * in the lab once), then a verifying one; runs that decide nothing leave it inconclusive.
 */
export function summariseEvidence(statuses: readonly EvidenceStatus[]): EvidenceSummary {
  if (statuses.length === 0) return "none";
  if (statuses.includes("contradicted")) return "contradicted";
  if (statuses.includes("verified")) return "verified";
  return "inconclusive";
}

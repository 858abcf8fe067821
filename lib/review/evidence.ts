import { assessEvidence, type EvidenceResult } from "@/lib/bounds";
import type { ClaimMetric } from "@/db/schema/offers";
import type { EvidenceStatus } from "@/db/schema/evaluation";
import type { ChannelModel } from "@/db/schema/tenders";
import { formatCondition } from "@/lib/format";
import { CONDITION_RANGES, conditionInRange } from "@/lib/validation/tender";
import type { EvidenceSummary } from "./labels";

export type { EvidenceSummary };

export type EvidenceUnit = "bits" | "frames";
export const CONFIDENCES = [0.9, 0.95, 0.99] as const;

interface ClaimForEvidence {
  metric: ClaimMetric;
  value: number;
  ncgOutputBer: number | null;
  /** The claim's channel condition, in the tender's unit. */
  channelValue: number;
  channelModel: ChannelModel;
}

export type ChannelSide = "same" | "harsher" | "milder";

/**
 * Where a run's channel stands against the claim's. The channels are ordered: a larger raw BER p
 * (BSC) or erasure probability e (BEC) is harsher, a lower Eb/N0 (BI-AWGN) is harsher. Values
 * equal to nine significant digits (or within 1e-9 dB) are the same channel.
 */
export function channelSide(model: ChannelModel, run: number, claim: number): ChannelSide {
  const same = model === "biawgn" ? Math.abs(run - claim) <= 1e-9 : Math.abs(run - claim) <= 1e-9 * Math.max(Math.abs(run), Math.abs(claim));
  if (same) return "same";
  const harsher = model === "biawgn" ? run < claim : run > claim;
  return harsher ? "harsher" : "milder";
}

/**
 * What a run counts for against its claim. A run verifies only at the claim's channel or a harsher
 * one (the code held up in worse conditions), and contradicts only at the claim's channel or a
 * milder one (it failed in conditions no worse). Otherwise it decides nothing: inconclusive.
 */
export function countedStatus(
  model: ChannelModel,
  runChannel: number,
  claimChannel: number,
  measured: EvidenceStatus,
): { status: EvidenceStatus; finding: string } {
  const side = channelSide(model, runChannel, claimChannel);
  const at = formatCondition(model, runChannel);
  const claimAt = formatCondition(model, claimChannel);
  const where = side === "same" ? `at the claim's channel (${claimAt})` : `at ${at}, ${side} than the claim's ${claimAt}`;
  if (measured === "verified" && side === "milder")
    return { status: "inconclusive", finding: `Run ${where}: it would verify, but a run verifies a claim only at the claim's channel or a harsher one.` };
  if (measured === "contradicted" && side === "harsher")
    return { status: "inconclusive", finding: `Run ${where}: it would contradict, but a run contradicts a claim only at the claim's channel or a milder one.` };
  const outcome = measured === "verified" ? "verifies the claim" : measured === "contradicted" ? "contradicts the claim" : "decides nothing yet";
  return { status: measured, finding: `Run ${where}: it ${outcome}.` };
}

/** BER claims are tested with bit counts, BLER claims with frame counts; a gain claim by its output BER. */
export function unitForMetric(metric: ClaimMetric): EvidenceUnit {
  return metric === "bler" ? "frames" : "bits";
}

/** The error rate a run is tested against. */
export function claimedRate(claim: Pick<ClaimForEvidence, "metric" | "value" | "ncgOutputBer">): number | null {
  const rate = claim.metric === "ncg" ? claim.ncgOutputBer : claim.value;
  return rate !== null && rate > 0 && rate < 1 ? rate : null;
}

export type RunAssessment = { ok: true; result: EvidenceResult; finding: string } | { ok: false; field: string; message: string };

/**
 * One lab run against its claim, or the reason it cannot be counted (channel out of range, wrong
 * unit, impossible counts). The result's status is what the run counts for after the channel rule.
 */
export function assessRun(
  claim: ClaimForEvidence,
  run: { channelValue: number; unit: EvidenceUnit; trials: number; errors: number; confidence: number },
): RunAssessment {
  if (!conditionInRange(claim.channelModel, run.channelValue)) {
    return { ok: false, field: "channelValue", message: `The run's channel is out of range: ${CONDITION_RANGES[claim.channelModel].words}.` };
  }
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
  const measured = assessEvidence({ errors: run.errors, trials: run.trials, claimed, confidence: run.confidence });
  const counted = countedStatus(claim.channelModel, run.channelValue, claim.channelValue, measured.status);
  const changed = counted.status !== measured.status;
  return {
    ok: true,
    finding: counted.finding,
    result: { ...measured, status: counted.status, additionalTrialsNeeded: changed ? null : measured.additionalTrialsNeeded },
  };
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

/** A claim's status from its stored runs, each counted by the channel rule again (runs stored before the rule count as they should). */
export function summariseRuns(model: ChannelModel, claimChannel: number, runs: readonly { channelValue: number; status: EvidenceStatus }[]): EvidenceSummary {
  return summariseEvidence(runs.map((r) => countedStatus(model, r.channelValue, claimChannel, r.status).status));
}

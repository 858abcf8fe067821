// Computes every claim's verdict with the bounds engine before anything is stored.
import { claimSchema, evaluateClaim, type ClaimResult } from "@/lib/bounds";
import { claimInputFor, type ClaimMetric, type OfferClaim, type OfferCode } from "./claim-input";
import { termsErrors, type TenderTerms, type VerdictName } from "./rules";

export interface EvaluatedClaim {
  pointIndex: number;
  pointLabel: string;
  channelValue: number;
  metric: ClaimMetric;
  value: number;
  ncgOutputBer: number | null;
  verdict: VerdictName;
  result: ClaimResult;
  engineVersion: string;
}

export interface OfferTerms {
  code: OfferCode;
  claims: (OfferClaim & { pointIndex: number })[];
  envelope: { currency: string };
}

export type Evaluation = { ok: true; claims: EvaluatedClaim[] } | { ok: false; fieldErrors: Record<string, string[]> };

/** Where an engine input error belongs on the offer form: code fields on the code, the rest on the claim. */
function fieldOf(path: PropertyKey[], index: number, metric: ClaimMetric): string {
  if (path[0] === "code") return path.length > 1 ? `code.${String(path[1])}` : "code.k";
  if (metric === "ncg" && path[0] === "target") return `claims.${index}.ncgOutputBer`;
  return `claims.${index}.value`;
}

/** Checks the submission against the tender, then evaluates each claim at its operating point. */
export function evaluateOffer(tender: TenderTerms, input: OfferTerms): Evaluation {
  const fieldErrors = termsErrors(tender, input);
  if (Object.keys(fieldErrors).length > 0) return { ok: false, fieldErrors };
  const claims: EvaluatedClaim[] = [];
  input.claims.forEach((claim, i) => {
    const point = tender.operatingPoints[claim.pointIndex];
    const parsed = claimSchema.safeParse(claimInputFor(tender.channelModel, point.value, input.code, claim));
    if (!parsed.success) {
      for (const issue of parsed.error.issues) (fieldErrors[fieldOf(issue.path, i, claim.metric)] ??= []).push(issue.message);
      return;
    }
    const result = evaluateClaim(parsed.data);
    claims.push({
      pointIndex: claim.pointIndex,
      pointLabel: point.label,
      channelValue: point.value,
      metric: claim.metric,
      value: claim.value,
      ncgOutputBer: claim.metric === "ncg" ? (claim.ncgOutputBer ?? null) : null,
      verdict: result.verdict,
      result,
      engineVersion: result.engineVersion,
    });
  });
  if (Object.keys(fieldErrors).length > 0) return { ok: false, fieldErrors };
  return { ok: true, claims: claims.sort((a, b) => a.pointIndex - b.pointIndex) };
}

import { claimSchema, ENGINE_VERSION, evaluateClaim, type ClaimInput, type ClaimResult } from "@/lib/bounds";
import { claimInputFor, type ClaimMetric, type OfferClaim, type OfferCode } from "./claim-input";
import { termsErrors, type TenderTerms, type VerdictName } from "./rules";

/** What is stored for a claim the engine did not finish (past the deadline): no verdict of its own. */
export interface UnfinishedResult {
  verdict: "needs-evidence";
  findings: ClaimResult["findings"];
  engineError: string;
  engineVersion: string;
}

export interface EvaluatedClaim {
  pointIndex: number;
  pointLabel: string;
  channelValue: number;
  metric: ClaimMetric;
  value: number;
  ncgOutputBer: number | null;
  verdict: VerdictName;
  result: ClaimResult | UnfinishedResult;
  engineVersion: string;
}

export interface OfferTerms {
  code: OfferCode;
  claims: (OfferClaim & { pointIndex: number })[];
  envelope: { currency: string };
}

/** One claim of an offer, ready for the engine. */
export interface PreparedClaim {
  claim: OfferClaim & { pointIndex: number };
  point: TenderTerms["operatingPoints"][number];
  input: ClaimInput;
}

export type PreparedOffer = { ok: true; claims: PreparedClaim[] } | { ok: false; fieldErrors: Record<string, string[]> };
export type Evaluation = { ok: true; claims: EvaluatedClaim[] } | { ok: false; fieldErrors: Record<string, string[]> };

/** Where an engine input error belongs on the offer form: code fields on the code, the rest on the claim. */
function fieldOf(path: PropertyKey[], index: number, metric: ClaimMetric): string {
  if (path[0] === "code") return path.length > 1 ? `code.${String(path[1])}` : "code.k";
  if (metric === "ncg" && path[0] === "target") return `claims.${index}.ncgOutputBer`;
  return `claims.${index}.value`;
}

/** The tender's terms and the engine's input rules, checked before any claim is evaluated. */
export function prepareOffer(tender: TenderTerms, input: OfferTerms): PreparedOffer {
  const fieldErrors = termsErrors(tender, input);
  if (Object.keys(fieldErrors).length > 0) return { ok: false, fieldErrors };
  const claims: PreparedClaim[] = [];
  input.claims.forEach((claim, i) => {
    const point = tender.operatingPoints[claim.pointIndex];
    const parsed = claimSchema.safeParse(claimInputFor(tender.channelModel, point.value, input.code, claim));
    if (!parsed.success) {
      for (const issue of parsed.error.issues) (fieldErrors[fieldOf(issue.path, i, claim.metric)] ??= []).push(issue.message);
      return;
    }
    claims.push({ claim, point, input: parsed.data });
  });
  if (Object.keys(fieldErrors).length > 0) return { ok: false, fieldErrors };
  return { ok: true, claims: claims.sort((a, b) => a.claim.pointIndex - b.claim.pointIndex) };
}

/** A prepared claim with the engine's result, or with the reason it has none (stored as needing evidence). */
export function evaluatedClaim({ claim, point }: PreparedClaim, outcome: ClaimResult | { engineError: string }): EvaluatedClaim {
  const result: ClaimResult | UnfinishedResult =
    "engineError" in outcome
      ? {
          verdict: "needs-evidence",
          findings: [{ code: "engine-unfinished", severity: "gap", message: outcome.engineError, source: "Ratecourt: the bounds engine's time limit per request" }],
          engineError: outcome.engineError,
          engineVersion: ENGINE_VERSION,
        }
      : outcome;
  return {
    pointIndex: claim.pointIndex,
    pointLabel: point.label,
    channelValue: point.value,
    metric: claim.metric,
    value: claim.value,
    ncgOutputBer: claim.metric === "ncg" ? (claim.ncgOutputBer ?? null) : null,
    verdict: result.verdict,
    result,
    engineVersion: result.engineVersion,
  };
}

/** The whole offer evaluated here and now (the demo data; requests use the worker pool instead). */
export function evaluateOffer(tender: TenderTerms, input: OfferTerms): Evaluation {
  const prepared = prepareOffer(tender, input);
  if (!prepared.ok) return prepared;
  return { ok: true, claims: prepared.claims.map((item) => evaluatedClaim(item, evaluateClaim(item.input))) };
}

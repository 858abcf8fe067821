import { claimSchema, ENGINE_VERSION, evaluateClaim, type ClaimInput, type ClaimResult } from "@/lib/bounds";
import { claimInputFor, type ClaimMetric, type OfferClaim, type OfferCode } from "./claim-input";
import { curvePointInput, impliedEbn0Db, radioClaim, sensitivityClaimInput, type RadioClaim, type SensitivityStatement, type SensitivityTerms } from "./radio";
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
  /** On a point stated in dBm: the sensitivity line and its curve, each judged; the verdict above is their worst. */
  radio: RadioClaim | null;
}

export interface OfferTerms {
  code: OfferCode;
  claims: (OfferClaim & { pointIndex: number; sensitivity?: SensitivityStatement | null })[];
  envelope: { currency: string };
}

/** One claim of an offer, ready for the engine (a sensitivity claim also with one input per curve point). */
export interface PreparedClaim {
  claim: OfferClaim & { pointIndex: number; sensitivity?: SensitivityStatement | null };
  point: TenderTerms["operatingPoints"][number];
  input: ClaimInput;
  radio?: { terms: SensitivityTerms; statement: SensitivityStatement; curve: ClaimInput[] };
}

export type PreparedOffer = { ok: true; claims: PreparedClaim[] } | { ok: false; fieldErrors: Record<string, string[]> };
export type Evaluation = { ok: true; claims: EvaluatedClaim[] } | { ok: false; fieldErrors: Record<string, string[]> };

/** Where an engine input error belongs on the offer form: code fields on the code, the rest on the claim. */
function fieldOf(path: PropertyKey[], index: number, metric: ClaimMetric): string {
  if (path[0] === "code") return path.length > 1 ? `code.${String(path[1])}` : "code.k";
  if (metric === "ncg" && path[0] === "target") return `claims.${index}.ncgOutputBer`;
  return `claims.${index}.value`;
}

/** Where an engine input error of a sensitivity claim belongs: the level, noise figure, n and k, or a curve point. */
function radioFieldOf(path: PropertyKey[], index: number, curvePoint: number | null): string {
  const base = `claims.${index}.sensitivity`;
  if (curvePoint !== null) return `${base}.curve.${curvePoint}.${path[0] === "target" ? "value" : "x"}`;
  if (path[0] === "code") return `${base}.${path[1] === "n" ? "n" : "k"}`;
  if (path[0] === "channel" && path[1] === "noiseFigureDb") return `${base}.noiseFigureDb`;
  if (path[0] === "target") return `claims.${index}.value`;
  return `${base}.dbm`;
}

/** The buyer's terms of a point stated in dBm, or null for any other point. */
export function sensitivityTerms(tender: Pick<TenderTerms, "assumedNoiseFigureDb">, point: TenderTerms["operatingPoints"][number]): SensitivityTerms | null {
  if (!point.sensitivity) return null;
  return { requiredDbm: point.value, ...point.sensitivity, assumedNoiseFigureDb: tender.assumedNoiseFigureDb ?? 0 };
}

/** The tender's terms and the engine's input rules, checked before any claim is evaluated. */
export function prepareOffer(tender: TenderTerms, input: OfferTerms): PreparedOffer {
  const fieldErrors = termsErrors(tender, input);
  if (Object.keys(fieldErrors).length > 0) return { ok: false, fieldErrors };
  const claims: PreparedClaim[] = [];
  input.claims.forEach((claim, i) => {
    const point = tender.operatingPoints[claim.pointIndex];
    const terms = sensitivityTerms(tender, point);
    if (terms && claim.sensitivity) {
      const statement = claim.sensitivity;
      const check = (engineInput: ClaimInput, curvePoint: number | null) => {
        const parsed = claimSchema.safeParse(engineInput);
        if (parsed.success) return parsed.data;
        for (const issue of parsed.error.issues) (fieldErrors[radioFieldOf(issue.path, i, curvePoint)] ??= []).push(issue.message);
        return null;
      };
      const line = check(sensitivityClaimInput(terms, statement, claim.value), null);
      const curve = (statement.curve ?? []).map((p, j) => check(curvePointInput(terms, statement, p), j));
      if (line && curve.every((c): c is ClaimInput => c !== null)) claims.push({ claim, point, input: line, radio: { terms, statement, curve } });
      return;
    }
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

export type EngineOutcome = ClaimResult | { engineError: string };

/** An engine result, or what is stored for one the engine did not finish. */
function stored(outcome: EngineOutcome): ClaimResult | UnfinishedResult {
  return "engineError" in outcome
    ? {
        verdict: "needs-evidence",
        findings: [
          { code: "engine-unfinished", severity: "gap", message: outcome.engineError, source: "Ratecourt: the bounds engine's time limit per request" },
        ],
        engineError: outcome.engineError,
        engineVersion: ENGINE_VERSION,
      }
    : outcome;
}

/**
 * A prepared claim with the engine's result, or with the reason it has none (stored as needing
 * evidence). A sensitivity claim also takes its curve points' outcomes: the claim's verdict is the
 * worst of the line and the curve, and its channel value the Eb/N0 the line amounts to.
 */
export function evaluatedClaim({ claim, point, radio }: PreparedClaim, outcome: EngineOutcome, curveOutcomes: readonly EngineOutcome[] = []): EvaluatedClaim {
  const result = stored(outcome);
  const judged = radio ? radioClaim(radio.terms, radio.statement, result, curveOutcomes.map(stored)) : null;
  const channelValue = radio ? impliedEbn0Db(radio.statement.dbm, radio.terms.bitRate, radio.statement.noiseFigureDb ?? 0) : point.value;
  return {
    pointIndex: claim.pointIndex,
    pointLabel: point.label,
    channelValue,
    metric: claim.metric,
    value: claim.value,
    ncgOutputBer: claim.metric === "ncg" ? (claim.ncgOutputBer ?? null) : null,
    verdict: judged ? judged.worst.verdict : result.verdict,
    result,
    engineVersion: result.engineVersion,
    radio: judged,
  };
}

/** The whole offer evaluated here and now (the demo data; requests use the worker pool instead). */
export function evaluateOffer(tender: TenderTerms, input: OfferTerms): Evaluation {
  const prepared = prepareOffer(tender, input);
  if (!prepared.ok) return prepared;
  return {
    ok: true,
    claims: prepared.claims.map((item) =>
      evaluatedClaim(
        item,
        evaluateClaim(item.input),
        (item.radio?.curve ?? []).map((c) => evaluateClaim(c)),
      ),
    ),
  };
}

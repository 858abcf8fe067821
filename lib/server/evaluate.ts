import "server-only";
import { claimSchema, formatClaimError, type ClaimResult } from "@/lib/bounds";
import { fieldErrorsOf } from "@/lib/validation/messages";
import { describeClaim, inEngine } from "./engine";
import { authorize, type Viewer } from "./session";
import { InputError } from "./errors";

export const MAX_CLAIMS_PER_REQUEST = 1000;

/**
 * One claim, or an array of up to 1,000, judged by the bounds engine in the worker pool; every bad
 * claim is named by its position, and so is a claim the engine could not finish in time.
 */
export async function evaluateClaims(viewer: Viewer, body: unknown): Promise<ClaimResult | ClaimResult[]> {
  authorize(viewer, "use", "Bounds");
  if (!Array.isArray(body)) {
    const parsed = claimSchema.safeParse(body);
    if (!parsed.success) throw new InputError(formatClaimError(parsed.error), fieldErrorsOf(parsed.error));
    const [result] = await inEngine(
      "claims",
      [parsed.data],
      () => `this claim (${describeClaim(parsed.data)})`,
      "It has no verdict: check its values for an extreme channel value, block length or target.",
    );
    return result;
  }
  if (body.length === 0) throw new InputError("Send one claim, or an array of 1 to 1000 claims.");
  if (body.length > MAX_CLAIMS_PER_REQUEST) {
    throw new InputError(`At most ${MAX_CLAIMS_PER_REQUEST} claims per request; this one has ${body.length}.`);
  }
  const problems: string[] = [];
  const fieldErrors: Record<string, string[]> = {};
  const claims = body.map((item, index) => {
    const parsed = claimSchema.safeParse(item);
    if (parsed.success) return parsed.data;
    problems.push(`[${index}] ${formatClaimError(parsed.error)}`);
    for (const [path, messages] of Object.entries(fieldErrorsOf(parsed.error))) fieldErrors[`${index}.${path}`] = messages;
    return null;
  });
  if (problems.length > 0) throw new InputError(problems.slice(0, 20).join("; "), fieldErrors);
  const valid = claims.map((claim) => claim!);
  return inEngine(
    "claims",
    valid,
    (error) => (error.started ? `claim [${error.done}] (${describeClaim(valid[error.done])})` : `these ${valid.length} claims`),
    "No verdicts are returned for this batch: send that claim on its own, or leave it out.",
  );
}

import "server-only";
import { claimSchema, evaluateClaim, formatClaimError, type ClaimResult } from "@/lib/bounds";
import { fieldErrorsOf } from "@/lib/validation/messages";
import { authorize, type Viewer } from "./session";
import { InputError } from "./errors";

export const MAX_CLAIMS_PER_REQUEST = 1000;

/** One claim, or an array of up to 1,000, judged by the bounds engine; every bad claim is named by its position. */
export function evaluateClaims(viewer: Viewer, body: unknown): ClaimResult | ClaimResult[] {
  authorize(viewer, "use", "Bounds");
  if (!Array.isArray(body)) {
    const parsed = claimSchema.safeParse(body);
    if (!parsed.success) throw new InputError(formatClaimError(parsed.error), fieldErrorsOf(parsed.error));
    return evaluateClaim(parsed.data);
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
  return claims.map((claim) => evaluateClaim(claim!));
}

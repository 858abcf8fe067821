// The rules a safety-relevant tender brings; its caution text lives in lib/cautions.ts.
import { SAFETY_CAUTION } from "@/lib/cautions";

/** Every notice about a safety-relevant tender ends with the stronger caution; others are left as they are. */
export function withSafetyCaution<N extends { text: string }>(tender: { safetyRelevant: boolean }, notices: N[]): N[] {
  return tender.safetyRelevant ? notices.map((n) => ({ ...n, text: `${n.text}\n\n${SAFETY_CAUTION}` })) : notices;
}

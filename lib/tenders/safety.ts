// The stronger caution of a safety-relevant tender, and the rules it brings, in one place.

/** Carried by the memo, the notices and the Sign-off and Review tabs of a safety-relevant tender. */
export const SAFETY_CAUTION =
  "Safety-relevant tender: these radios serve a safety use. The verdicts and lab runs here do not establish fitness for that use; qualification testing, the local codes and licensed professional practice decide it. Every accepted claim needs a lab run that verifies it, and two engineers sign the technical evaluation.";

/** Every notice about a safety-relevant tender ends with the stronger caution; others are left as they are. */
export function withSafetyCaution<N extends { text: string }>(tender: { safetyRelevant: boolean }, notices: N[]): N[] {
  return tender.safetyRelevant ? notices.map((n) => ({ ...n, text: `${n.text}\n\n${SAFETY_CAUTION}` })) : notices;
}

/** Beside every sensitivity figure and its verdict (offer, claim page, comparison, memo). */
export const SENSITIVITY_CAUTION =
  "Measured sensitivity depends on the test conditions (conducted or radiated, temperature, interference); the verdict judges only the physical limit the stated figures imply, not how the module was measured.";

// The stronger caution of a safety-relevant tender, and the rules it brings, in one place.

/** Carried by the memo, the notices and the Sign-off and Review tabs of a safety-relevant tender. */
export const SAFETY_CAUTION =
  "Safety-relevant tender: these radios serve a safety use. The verdicts and lab runs here do not establish fitness for that use; qualification testing, the local codes and licensed professional practice decide it. Every accepted claim needs a lab run that verifies it, and two engineers sign the technical evaluation.";

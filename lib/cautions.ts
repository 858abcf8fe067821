// The cautions Ratecourt prints (PRODUCT.md, "Cautions the product shows"): each text once, for the
// pages, the e-mails and the memo alike.

/** Every page that shows verdicts or memos carries it. */
export const CAUTIONS =
  "Verdicts judge coding claims against mathematical limits; they do not certify a module's radio-regulatory approval, safety, or fitness for life-safety or medical use, and they do not replace qualification testing. Awards follow your organisation's purchasing policy and the procurement law that applies to it.";

/** Carried by the memo, the notices and the Sign-off and Review tabs of a safety-relevant tender. */
export const SAFETY_CAUTION =
  "Safety-relevant tender: these radios serve a safety use. The verdicts and lab runs here do not establish fitness for that use; qualification testing, the local codes and licensed professional practice decide it. Every accepted claim needs a lab run that verifies it, and two engineers sign the technical evaluation.";

/** Beside every sensitivity figure and its verdict (offer, claim page, comparison, memo). */
export const SENSITIVITY_CAUTION =
  "Measured sensitivity depends on the test conditions (conducted or radiated, temperature, interference); the verdict judges only the physical limit the stated figures imply, not how the module was measured.";

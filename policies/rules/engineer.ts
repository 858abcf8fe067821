import { tenderAccess, type Actor } from "../actor";
import type { RuleBuilder } from "../types";
import { declarationRules, envelopeFields, READ } from "./shared";

/**
 * Claims and verdicts of the tenders declared on, never a price. Conflicts with particular
 * vendors are applied last, for the whole person (see personalRules).
 */
export function engineerRules(builder: RuleBuilder, actor: Actor): void {
  const { can, cannot } = builder;
  const { declared, clean } = tenderAccess(actor.declarations);

  can([...READ], "Tender", { state: { $ne: "draft" } });
  declarationRules(builder, actor);

  if (declared.length > 0) {
    const inDeclared = { tenderId: { $in: declared } };
    can([...READ], ["Offer", "Claim", "Document", "Mark", "Thread", "EvidenceRun", "TechnicalSignoff"], inDeclared);
    can("mark", "Claim", inDeclared);
    can("record", "EvidenceRun", inDeclared);
    // "update" is closing a question with a reason.
    can(["create", "post", "update"], "Thread", inDeclared);
    // An answer that matters to every bidder goes out as an addendum.
    can(["create", ...READ], "Addendum", inDeclared);
  }
  // Signing covers every vendor of the tender, so a conflict with any one of them rules it out.
  if (clean.length > 0) can("sign", "TechnicalSignoff", { tenderId: { $in: clean } });

  // Price-blind evaluation. A buyer or approver role held by the same person is built after
  // this and may lift it, but only for envelopes already opened, i.e. after the sign-off.
  cannot([...READ], "Offer", envelopeFields()).because("The technical evaluation is price-blind");
}

import { tenderAccess, type Actor } from "../actor";
import type { RuleBuilder } from "../types";
import { declarationRules, READ, sealedUntilOpened } from "./shared";

/** Reads what a decision needs on the tenders declared on; approves within the limit. */
export function approverRules(builder: RuleBuilder, actor: Actor): void {
  const { can } = builder;
  const { declared, clean } = tenderAccess(actor.declarations);

  can([...READ], ["Tender", "ApprovalLimit"]);
  declarationRules(builder, actor);

  if (declared.length > 0) {
    const inDeclared = { tenderId: { $in: declared } };
    can(
      [...READ],
      ["Offer", "Claim", "Document", "Mark", "EvidenceRun", "TechnicalSignoff", "Score", "Recommendation", "Approval", "Memo", "Ledger"],
      inDeclared,
    );
    can([...READ], "Envelope", { ...inDeclared, opened: true });
    can("export", "Memo", inDeclared);
  }
  sealedUntilOpened(builder);

  // Only tenders declared on without any conflict; segregation of duties is in personalRules.
  if (clean.length > 0 && actor.approvalLimit !== null) {
    can(["approve", "return"], "Approval", {
      tenderId: { $in: clean },
      value: { $lte: actor.approvalLimit },
    });
  }
}

import type { Actor } from "../actor";
import type { RuleBuilder } from "../types";
import { CANCELLABLE_STATES } from "../vocabulary";
import { READ, sealedUntilOpened } from "./shared";

/** Runs tenders, opens envelopes after the sign-off, compares and recommends; never approves. */
export function buyerRules(builder: RuleBuilder, actor: Actor): void {
  const { can } = builder;

  can([...READ], "Tender");
  can("create", "Tender", { createdBy: actor.id, state: "draft" });
  // Requirements, weights and invitations change only in draft: weights lock when it opens.
  can(["update", "open"], "Tender", { state: "draft" });
  can("cancel", "Tender", { state: { $in: [...CANCELLABLE_STATES] } });
  can(["openEnvelopes", "recommend"], "Tender", { state: "commercial" });

  // Every offer's claims, verdicts, documents, marks and lab runs.
  can(
    [...READ],
    [
      "Offer",
      "Claim",
      "Document",
      "Mark",
      "EvidenceRun",
      "TechnicalSignoff",
      "Declaration",
      "Score",
      "Recommendation",
      "Approval",
      "ApprovalLimit",
      "Ledger",
      "Memo",
      "Objection",
      "Addendum",
    ],
  );
  can("create", "Addendum");
  // Answering a vendor's objection to an award.
  can("update", "Objection");
  can([...READ], "Envelope", { opened: true });
  sealedUntilOpened(builder);
  can("export", ["Score", "Memo"]);
  can("create", "Recommendation", { preparedBy: actor.id });
  can("update", "Recommendation", { preparedBy: actor.id });
  // Any buyer frees a recommendation stuck in approval, even one a colleague prepared.
  can("withdraw", "Recommendation");

  // To invite vendors.
  can([...READ], "Organisation", { kind: "vendor" });
}

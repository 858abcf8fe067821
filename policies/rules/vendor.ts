import type { Actor } from "../actor";
import type { RuleBuilder } from "../types";
import { READ } from "./shared";

/** A vendor organisation's member reaches only its own organisation's records. */
export function vendorRules({ can }: RuleBuilder, actor: Actor): void {
  const own = { vendorOrgId: actor.organisationId };
  const ownWhileOpen = { ...own, tenderState: "open" as const };

  can([...READ], "Tender", { invitedOrgIds: actor.organisationId, state: { $ne: "draft" } });
  // Their own offers with every field of the envelope, their verdicts, documents, threads, marks.
  can([...READ], ["Offer", "Envelope", "Claim", "Document", "Thread", "Mark"], own);
  // The offer form writes module, code, claims and sealed envelope together, before closing.
  can(["create", "update", "submit", "withdraw"], "Offer", ownWhileOpen);
  can("create", "Document", ownWhileOpen);
  can("post", "Thread", own);
  // Addenda of the tenders it is invited to, acknowledged before it submits; objections to an award.
  can([...READ, "acknowledge"], "Addendum", { invitedOrgIds: actor.organisationId });
  can(["create", ...READ], "Objection", own);
}

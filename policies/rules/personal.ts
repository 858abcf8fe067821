import { tenderAccess, type Actor } from "../actor";
import type { RuleBuilder } from "../types";
import { OFFER_RECORDS } from "./shared";

/**
 * Restrictions on the person rather than a role, built last so that they override every
 * role the person holds: declared conflicts of interest and segregation of duties.
 */
export function personalRules({ cannot }: RuleBuilder, actor: Actor): void {
  const { conflicts } = tenderAccess(actor.declarations);

  for (const [tenderId, vendorOrgIds] of conflicts) {
    cannot("manage", [...OFFER_RECORDS], { tenderId, vendorOrgId: { $in: vendorOrgIds } }).because(
      "You declared a conflict of interest with this vendor on this tender",
    );
  }
  if (conflicts.size > 0) {
    const conflicted = { tenderId: { $in: [...conflicts.keys()] } };
    const reason = "You declared a conflict of interest on this tender";
    cannot("sign", "TechnicalSignoff", conflicted).because(reason);
    cannot(["approve", "return"], "Approval", conflicted).because(reason);
  }

  cannot(["approve", "return"], "Approval", { recommendationPreparedBy: actor.id }).because("No one approves a recommendation they prepared");
  cannot(["approve", "return"], "Approval", { tenderCreatedBy: actor.id }).because("No one approves the award of a tender they created");
}

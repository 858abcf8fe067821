import "server-only";
import { asSubject, recordTenderState } from "@/policies";
import type { TenderWithInvites } from "@/lib/server/tenders";
import type { Viewer } from "@/lib/server/session";

export interface TenderTab {
  href: string;
  label: string;
}

/**
 * The tabs of a tender page this viewer can use, from the same abilities the server enforces
 * (hiding only: each tab's page and its data authorise themselves). A draft has only its
 * requirements and, for the buying team, its ledger.
 */
export function tenderTabs(viewer: Viewer, tender: TenderWithInvites): TenderTab[] {
  const { ability, actor } = viewer;
  const tenderId = tender.id;
  const base = `/tenders/${tenderId}`;
  const internal = actor.organisationKind === "buyer";
  const roles = actor.roles;
  const started = tender.state !== "draft";
  const tabs: TenderTab[] = [{ href: base, label: "Requirements" }];

  // Buyers read every offer; engineers and approvers once declared; a vendor its own offer.
  const offers = ability.can(
    "read",
    asSubject("Offer", {
      id: "",
      tenderId,
      vendorOrgId: internal ? "" : actor.organisationId,
      tenderState: recordTenderState(tender),
      envelopeOpened: tender.envelopesOpenedAt !== null,
    }),
  );
  if (started && offers) tabs.push({ href: `${base}/offers`, label: "Offers" });
  // A vendor's own form: its verdicts, versions and documents (the form itself refuses after closing).
  if (started && !internal && roles.includes("vendor")) tabs.push({ href: `${base}/offer`, label: "Your offer" });

  // Engineers reach the bench before declaring (it asks for the declaration); buyers follow the marks.
  const marks = ability.can("read", asSubject("Mark", { claimId: "", tenderId, vendorOrgId: "" }));
  if (started && internal && (roles.includes("engineer") || marks)) tabs.push({ href: `${base}/review`, label: "Review" });

  if (started && ability.can("read", asSubject("Score", { tenderId }))) tabs.push({ href: `${base}/comparison`, label: "Comparison" });

  // Approvers declare on the Sign-off tab, so the role alone shows it.
  const approvals = ability.can("read", asSubject("Approval", { tenderId, recommendationPreparedBy: "", value: 0, tenderCreatedBy: tender.createdBy }));
  if (started && (roles.includes("approver") || approvals)) tabs.push({ href: `${base}/sign-off`, label: "Sign-off" });

  // Addenda to every bidder; after the award, the standstill period and objections.
  const notices =
    ability.can("read", asSubject("Addendum", { tenderId, invitedOrgIds: tender.invitedOrgIds })) ||
    ability.can("read", asSubject("Objection", { tenderId, vendorOrgId: actor.organisationId }));
  if (started && notices) tabs.push({ href: `${base}/notices`, label: "Notices" });

  if (ability.can("read", asSubject("Ledger", { tenderId }))) tabs.push({ href: `${base}/ledger`, label: "Ledger" });
  return tabs;
}

import { formatMoney } from "@/lib/format";
import type { TenderState } from "@/policies/vocabulary";
import type { BandRule } from "./bands";

/** Whether an approver's limit reaches a recommendation under its band rule. */
export function limitCovers(limit: number | null, value: number, rule: BandRule): boolean {
  return limit !== null && limit >= value && limit >= rule.minApproverLimit;
}

export interface ApprovalFacts {
  approverId: string;
  roles: readonly string[];
  approvalLimit: number | null;
  /** The approver has a conflict-of-interest declaration on this tender. */
  declared: boolean;
  /** That declaration names at least one vendor. */
  conflicted: boolean;
  tenderCreatedBy: string;
  preparedBy: string;
  value: number;
  currency: string;
  rule: BandRule;
}

/**
 * Why this person may not approve or return the recommendation, in words (a 403), or null.
 * The policies enforce the same rules; this names the one that applies.
 */
export function approvalRefusal(f: ApprovalFacts): string | null {
  const money = (v: number) => formatMoney(v, f.currency);
  if (!f.roles.includes("approver")) return "Only approvers approve or return a recommendation.";
  if (f.preparedBy === f.approverId) return "No one approves a recommendation they prepared.";
  if (f.tenderCreatedBy === f.approverId) return "No one approves the award of a tender they created.";
  if (!f.declared) return "Declare any conflict of interest on this tender before you decide on its award.";
  if (f.conflicted) return "You declared a conflict of interest on this tender, so you cannot decide on its award.";
  if (f.approvalLimit === null) return "You hold no approval limit; ask an admin to set one.";
  if (f.approvalLimit < f.value) {
    return `Your approval limit of ${money(f.approvalLimit)} does not cover this award of ${money(f.value)}.`;
  }
  if (f.approvalLimit < f.rule.minApproverLimit) {
    return `Awards of this value need approvers with a limit of at least ${money(f.rule.minApproverLimit)}; yours is ${money(f.approvalLimit)}.`;
  }
  return null;
}

export interface DecisionState {
  tenderState: TenderState;
  /** The recommendation awaiting decision, if any. */
  pending: boolean;
  approverId: string;
  /** Who already approved this recommendation. */
  approvedBy: readonly string[];
}

/** Why no decision can be taken now (a 409), or null. */
export function decisionProblem(s: DecisionState): string | null {
  if (s.tenderState === "awarded") return "The tender is already awarded; its record is read-only.";
  if (s.tenderState !== "approval" || !s.pending) return "There is no recommendation awaiting approval on this tender.";
  if (s.approvedBy.includes(s.approverId)) {
    return "You have already approved this recommendation; the same person cannot give two of the approvals its band needs.";
  }
  return null;
}

export function isFullyApproved(approvalsGiven: number, rule: BandRule): boolean {
  return approvalsGiven >= rule.approvalsNeeded;
}

/** The memo's identifier, printed on every page: "RC-2027-001-M1". */
export function memoIdentifier(reference: string, sequence = 1): string {
  return `${reference}-M${sequence}`;
}

import "server-only";
import { asSubject } from "@/policies";
import type { Queryable } from "@/db/client";
import type { BandRule } from "@/lib/approvals/bands";
import { declareToReadNotice, type NoticeText } from "@/lib/approvals/notices";
import { approvalRecord, eligibleApprovers } from "./approvals";
import { readersWithRole, type Notice } from "./notify";
import type { RecommendationRow } from "./recommendations";
import type { TenderRow } from "./tenders";

/**
 * "Awaits your approval" by the reading rules. Of the approvers the recommendation is routed to
 * (limit, band, no conflict, not the preparer or the tender's creator) and who have not decided yet,
 * those who may decide now (declared without conflict) get the full notice (vendor, value, reasons);
 * the others get a prompt to declare that says nothing of the recommendation. A conflicted approver,
 * or one whose limit does not cover it, gets nothing; with no band covering the value, nobody does.
 */
export async function approvalRequestNotices(
  db: Queryable,
  tender: TenderRow,
  rec: RecommendationRow,
  rule: BandRule | null,
  full: NoticeText,
  decided: string[] = [],
): Promise<Notice[]> {
  if (!rule) return [];
  const routed = (await eligibleApprovers(db, tender, rec, rule)).filter((u) => !decided.includes(u.id)).map((u) => u.email);
  const approval = asSubject("Approval", approvalRecord(tender, rec));
  const cleared = new Set(await readersWithRole(db, "approver", (ability) => ability.can("approve", approval)));
  return [
    { to: routed.filter((email) => cleared.has(email)), ...full },
    { to: routed.filter((email) => !cleared.has(email)), ...declareToReadNotice(tender) },
  ];
}

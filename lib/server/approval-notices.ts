import "server-only";
import { asSubject } from "@/policies";
import type { Queryable } from "@/db/client";
import type { BandRule } from "@/lib/approvals/bands";
import { declareToReadNotice, type AwardDisclosure, type NoticeText } from "@/lib/approvals/notices";
import type { Standing } from "@/lib/approvals/score-sheet";
import { standstillEnd } from "@/lib/tenders/disclosure";
import { approvalRecord, eligibleApprovers, type RecommendationRow } from "./approval-coverage";
import { readersWithRole, type Notice } from "./notify";
import type { TenderRow } from "./tenders";

// The notices of the approval and award that depend on who may read what.

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

/** What the award notices of this tender disclose, and when its standstill period ends. */
export function awardDisclosure(tender: TenderRow, winnerName: string, winner: Standing | null, awardedAt: Date): AwardDisclosure {
  const at = tender.awardedAt ?? awardedAt;
  return {
    mode: tender.noticeDisclosure,
    winnerName,
    winnerTotal: winner?.total ?? null,
    standstillDays: tender.standstillDays,
    standstillEnds: standstillEnd(at, tender.standstillDays),
    zone: tender.closesZone,
  };
}

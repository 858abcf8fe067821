import "server-only";
import { withSafetyCaution } from "@/lib/tenders/safety";
import { and, eq, inArray } from "drizzle-orm";
import { asSubject } from "@/policies";
import { getDb, type Queryable } from "./database";
import { approvals, offers, organisations, recommendations, tenders, users } from "@/db/schema";
import type { BandRule } from "@/lib/approvals/bands";
import * as words from "@/lib/approvals/notices";
import { governingValue } from "@/lib/approvals/award-value";
import { approvalRefusal, decisionProblem, isFullyApproved } from "@/lib/approvals/routing";
import { rankedCount, standingsOf } from "@/lib/approvals/score-sheet";
import { formatMoney } from "@/lib/format";
import type { DecisionInput } from "@/lib/validation/approvals";
import { approvalRecord, ruleFor, storedRule } from "./approval-coverage";
import { ConflictError, ForbiddenError } from "./errors";
import { appendLedger } from "./ledger";
import { approvalsGiven, issueMemo, type MemoRow } from "./memos";
import { approvalRequestNotices, awardDisclosure } from "./approval-notices";
import { addressesOf, notify, type Notice } from "./notify";
import { checkpointNow, withLedgerHead } from "./ledger-anchors";
import { getCurrentRecommendation, type RecommendationRow } from "./recommendations";
import { authorize, ledgerActor, type Viewer } from "./session";
import { getTender, type TenderRow } from "./tenders";

/** Why this viewer may not decide on the recommendation, in words, or null. */
export function refusalFor(viewer: Viewer, tender: TenderRow, rec: RecommendationRow, rule: BandRule): string | null {
  const mine = viewer.actor.declarations.filter((d) => d.tenderId === tender.id);
  return approvalRefusal({
    approverId: viewer.actor.id,
    roles: viewer.actor.roles,
    approvalLimit: viewer.actor.approvalLimit,
    declared: mine.length > 0,
    conflicted: mine.some((d) => d.conflictedVendorOrgIds.length > 0),
    tenderCreatedBy: tender.createdBy,
    preparedBy: rec.preparedBy,
    value: governingValue(rec),
    currency: rec.currency,
    rule,
  });
}

const isUniqueViolation = (error: unknown): boolean =>
  error instanceof Error && (/approvals_once_idx|duplicate key/.test(error.message) || isUniqueViolation(error.cause));

type Outcome =
  { kind: "returned"; comment: string } | { kind: "approved"; given: number; needed: number; approvedBy: string[] } | { kind: "awarded"; memo: MemoRow };

/**
 * Approves or returns the recommendation awaiting approval. Refusals (403: limits, segregation of
 * duties, conflicts; 409: wrong state, a second approval by the same person) change nothing. The
 * final approval awards the tender and issues the memo in the same transaction.
 */
export async function decideRecommendation(viewer: Viewer, tenderId: string, input: DecisionInput) {
  const tender = await getTender(viewer, tenderId);
  const db = await getDb();
  const rec = await getCurrentRecommendation(db, tenderId);
  const waiting = rec !== null && rec.status === "pending" && tender.state === "approval";
  if (!waiting) throw new ConflictError(decisionProblem({ tenderState: tender.state, pending: false, approverId: viewer.actor.id, approvedBy: [] })!);
  const rule = await ruleFor(db, rec);
  const refusal = refusalFor(viewer, tender, rec, rule);
  if (refusal) throw new ForbiddenError(refusal);
  authorize(viewer, input.decision, asSubject("Approval", approvalRecord(tender, rec)));
  const actor = ledgerActor(viewer);
  const now = new Date();

  const outcome = await db
    .transaction(async (tx): Promise<Outcome> => {
      const [locked] = await tx.select().from(tenders).where(eq(tenders.id, tenderId)).for("update");
      const [current] = await tx.select().from(recommendations).where(eq(recommendations.id, rec.id)).for("update");
      const approvedBy = (await approvalsGiven(tx, rec.id)).map((a) => a.approverId);
      const problem = decisionProblem({ tenderState: locked.state, pending: current.status === "pending", approverId: viewer.actor.id, approvedBy });
      if (problem) throw new ConflictError(problem);
      if (!storedRule(current)) await tx.update(recommendations).set(rule).where(eq(recommendations.id, rec.id));
      const decision = input.decision === "approve" ? "approved" : "returned";
      const [row] = await tx
        .insert(approvals)
        .values({ recommendationId: rec.id, tenderId, approverId: viewer.actor.id, decision, comment: input.comment, decidedAt: now })
        .returning();
      const base = { tenderId, actor, subjectId: row.id, subjectType: "Approval" };

      if (input.decision === "return") {
        await tx.update(recommendations).set({ status: "returned" }).where(eq(recommendations.id, rec.id));
        await tx.update(tenders).set({ state: "commercial" }).where(eq(tenders.id, tenderId));
        await appendLedger(tx, {
          ...base,
          action: "recommendation.returned",
          data: { recommendationId: rec.id, from: "approval", to: "commercial", comment: input.comment },
        });
        return { kind: "returned", comment: input.comment };
      }
      const given = approvedBy.length + 1;
      await appendLedger(tx, {
        ...base,
        action: "approval.given",
        data: { recommendationId: rec.id, value: rec.value, currency: rec.currency, approvals: given, needed: rule.approvalsNeeded, comment: input.comment },
      });
      if (!isFullyApproved(given, rule)) return { kind: "approved", given, needed: rule.approvalsNeeded, approvedBy: [...approvedBy, viewer.actor.id] };

      await tx.update(recommendations).set({ status: "approved" }).where(eq(recommendations.id, rec.id));
      const [awarded] = await tx.update(tenders).set({ state: "awarded", awardedAt: now }).where(eq(tenders.id, tenderId)).returning();
      const memo = await issueMemo(tx, awarded, { ...current, ...rule, status: "approved" }, now);
      await appendLedger(tx, {
        tenderId,
        actor,
        action: "tender.awarded",
        subjectType: "Tender",
        subjectId: tenderId,
        data: {
          from: "approval",
          to: "awarded",
          recommendationId: rec.id,
          offerId: rec.offerId,
          value: rec.value,
          currency: rec.currency,
          memo: memo.identifier,
          sha256: memo.sha256,
        },
      });
      return { kind: "awarded", memo };
    })
    .catch((error: unknown) => {
      if (isUniqueViolation(error))
        throw new ConflictError("You have already decided on this recommendation; the same person cannot give two of the approvals its band needs.");
      throw error;
    });

  // Each award is anchored at once: its entries can no longer be cut off the end without trace.
  if (outcome.kind === "awarded") await checkpointNow(db, "award");
  notify(await withLedgerHead(db, withSafetyCaution(tender, await decisionNotices(db, viewer, tender, { ...rec, ...rule }, rule, outcome))));
  return outcome;
}

async function emailOf(db: Queryable, userId: string): Promise<string[]> {
  const [u] = await db
    .select({ email: users.email })
    .from(users)
    .where(and(eq(users.id, userId), eq(users.active, true)));
  return u ? [u.email] : [];
}

async function decisionNotices(db: Queryable, viewer: Viewer, tender: TenderRow, rec: RecommendationRow, rule: BandRule, outcome: Outcome): Promise<Notice[]> {
  const buyer = await emailOf(db, rec.preparedBy);
  if (outcome.kind === "returned") return [{ to: buyer, ...words.returnedNotice(tender, viewer.name, outcome.comment) }];
  if (outcome.kind === "approved") {
    const awaiting = words.awaitingApprovalNotice(tender, outcome.given, outcome.needed, formatMoney(rec.value, rec.currency));
    return [
      { to: buyer, ...words.approvalGivenNotice(tender, viewer.name, outcome.given, outcome.needed) },
      ...(await approvalRequestNotices(db, tender, rec, rule, awaiting, outcome.approvedBy)),
    ];
  }
  return awardNotices(db, tender, rec, outcome.memo);
}

/** The award's e-mails: the buyer, the winning vendor (award notice), every other vendor with an offer (regret notice with only its own scores). */
export async function awardNotices(db: Queryable, tender: TenderRow, rec: RecommendationRow, memo: MemoRow): Promise<Notice[]> {
  const current = await db
    .select({ offerId: offers.id, vendorOrgId: offers.vendorOrgId, moduleName: offers.moduleName, vendorName: organisations.name })
    .from(offers)
    .innerJoin(organisations, eq(organisations.id, offers.vendorOrgId))
    .where(and(eq(offers.tenderId, tender.id), inArray(offers.status, ["submitted"])));
  const winnerOffer = (await db.select().from(offers).where(eq(offers.id, rec.offerId)))[0];
  const winner = current.find((o) => o.vendorOrgId === winnerOffer.vendorOrgId) ?? { ...winnerOffer, vendorName: "", offerId: winnerOffer.id };
  const standings = standingsOf(rec.scoreSheet);
  const disclosure = awardDisclosure(tender, winner.vendorName, standings.find((x) => x.offerId === rec.offerId) ?? null, memo.createdAt);
  const notices: Notice[] = [
    {
      to: await emailOf(db, rec.preparedBy),
      ...words.awardedNotice(tender, winner.vendorName, formatMoney(rec.value, rec.currency), memo.identifier, memo.sha256),
    },
    {
      to: await addressesOf(db, [winner.vendorOrgId], "vendor"),
      ...words.awardNotice(tender, { ...winner, quantity: rec.quantity, value: rec.value, currency: rec.currency }, memo.identifier, disclosure),
    },
  ];
  for (const other of current.filter((o) => o.vendorOrgId !== winner.vendorOrgId)) {
    const own = standings.find((s) => s.offerId === other.offerId) ?? null;
    notices.push({
      to: await addressesOf(db, [other.vendorOrgId], "vendor"),
      ...words.regretNotice(tender, other.vendorName, own, rankedCount(standings), disclosure),
    });
  }
  return notices;
}

import "server-only";
import { asc, desc, eq } from "drizzle-orm";
import { asSubject, recordTenderState } from "@/policies";
import { getDb, type Queryable } from "./database";
import { approvals, memos, offers, organisations, recommendations, users } from "@/db/schema";
import { deviationWords, governingValue } from "@/lib/approvals/award-value";
import { pendingShortfall } from "@/lib/approvals/coverage";
import { decisionProblem, isFullyApproved } from "@/lib/approvals/routing";
import { standingsOf } from "@/lib/approvals/score-sheet";
import { recommendationCoverage, ruleFor } from "./approval-coverage";
import { refusalFor } from "./approvals";
import { approvalRecord } from "./approval-coverage";
import { AppError } from "./errors";
import { approvalsGiven, currentOffersWithClaims } from "./memos";
import { getCurrentRecommendation } from "./recommendations";
import type { Viewer } from "./session";
import { getTender, tenderSubject } from "./tenders";

/**
 * Everything the Sign-off tab shows this viewer: whether to declare first, the recommendation with
 * its score standings (scores only, never another vendor's price), the verdicts per offer, the
 * decisions so far, where it is routed, whether this viewer may decide, and the memo once issued.
 */
export async function getAwardSignOff(viewer: Viewer, tenderId: string) {
  const tender = await getTender(viewer, tenderId);
  const db = await getDb();
  const declared = viewer.actor.declarations.some((d) => d.tenderId === tenderId);
  const canDeclare = !declared && viewer.ability.can("declare", tenderSubject(tender)) && viewer.actor.roles.includes("approver");
  const summary = {
    id: tender.id,
    reference: tender.reference,
    title: tender.title,
    state: tender.state,
    currency: tender.currency,
    zone: tender.closesZone,
    awardedAt: tender.awardedAt,
    safetyRelevant: tender.safetyRelevant,
  };
  const rec = await getCurrentRecommendation(db, tenderId);
  const readsRec = rec !== null && viewer.ability.can("read", asSubject("Recommendation", { tenderId, preparedBy: rec.preparedBy, value: rec.value }));
  if (!rec || !readsRec) return { tender: summary, declared, canDeclare, recommendation: null };

  const rule = await ruleFor(db, rec).catch((error: unknown) => (error instanceof AppError ? null : Promise.reject(error)));
  const [chosen] = await db
    .select({ vendorName: organisations.name, moduleName: offers.moduleName, preparedBy: users.name })
    .from(offers)
    .innerJoin(organisations, eq(organisations.id, offers.vendorOrgId))
    .innerJoin(users, eq(users.id, rec.preparedBy))
    .where(eq(offers.id, rec.offerId));
  const offerList = (await currentOffersWithClaims(db, tender)).filter((o) =>
    viewer.ability.can(
      "read",
      asSubject("Offer", {
        id: o.id,
        tenderId,
        vendorOrgId: o.vendorOrgId,
        tenderState: recordTenderState(tender),
        envelopeOpened: tender.envelopesOpenedAt !== null,
      }),
    ),
  );
  const readsMark = (c: { id: string; vendorOrgId: string }) =>
    viewer.ability.can("read", asSubject("Mark", { claimId: c.id, tenderId, vendorOrgId: c.vendorOrgId }));
  const { decisions, earlier } = await decisionsByRecommendation(db, tenderId, rec.id);
  const covered = rule ? await recommendationCoverage(db, tender, rec, rule) : null;
  const given = await approvalsGiven(db, rec.id);
  const mayAct = viewer.actor.roles.includes("approver");
  const refusal = !mayAct ? null : rule ? refusalFor(viewer, tender, rec, rule) : "No approval band covers this value yet.";
  const problem = decisionProblem({
    tenderState: tender.state,
    pending: rec.status === "pending",
    approverId: viewer.actor.id,
    approvedBy: given.map((g) => g.approverId),
  });
  const allowed = mayAct && !refusal && !problem && viewer.ability.can("approve", asSubject("Approval", approvalRecord(tender, rec)));
  const [memo] = await db.select().from(memos).where(eq(memos.tenderId, tenderId));
  const readsMemo = viewer.ability.can("read", asSubject("Memo", { tenderId }));

  return {
    tender: summary,
    declared,
    canDeclare,
    recommendation: {
      id: rec.id,
      status: rec.status,
      vendorName: chosen?.vendorName ?? "",
      moduleName: chosen?.moduleName ?? "",
      quantity: rec.quantity,
      value: rec.value,
      computedValue: rec.computedValue,
      /** The value that set the band and the limits: the larger of the stated and computed ones. */
      governingValue: governingValue(rec),
      deviations: deviationWords({ ...rec, tenderQuantity: tender.quantity }),
      currency: rec.currency,
      justification: rec.justification,
      withdrawReason: rec.withdrawReason,
      preparedBy: chosen?.preparedBy ?? "",
      preparedAt: rec.preparedAt,
      rule,
      approvalsGiven: given.length,
      standings: standingsOf(rec.scoreSheet).map(({ offerId: _o, ...s }) => s),
    },
    // Names, modules, claims and verdicts only: never an envelope field.
    offers: offerList.map((o) => ({
      id: o.id,
      vendorName: o.vendorName,
      moduleName: o.moduleName,
      claims: o.claims
        .filter((c) => viewer.ability.can("read", asSubject("Claim", { id: c.id, offerId: o.id, tenderId, vendorOrgId: c.vendorOrgId })))
        .map((c) => ({
          id: c.id,
          point: c.pointLabel,
          metric: c.metric,
          value: c.value,
          ncgOutputBer: c.ncgOutputBer,
          verdict: c.verdict,
          ...(readsMark(c) ? { mark: c.mark, markComment: c.markComment } : { mark: null, markComment: "" }),
        })),
    })),
    decisions,
    earlier,
    routedTo: covered ? covered.eligible.map((u) => u.name) : [],
    /** Why nobody can finish approving it (pending only), or null. */
    stuck:
      rec.status !== "pending"
        ? null
        : covered
          ? pendingShortfall(covered)
          : "No approval band covers its value: an admin must add one on the Approval limits page.",
    canWithdraw:
      rec.status === "pending" &&
      tender.state === "approval" &&
      viewer.ability.can("withdraw", asSubject("Recommendation", { tenderId, preparedBy: rec.preparedBy, value: rec.value })),
    me: {
      mayAct,
      allowed,
      reason: refusal ?? (mayAct ? problem : null),
      awardsIfApproved: allowed && rule !== null && isFullyApproved(given.length + 1, rule),
    },
    memo: memo && readsMemo ? { identifier: memo.identifier, sha256: memo.sha256, size: memo.size, createdAt: memo.createdAt } : null,
    canPreview: readsMemo,
  };
}

/**
 * The decisions on the current recommendation, and those on earlier ones grouped under each: an
 * approval of a returned or withdrawn recommendation never counts for a later one.
 */
async function decisionsByRecommendation(db: Queryable, tenderId: string, currentId: string) {
  const rows = await db
    .select({
      id: approvals.id,
      recommendationId: approvals.recommendationId,
      name: users.name,
      decision: approvals.decision,
      comment: approvals.comment,
      decidedAt: approvals.decidedAt,
    })
    .from(approvals)
    .innerJoin(users, eq(users.id, approvals.approverId))
    .where(eq(approvals.tenderId, tenderId))
    .orderBy(asc(approvals.decidedAt));
  const recs = await db
    .select({ id: recommendations.id, status: recommendations.status, preparedAt: recommendations.preparedAt, withdrawReason: recommendations.withdrawReason })
    .from(recommendations)
    .where(eq(recommendations.tenderId, tenderId))
    .orderBy(desc(recommendations.preparedAt));
  return {
    decisions: rows.filter((d) => d.recommendationId === currentId),
    earlier: recs.filter((r) => r.id !== currentId).map((r) => ({ ...r, decisions: rows.filter((d) => d.recommendationId === r.id) })),
  };
}

export type AwardSignOff = Awaited<ReturnType<typeof getAwardSignOff>>;

import "server-only";
import { withSafetyCaution } from "@/lib/tenders/safety";
import { and, desc, eq, inArray } from "drizzle-orm";
import { asSubject, type TenderState } from "@/policies";
import { getDb, type Queryable } from "./database";
import { approvals, offers, organisations, recommendations, tenders, users } from "@/db/schema";
import { buildScoreSheet, recommendationProblem, totalPriceAt, type Envelope } from "@/lib/scoring";
import { awardValueProblems, governingValue, keptReasons } from "@/lib/approvals/award-value";
import { submissionShortfall } from "@/lib/approvals/coverage";
import { formatMoney } from "@/lib/format";
import { bandRuleFor, recommendationCoverage, type RecommendationRow } from "./approval-coverage";
import { awaitingApprovalNotice, withdrawnNotice } from "@/lib/approvals/notices";
import type { RecommendationInput, WithdrawalInput } from "@/lib/validation/comparison";
import { ConflictError, ForbiddenError, InputError } from "./errors";
import { appendLedger } from "./ledger";
import { approvalRequestNotices } from "./approval-notices";
import { notify } from "./notify";
import { withLedgerHead } from "./ledger-anchors";
import { loadScoringInput } from "./comparison";
import { authorize, ledgerActor, type Viewer } from "./session";
import { getTender, tenderSubject, type TenderWithInvites } from "./tenders";

export type { RecommendationRow };

/** The latest recommendation of a tender (pending, returned, approved...), or null. No access check: callers authorise. */
export async function getCurrentRecommendation(db: Queryable, tenderId: string): Promise<RecommendationRow | null> {
  const [row] = await db.select().from(recommendations).where(eq(recommendations.tenderId, tenderId)).orderBy(desc(recommendations.preparedAt)).limit(1);
  return row ?? null;
}

/** Every recommendation of a tender the viewer may read, newest first, with the vendor and any returns. */
export async function listRecommendations(viewer: Viewer, tenderId: string) {
  await getTender(viewer, tenderId);
  authorize(viewer, "read", "Recommendation", "Only the buying team and declared approvers read recommendations.");
  const db = await getDb();
  const rows = await db
    .select({ recommendation: recommendations, vendorName: organisations.name })
    .from(recommendations)
    .innerJoin(offers, eq(offers.id, recommendations.offerId))
    .innerJoin(organisations, eq(organisations.id, offers.vendorOrgId))
    .where(eq(recommendations.tenderId, tenderId))
    .orderBy(desc(recommendations.preparedAt));
  const visible = rows.filter(({ recommendation: r }) =>
    viewer.ability.can("read", asSubject("Recommendation", { tenderId: r.tenderId, preparedBy: r.preparedBy, value: r.value })),
  );
  const ids = visible.map((r) => r.recommendation.id);
  const returns = ids.length
    ? await db
        .select({ recommendationId: approvals.recommendationId, comment: approvals.comment, decidedAt: approvals.decidedAt })
        .from(approvals)
        .where(and(inArray(approvals.recommendationId, ids), eq(approvals.decision, "returned")))
    : [];
  return visible.map(({ recommendation, vendorName }) => {
    const { scoreSheet: _sheet, ...rest } = recommendation;
    return { ...rest, vendorName, returns: returns.filter((r) => r.recommendationId === recommendation.id) };
  });
}

/** Moves the tender to data.to with the recommendation's ledger entry, in the caller's transaction. */
async function moveWithEntry(
  tx: Queryable,
  viewer: Viewer,
  recId: string,
  action: string,
  e: { tenderId: string; data: { to: TenderState } & Record<string, unknown> },
) {
  await tx.update(tenders).set({ state: e.data.to }).where(eq(tenders.id, e.tenderId));
  await appendLedger(tx, { tenderId: e.tenderId, actor: ledgerActor(viewer), action, subjectType: "Recommendation", subjectId: recId, data: e.data });
}

/**
 * The award value against the offer (reasons for any deviation, 400), the band of the larger of
 * the stated and computed values (409 when none), and enough distinct approvers for it (409).
 */
async function checkAwardValue(db: Queryable, viewer: Viewer, tender: TenderWithInvites, envelope: Envelope | null, input: RecommendationInput) {
  if (!envelope) throw new ConflictError("The offer's prices are not readable yet: open the envelopes before recommending an award.");
  const facts = {
    ...input,
    computedValue: totalPriceAt(envelope.unitPrice, envelope.priceBreaks, input.quantity),
    tenderQuantity: tender.quantity,
    currency: tender.currency,
  };
  const problems = awardValueProblems(facts);
  if (Object.keys(problems).length) throw new InputError(Object.values(problems).flat().join(" "), problems);
  const candidate = { id: null, preparedBy: viewer.actor.id, value: input.value, computedValue: facts.computedValue, currency: tender.currency };
  const governing = governingValue(candidate);
  const band = await bandRuleFor(db, governing, tender.currency);
  if (!band) {
    throw new ConflictError(
      `No approval band covers ${formatMoney(governing, tender.currency)}, so nobody could approve this award. Nothing was submitted: ask an admin to add a band on the Approval limits page.`,
    );
  }
  const shortfall = submissionShortfall(await recommendationCoverage(db, tender, candidate, band), {
    value: governing,
    currency: tender.currency,
    rule: band,
    excluded: new Set(),
    approvedBy: [],
  });
  if (shortfall) throw new ConflictError(shortfall);
  return { computedValue: facts.computedValue, reasons: keptReasons(facts), governing, band };
}

/**
 * The buyer recommends an award: the offer, the quantity, the award value and the reasons. Stored
 * as "pending" with a snapshot of the score sheet; the tender moves from commercial evaluation to
 * approval with its ledger entry in the same transaction; approvers are told after the commit.
 * A disqualified offer, or one needing currency conversion, cannot be recommended (409); nor can an
 * award the people who exist could not approve (409).
 */
export async function submitRecommendation(viewer: Viewer, tenderId: string, input: RecommendationInput) {
  const tender = await getTender(viewer, tenderId);
  if (!viewer.ability.can("recommend", "Tender")) throw new ForbiddenError("Only a buyer recommends an award.");
  const db = await getDb();
  const scoring = await loadScoringInput(db, viewer, tender);
  const sheet = buildScoreSheet(scoring);
  const scored = sheet.offers.find((o) => o.offerId === input.offerId);
  const problem = recommendationProblem(tender, scored);
  if (problem) throw new ConflictError(problem);
  if (!scored) throw new InputError("No such current offer in this tender.", { offerId: ["Choose one of the offers in the comparison."] });
  authorize(viewer, "recommend", tenderSubject(tender));
  const worth = await checkAwardValue(db, viewer, tender, scoring.offers.find((o) => o.id === input.offerId)?.envelope ?? null, input);
  authorize(viewer, "create", asSubject("Recommendation", { tenderId, preparedBy: viewer.actor.id, value: worth.governing }));
  const band = worth.band;

  const row = await db.transaction(async (tx) => {
    const [locked] = await tx.select({ state: tenders.state }).from(tenders).where(eq(tenders.id, tenderId)).for("update");
    const again = recommendationProblem({ ...tender, state: locked.state }, scored);
    if (again) throw new ConflictError(again);
    const [rec] = await tx
      .insert(recommendations)
      .values({
        tenderId,
        offerId: input.offerId,
        quantity: input.quantity,
        value: input.value,
        computedValue: worth.computedValue,
        ...worth.reasons,
        currency: tender.currency,
        justification: input.justification,
        status: "pending",
        approvalsNeeded: band.approvalsNeeded,
        minApproverLimit: band.minApproverLimit,
        scoreSheet: { ...sheet, computedAt: new Date().toISOString() } as unknown as Record<string, unknown>,
        preparedBy: viewer.actor.id,
      })
      .returning();
    await moveWithEntry(tx, viewer, rec.id, "recommendation.submitted", {
      tenderId,
      data: {
        // Every entry about a recommendation names it, so the ledger groups decisions by recommendation.
        recommendationId: rec.id,
        from: "commercial",
        to: "approval",
        offerId: input.offerId,
        vendor: scored.vendorName,
        quantity: input.quantity,
        value: input.value,
        computedValue: worth.computedValue,
        ...worth.reasons,
        currency: tender.currency,
        rank: scored.rank,
        total: scored.total,
      },
    });
    return rec;
  });
  const notice = awaitingApprovalNotice(tender, 0, band.approvalsNeeded, formatMoney(input.value, tender.currency));
  notify(
    await withLedgerHead(
      db,
      withSafetyCaution(
        tender,
        await approvalRequestNotices(db, tender, row, band, {
          subject: notice.subject,
          text: `${viewer.name} recommends awarding ${tender.reference} to ${scored.vendorName}: ${input.quantity.toLocaleString("en-GB")} units.\n\nJustification: ${input.justification}\n\n${notice.text}`,
        }),
      ),
    ),
  );
  return row;
}

/**
 * The buyer takes a recommendation out of approval (one nobody can finish approving, or one that
 * should change): it is kept as "withdrawn" with the reason, the tender goes back to commercial
 * evaluation, and the approvers who had approved it are told.
 */
export async function withdrawRecommendation(viewer: Viewer, tenderId: string, input: WithdrawalInput) {
  const tender = await getTender(viewer, tenderId);
  authorize(viewer, "withdraw", "Recommendation", "Only the buying team withdraws a recommendation.");
  const db = await getDb();
  const rec = await getCurrentRecommendation(db, tenderId);
  const nothing = "There is no recommendation awaiting approval on this tender to withdraw.";
  if (!rec || rec.status !== "pending" || tender.state !== "approval") throw new ConflictError(nothing);
  authorize(viewer, "withdraw", asSubject("Recommendation", { tenderId, preparedBy: rec.preparedBy, value: rec.value }));

  const row = await db.transaction(async (tx) => {
    const [locked] = await tx.select({ state: tenders.state }).from(tenders).where(eq(tenders.id, tenderId)).for("update");
    const [withdrawn] = await tx
      .update(recommendations)
      .set({ status: "withdrawn", withdrawReason: input.reason })
      .where(and(eq(recommendations.id, rec.id), eq(recommendations.status, "pending")))
      .returning();
    if (!withdrawn || locked.state !== "approval") throw new ConflictError(nothing);
    await moveWithEntry(tx, viewer, rec.id, "recommendation.withdrawn", {
      tenderId,
      data: { recommendationId: rec.id, from: "approval", to: "commercial", reason: input.reason },
    });
    return withdrawn;
  });
  const approvedBy = await db
    .select({ email: users.email })
    .from(approvals)
    .innerJoin(users, eq(users.id, approvals.approverId))
    .where(and(eq(approvals.recommendationId, rec.id), eq(approvals.decision, "approved"), eq(users.active, true)));
  if (approvedBy.length) notify({ to: approvedBy.map((a) => a.email), ...withdrawnNotice(tender, viewer.name, input.reason) });
  const { scoreSheet: _sheet, ...rest } = row;
  return rest;
}

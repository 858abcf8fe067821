import "server-only";
import { and, desc, eq, inArray } from "drizzle-orm";
import { asSubject } from "@/policies";
import { getDb, type Queryable } from "@/db/client";
import { approvals, offers, organisations, recommendations, tenders } from "@/db/schema";
import { buildScoreSheet, recommendationProblem } from "@/lib/scoring";
import { formatMoney } from "@/lib/format";
import { bandRuleFor } from "./approval-bands";
import { awaitingApprovalNotice } from "@/lib/approvals/notices";
import type { RecommendationInput } from "@/lib/validation/comparison";
import { ConflictError, ForbiddenError, InputError } from "./errors";
import { appendLedger } from "./ledger";
import { addressesWithRole, notify } from "./notify";
import { withLedgerHead } from "./ledger-anchors";
import { loadScoringInput } from "./comparison";
import { authorize, ledgerActor, type Viewer } from "./session";
import { getTender, tenderSubject } from "./tenders";

export type RecommendationRow = typeof recommendations.$inferSelect;

/** The latest recommendation of a tender (pending, returned, approved...), or null. No access check: callers authorise. */
export async function getCurrentRecommendation(db: Queryable, tenderId: string): Promise<RecommendationRow | null> {
  const [row] = await db
    .select()
    .from(recommendations)
    .where(eq(recommendations.tenderId, tenderId))
    .orderBy(desc(recommendations.preparedAt))
    .limit(1);
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

/**
 * The buyer recommends an award: the offer, the quantity, the award value and the reasons. Stored
 * as "pending" with a snapshot of the score sheet; the tender moves from commercial evaluation to
 * approval with its ledger entry in the same transaction; approvers are told after the commit.
 * A disqualified offer, or one needing currency conversion, cannot be recommended (409).
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
  authorize(viewer, "create", asSubject("Recommendation", { tenderId, preparedBy: viewer.actor.id, value: input.value }));
  const band = await bandRuleFor(db, input.value, tender.currency);

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
        currency: tender.currency,
        justification: input.justification,
        status: "pending",
        approvalsNeeded: band?.approvalsNeeded ?? null,
        minApproverLimit: band?.minApproverLimit ?? null,
        scoreSheet: { ...sheet, computedAt: new Date().toISOString() } as unknown as Record<string, unknown>,
        preparedBy: viewer.actor.id,
      })
      .returning();
    await tx.update(tenders).set({ state: "approval" }).where(eq(tenders.id, tenderId));
    await appendLedger(tx, {
      tenderId,
      actor: ledgerActor(viewer),
      action: "recommendation.submitted",
      subjectType: "Recommendation",
      subjectId: rec.id,
      data: {
        from: "commercial",
        to: "approval",
        offerId: input.offerId,
        vendor: scored.vendorName,
        quantity: input.quantity,
        value: input.value,
        currency: tender.currency,
        rank: scored.rank,
        total: scored.total,
      },
    });
    return rec;
  });
  const notice = awaitingApprovalNotice(tender, 0, band?.approvalsNeeded ?? 1, formatMoney(input.value, tender.currency));
  notify(await withLedgerHead(db, {
    to: await addressesWithRole(db, "approver"),
    subject: notice.subject,
    text: `${viewer.name} recommends awarding ${tender.reference} to ${scored.vendorName}: ${input.quantity.toLocaleString("en-GB")} units.\n\nJustification: ${input.justification}\n\n${notice.text}`,
  }));
  return row;
}

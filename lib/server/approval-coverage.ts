import "server-only";
import { and, asc, desc, eq } from "drizzle-orm";
import type { Queryable } from "@/db/client";
import { approvalBands, approvals, declarations, recommendations, tenders, userRoles, users, type RoleName } from "@/db/schema";
import { bandWarning, coverage, pendingShortfall, type ApproverCandidate, type Coverage } from "@/lib/approvals/coverage";
import { governingValue } from "@/lib/approvals/award-value";
import { bandFor, type Band, type BandRule } from "@/lib/approvals/bands";
import { formatMoney } from "@/lib/format";
import { ConflictError } from "./errors";
import type { TenderRow } from "./tenders";

export type ApprovalBandRow = typeof approvalBands.$inferSelect;

export async function allBands(db: Queryable): Promise<ApprovalBandRow[]> {
  return db.select().from(approvalBands).orderBy(asc(approvalBands.currency), asc(approvalBands.minValue));
}

/**
 * The band rule in force for an award value, or null when no band covers it. Call it when a
 * recommendation enters approval and store the result on it: later band changes never apply.
 */
export async function bandRuleFor(db: Queryable, value: number, currency: string): Promise<BandRule | null> {
  const band = bandFor(await allBands(db), value, currency);
  return band && { approvalsNeeded: band.approvalsNeeded, minApproverLimit: band.minApproverLimit };
}

export type RecommendationRow = typeof recommendations.$inferSelect;
export type Candidate = ApproverCandidate & { email: string };
/** What coverage reads of a recommendation; a new one has no id and no approvals yet. */
export type CoveredRecommendation = Pick<RecommendationRow, "preparedBy" | "value" | "computedValue" | "currency"> & { id: string | null };

/** The subject an approval decision is authorised on. */
export const approvalRecord = (tender: TenderRow, rec: RecommendationRow) => ({
  tenderId: tender.id,
  recommendationPreparedBy: rec.preparedBy,
  value: governingValue(rec),
  tenderCreatedBy: tender.createdBy,
});

/** The rule stored on the recommendation, or null while it has none yet. */
export const storedRule = (rec: RecommendationRow): BandRule | null =>
  rec.approvalsNeeded === null || rec.minApproverLimit === null ? null : { approvalsNeeded: rec.approvalsNeeded, minApproverLimit: rec.minApproverLimit };

/** The rule that governs a recommendation: its stored one, else the bands in force now; 409 when none covers it. */
export async function ruleFor(db: Queryable, rec: RecommendationRow): Promise<BandRule> {
  const value = governingValue(rec);
  const rule = storedRule(rec) ?? (await bandRuleFor(db, value, rec.currency));
  if (!rule) throw new ConflictError(`No approval band covers ${formatMoney(value, rec.currency)}; an admin must add one on the Approval limits page.`);
  return rule;
}

/** Every active person holding the approver role, with their limit. */
export async function approverCandidates(db: Queryable): Promise<Candidate[]> {
  return db
    .select({ id: users.id, name: users.name, email: users.email, approvalLimit: users.approvalLimit })
    .from(users)
    .innerJoin(userRoles, eq(userRoles.userId, users.id))
    .where(and(eq(userRoles.role, "approver"), eq(users.active, true)));
}

/** Who can decide on a recommendation (before or after a change to the people), and what is missing. */
export async function recommendationCoverage(
  db: Queryable,
  tender: Pick<TenderRow, "id" | "createdBy">,
  rec: CoveredRecommendation,
  rule: BandRule,
  candidates?: Candidate[],
): Promise<Coverage<Candidate>> {
  const conflicted = (await db.select().from(declarations).where(eq(declarations.tenderId, tender.id)))
    .filter((d) => d.conflictedOrgIds.length > 0)
    .map((d) => d.userId);
  const approvedBy = rec.id
    ? (
        await db
          .select({ id: approvals.approverId })
          .from(approvals)
          .where(and(eq(approvals.recommendationId, rec.id), eq(approvals.decision, "approved")))
      ).map((a) => a.id)
    : [];
  return coverage(candidates ?? (await approverCandidates(db)), {
    value: governingValue(rec),
    currency: rec.currency,
    rule,
    excluded: new Set([rec.preparedBy, tender.createdBy, ...conflicted]),
    approvedBy,
  });
}

/**
 * Where a recommendation is routed: active approvers whose limit covers its value and its band,
 * who neither prepared it nor created the tender nor declared a conflict on it.
 */
export async function eligibleApprovers(db: Queryable, tender: TenderRow, rec: CoveredRecommendation, rule: BandRule) {
  return (await recommendationCoverage(db, tender, rec, rule)).eligible;
}

/** Every recommendation awaiting approval, with its tender. */
async function pendingRecommendations(db: Queryable) {
  return db
    .select({ tender: tenders, rec: recommendations })
    .from(recommendations)
    .innerJoin(tenders, eq(tenders.id, recommendations.tenderId))
    .where(and(eq(recommendations.status, "pending"), eq(tenders.state, "approval")))
    .orderBy(desc(recommendations.preparedAt));
}

/** Pending recommendations nobody can finish approving, each with why (no value named). */
export async function stuckRecommendations(db: Queryable): Promise<{ tenderId: string; problem: string }[]> {
  const stuck: { tenderId: string; problem: string }[] = [];
  for (const { tender, rec } of await pendingRecommendations(db)) {
    const rule = await ruleFor(db, rec).catch((error: unknown) => (error instanceof ConflictError ? null : Promise.reject(error)));
    const problem = rule
      ? pendingShortfall(await recommendationCoverage(db, tender, rec, rule))
      : "No approval band covers its value: an admin must add one on the Approval limits page, or the buyer can withdraw it.";
    if (problem) stuck.push({ tenderId: tender.id, problem });
  }
  return stuck;
}

export interface PersonChange {
  userId: string;
  name: string;
  active?: boolean;
  roles?: RoleName[];
  approvalLimit?: number | null;
}

/**
 * Why a change to a person (deactivation, a lower limit, the approver role removed) would leave a
 * pending recommendation without enough approvers, or null when it would not.
 */
export async function strandProblem(db: Queryable, change: PersonChange): Promise<string | null> {
  const before = await approverCandidates(db);
  const [row] = await db
    .select({ id: users.id, name: users.name, email: users.email, approvalLimit: users.approvalLimit, active: users.active })
    .from(users)
    .where(eq(users.id, change.userId));
  if (!row) return null;
  const roles = change.roles ?? (await db.select({ role: userRoles.role }).from(userRoles).where(eq(userRoles.userId, change.userId))).map((r) => r.role);
  const stays = (change.active ?? row.active) && roles.includes("approver");
  const others = before.filter((c) => c.id !== change.userId);
  const after = stays ? [...others, { ...row, approvalLimit: change.approvalLimit === undefined ? row.approvalLimit : change.approvalLimit }] : others;
  for (const { tender, rec } of await pendingRecommendations(db)) {
    const rule = await ruleFor(db, rec).catch(() => null);
    if (!rule) continue;
    const was = await recommendationCoverage(db, tender, rec, rule, before);
    const will = await recommendationCoverage(db, tender, rec, rule, after);
    if (will.shortfall > was.shortfall) {
      return (
        `This change would leave the recommendation on ${tender.reference} awaiting approval without enough approvers: ` +
        `it still needs ${will.missing} approval${will.missing === 1 ? "" : "s"} and ${change.name} is one of the few who can give one. ` +
        `Nothing was changed. Ask the buyer to withdraw that recommendation first, or give another approver a limit that covers it, then try again.`
      );
    }
  }
  return null;
}

/** The Approval limits page's warnings: bands today's active approvers cannot meet, in whole or above a value. */
export async function bandWarnings(db: Queryable, bands: readonly Band[]): Promise<string[]> {
  const limits = (await approverCandidates(db)).map((c) => c.approvalLimit);
  return bands.map((band) => bandWarning(band, limits)).filter((w): w is string => w !== null);
}

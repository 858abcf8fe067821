import { and, eq } from "drizzle-orm";
import type { Queryable } from "./client";
import type { DemoContext } from "./seed-context";
import { claims, declarations, offers, tenders } from "./schema";
import { assessRun, unitForMetric } from "@/lib/review/evidence";
import { insertEvidenceRun } from "@/lib/server/evidence-runs";
import { appendLedger } from "@/lib/server/ledger";

/**
 * The demo review: the director (who also holds the engineer role) declares no conflict on the
 * gauges tender and records one lab run on Marram Telemetry's claim that needs evidence. The demo
 * engineer stays undeclared, so the demo shows the declaration step. Nothing happens without that claim.
 * The browser tests' copies of the gauges tender get the same (tests/e2e/prepare.ts).
 */
export async function seedDemoReview(tx: Queryable, ctx: DemoContext, tenderId = ctx.tenderIds.gauges): Promise<void> {
  const rows = await tx
    .select({ claim: claims, channelModel: tenders.channelModel })
    .from(claims)
    .innerJoin(offers, eq(offers.id, claims.offerId))
    .innerJoin(tenders, eq(tenders.id, claims.tenderId))
    .where(and(eq(claims.tenderId, tenderId), eq(claims.vendorOrgId, ctx.orgIds.marram), eq(offers.status, "submitted")))
    .orderBy(claims.pointIndex);
  const found = rows.find((r) => r.claim.verdict === "needs-evidence") ?? rows[0];
  if (!found) return;
  const target = found.claim;

  const director = { id: ctx.userIds.director, label: "Tomas Veld" };
  const statement = "I have no financial, family or past employment ties to any vendor invited to this tender.";
  const [declaration] = await tx.insert(declarations).values({ tenderId, userId: director.id, conflictedOrgIds: [], statement }).returning();
  await appendLedger(tx, {
    tenderId,
    actor: director,
    action: "declaration.made",
    subjectType: "Declaration",
    subjectId: declaration.id,
    data: { conflicts: [], statement },
  });

  // 3 errors in 200,000 at the claim's own channel condition, counted in the claim's unit.
  const run = {
    channelValue: target.channelValue,
    unit: unitForMetric(target.metric),
    trials: 200_000,
    errors: 3,
    confidence: 0.95,
    note: "Bench run at the stated raw BER, shielded room.",
  };
  const assessed = assessRun({ ...target, channelModel: found.channelModel }, run);
  if (!assessed.ok) return;
  const stored = await insertEvidenceRun(tx, target, run, assessed, { userId: director.id, source: "manual" });
  await appendLedger(tx, {
    tenderId,
    actor: director,
    action: "evidence.recorded",
    subjectType: "EvidenceRun",
    subjectId: stored.id,
    data: { claimId: target.id, unit: run.unit, trials: run.trials, errors: run.errors, confidence: run.confidence, status: stored.status },
  });
}

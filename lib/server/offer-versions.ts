import "server-only";
import { and, eq } from "drizzle-orm";
import type { Queryable } from "@/db/client";
import { claims, offers } from "@/db/schema";
import { nextVersion, verdictSummary, type EvaluatedClaim } from "@/lib/offers";
import type { OfferInput } from "@/lib/validation/offer";
import { appendLedger } from "./ledger";

// The writer behind submitting an offer, apart from the reads and rules of ./offers: it takes the
// caller's transaction and never opens the database, so the demo seed can use it too.

export type OfferRow = typeof offers.$inferSelect;

export interface OfferVersionInput {
  tender: { id: string; reference: string };
  vendorOrgId: string;
  actor: { id: string; label: string };
  input: OfferInput;
  claims: EvaluatedClaim[];
  at: Date;
}

/**
 * Writes a new version inside the caller's transaction: the previous submitted version becomes
 * superseded (kept, with its claims), the new one carries its claims and verdicts, and the ledger
 * records the version and the verdicts, never a price.
 */
export async function writeOfferVersion(tx: Queryable, v: OfferVersionInput): Promise<OfferRow> {
  const { input } = v;
  const mine = and(eq(offers.tenderId, v.tender.id), eq(offers.vendorOrgId, v.vendorOrgId));
  const version = nextVersion(await tx.select({ version: offers.version }).from(offers).where(mine));
  await tx
    .update(offers)
    .set({ status: "superseded" })
    .where(and(mine, eq(offers.status, "submitted")));
  const [row] = await tx
    .insert(offers)
    .values({
      tenderId: v.tender.id,
      vendorOrgId: v.vendorOrgId,
      version,
      status: "submitted",
      moduleName: input.moduleName,
      partNumber: input.partNumber,
      codeFamily: input.code.family,
      decision: input.code.decision,
      n: input.code.n ?? null,
      k: input.code.k ?? null,
      rate: input.code.rate ?? null,
      overhead: input.code.overhead ?? null,
      ...input.envelope,
      submittedBy: v.actor.id,
      submittedAt: v.at,
    })
    .returning();
  await tx.insert(claims).values(
    v.claims.map((c) => ({
      ...c,
      result: c.result as unknown as Record<string, unknown>,
      radio: c.radio,
      offerId: row.id,
      tenderId: v.tender.id,
      vendorOrgId: v.vendorOrgId,
      evaluatedAt: v.at,
    })),
  );
  await appendLedger(tx, {
    tenderId: v.tender.id,
    actor: v.actor,
    action: "offer.submitted",
    subjectType: "Offer",
    subjectId: row.id,
    data: {
      version,
      vendorOrgId: v.vendorOrgId,
      module: `${input.moduleName} (${input.partNumber})`,
      verdicts: v.claims.map((c) => ({
        point: c.pointLabel,
        metric: c.metric,
        verdict: c.verdict,
        ...(c.radio ? { sensitivityDbm: c.radio.sensitivityDbm, curvePoints: c.radio.curve.length, worstMarginDb: c.radio.worst.marginDb } : {}),
      })),
      summary: verdictSummary(v.claims.map((c) => c.verdict)),
      engineVersion: v.claims[0]?.engineVersion ?? null,
    },
  });
  return row;
}

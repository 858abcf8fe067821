import { expect } from "vitest";
import { and, eq, inArray } from "drizzle-orm";
import type { Db } from "@/db/client";
import { claims, declarations, offers, organisations, tenders, users } from "@/db/schema";
import { POST as declarePost } from "@/app/api/v1/tenders/[id]/declaration/route";
import { evaluateClaim } from "@/lib/bounds";
import { freshDatabase, params, request, signInAll, type DemoAccount } from "./app";

export const VENDORS = ["kestrelink", "marram", "oxbow", "quillfield"] as const;
export type VendorKey = (typeof VENDORS)[number];
const NAMES: Record<VendorKey, string> = {
  kestrelink: "Kestrelink Radio",
  marram: "Marram Telemetry",
  oxbow: "Oxbow Wireless",
  quillfield: "Quillfield RF",
};
const EMAILS: Record<VendorKey, string> = {
  kestrelink: "sales@kestrelink.example",
  marram: "offers@marram.example",
  oxbow: "bids@oxbow.example",
  quillfield: "tenders@quillfield.example",
};

// Codes chosen with the engine: Kestrelink's storm-fade claim is beyond the converse, Marram's sits
// between the converse and the RCU bound (needs evidence), Oxbow and Quillfield are comfortable.
const CODES: Record<VendorKey, { n: number; k: number; bler: [number, number]; price: number }> = {
  kestrelink: { n: 2048, k: 1900, bler: [1e-6, 1e-6], price: 38 },
  marram: { n: 1024, k: 912, bler: [1e-6, 1e-4], price: 44 },
  oxbow: { n: 1024, k: 512, bler: [1e-4, 1e-4], price: 51 },
  quillfield: { n: 2048, k: 1536, bler: [1e-4, 1e-4], price: 47 },
};

export interface ReviewFixtures {
  tenderId: string;
  orgIds: Record<VendorKey, string>;
  /** Claim ids per vendor, in operating-point order. */
  claimIds: Record<VendorKey, string[]>;
  /** Marram's claim that needs evidence (BLER at storm fade). */
  evidenceClaimId: string;
}

/**
 * The gauges tender's four offers. Uses the demo seed's offers when they exist; otherwise inserts
 * them directly, with verdicts from the real engine.
 */
export async function reviewFixtures(db: Db): Promise<ReviewFixtures> {
  const [tender] = await db.select().from(tenders).where(eq(tenders.reference, "RC-2027-001"));
  const orgRows = await db
    .select()
    .from(organisations)
    .where(inArray(organisations.name, Object.values(NAMES)));
  const orgIds = Object.fromEntries(VENDORS.map((v) => [v, orgRows.find((o) => o.name === NAMES[v])!.id])) as Record<VendorKey, string>;
  const existing = await db.select({ id: claims.id }).from(claims).where(eq(claims.tenderId, tender.id));
  if (existing.length === 0) {
    for (const vendor of VENDORS) {
      const code = CODES[vendor];
      const [submitter] = await db.select().from(users).where(eq(users.email, EMAILS[vendor]));
      const [offer] = await db
        .insert(offers)
        .values({
          tenderId: tender.id,
          vendorOrgId: orgIds[vendor],
          version: 1,
          moduleName: `${NAMES[vendor]} G-${code.n}`,
          partNumber: `${vendor.slice(0, 3).toUpperCase()}-${code.n}`,
          codeFamily: "LDPC",
          decision: "hard",
          n: code.n,
          k: code.k,
          rate: code.k / code.n,
          overhead: code.n / code.k - 1,
          unitPrice: code.price,
          currency: "EUR",
          leadTimeWeeks: 8,
          warrantyMonths: 24,
          priceBreaks: [{ minQuantity: 2000, unitPrice: code.price - 2 }],
          submittedBy: submitter.id,
        })
        .returning();
      for (const [pointIndex, point] of tender.operatingPoints.entries()) {
        const value = code.bler[pointIndex];
        const result = evaluateClaim({ channel: { model: "bsc", p: point.value }, code: { n: code.n, k: code.k }, target: { metric: "bler", value } });
        await db.insert(claims).values({
          offerId: offer.id,
          tenderId: tender.id,
          vendorOrgId: orgIds[vendor],
          pointIndex,
          pointLabel: point.label,
          channelValue: point.value,
          metric: "bler",
          value,
          verdict: result.verdict,
          result,
          engineVersion: result.engineVersion,
        });
      }
    }
  }
  const rows = await db
    .select({ claim: claims })
    .from(claims)
    .innerJoin(offers, eq(offers.id, claims.offerId))
    .where(and(eq(claims.tenderId, tender.id), eq(offers.status, "submitted")))
    .orderBy(claims.pointIndex);
  const claimIds = Object.fromEntries(VENDORS.map((v) => [v, rows.filter((r) => r.claim.vendorOrgId === orgIds[v]).map((r) => r.claim.id)])) as Record<
    VendorKey,
    string[]
  >;
  const needs = rows.find((r) => r.claim.vendorOrgId === orgIds.marram && r.claim.verdict === "needs-evidence");
  return { tenderId: tender.id, orgIds, claimIds, evidenceClaimId: needs?.claim.id ?? claimIds.marram[0] };
}

/** The engineer declares no ties to any invited vendor on the tender, through the API, unless they already have. */
export async function declareNoTies(db: Db, tenderId: string, headers: Headers, email = "engineer@tarnwell.example") {
  const [user] = await db.select({ id: users.id }).from(users).where(eq(users.email, email));
  const made = await db
    .select({ id: declarations.id })
    .from(declarations)
    .where(and(eq(declarations.userId, user.id), eq(declarations.tenderId, tenderId)));
  if (made.length > 0) return;
  const body = { conflict: "none", statement: "No ties to any invited vendor." };
  const declared = await declarePost(request(`/api/v1/tenders/${tenderId}/declaration`, { method: "POST", headers, body }), params({ id: tenderId }));
  expect(declared.status).toBe(201);
}

/**
 * A fresh demo database with the review fixtures, a session for the engineer and for each other
 * demo account named, and the engineer's declaration on the fixture tender made.
 */
export async function declaredReviewBench(...others: DemoAccount[]) {
  const db = await freshDatabase();
  const fx = await reviewFixtures(db);
  const as: Record<string, Headers> = await signInAll("engineer", ...others);
  await declareNoTies(db, fx.tenderId, as.engineer);
  return { db, fx, as };
}

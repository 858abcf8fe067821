// `tsx --conditions=react-server tests/e2e/prepare.ts`, run by playwright.config.ts's webServer on
// the fresh e2e data folder before the server starts: seeds the demo (DEMO=1) and writes the tender
// of each journey (journey-tenders.ts) in its starting state, through the app's own functions as
// the people concerned, so the ledger is one valid chain. It holds the data folder while it runs
// and closes the database before the server takes the folder.
import { and, eq } from "drizzle-orm";
import { closeDb, type Db } from "@/db/client";
import { claims, offers } from "@/db/schema";
import { insertGaugesCopy, loadDemoContext, type DemoContext } from "@/db/seed";
import { viewerOf } from "@/db/seed-viewer";
import { parseEnv } from "@/lib/env";
import { flushMail } from "@/lib/mail/send";
import { holdDataFolder } from "@/lib/runtime/data-lock";
import { decideRecommendation } from "@/lib/server/approvals";
import { getComparison, openEnvelopes } from "@/lib/server/comparison";
import { getDb } from "@/lib/server/database";
import { checkpointNow } from "@/lib/server/ledger-anchors";
import { createDeclaration } from "@/lib/server/declarations";
import { createMark } from "@/lib/server/marks";
import { submitRecommendation } from "@/lib/server/recommendations";
import { signTechnical } from "@/lib/server/signoff";
import { AWARD_VALUE, AWARD_VALUE_REASON, JOURNEY_TENDERS, type Journey } from "./journey-tenders";

const NO_TIES = "I have no financial, family or employment ties to any invited vendor.";

/** A person declares no conflict of interest on the tender. */
async function declare(db: Db, userId: string, tenderId: string) {
  await createDeclaration(await viewerOf(db, userId), tenderId, { conflict: "none", conflictedOrgIds: [], statement: NO_TIES });
}

/** Technical evaluation to commercial: the engineer declares, gives every claim a final mark and signs. */
async function signTechnically(db: Db, ctx: DemoContext, tenderId: string) {
  await declare(db, ctx.userIds.engineer, tenderId);
  const engineer = await viewerOf(db, ctx.userIds.engineer);
  const current = await db
    .select({ id: claims.id, verdict: claims.verdict })
    .from(claims)
    .innerJoin(offers, eq(offers.id, claims.offerId))
    .where(and(eq(claims.tenderId, tenderId), eq(offers.status, "submitted")));
  for (const claim of current)
    await createMark(
      engineer,
      claim.id,
      claim.verdict === "impossible"
        ? { mark: "rejected-impossible", comment: "Beyond the converse bound at this block length." }
        : { mark: "accepted", comment: "" },
    );
  await signTechnical(engineer, tenderId, { statement: "Every claim reviewed against the bounds." });
}

/** Commercial evaluation to approval: the buyer opens the envelopes and recommends the top offer for 250,000 EUR. */
async function recommend(db: Db, ctx: DemoContext, tenderId: string) {
  const buyer = await viewerOf(db, ctx.userIds.buyer);
  await openEnvelopes(buyer, tenderId);
  const best = (await getComparison(buyer, tenderId)).sheet.offers.find((o) => o.rank === 1);
  if (!best) throw new Error("no offer ranks first");
  await submitRecommendation(buyer, tenderId, {
    offerId: best.offerId,
    quantity: 4000,
    value: AWARD_VALUE,
    valueReason: AWARD_VALUE_REASON,
    justification: "Best total score with honest claims at both operating points; installation and five years of support included.",
  });
}

/** Approval to award: both approvers approve; the last approval issues the memo. */
async function award(db: Db, ctx: DemoContext, tenderId: string) {
  // The director declared with the copy of the demo review; Helen Strand declares first.
  await declare(db, ctx.userIds.approver, tenderId);
  for (const key of ["approver", "director"])
    await decideRecommendation(await viewerOf(db, ctx.userIds[key]), tenderId, { decision: "approve", comment: "Within the budget line for gauges." });
}

/** How far each journey's tender goes before its journey starts. */
const STEPS: Record<Journey, ((db: Db, ctx: DemoContext, tenderId: string) => Promise<void>)[]> = {
  review: [],
  comparison: [signTechnically],
  deadlock: [signTechnically, recommend],
  award: [signTechnically, recommend],
  ledger: [signTechnically, recommend, award],
};

async function main() {
  const { DATA_DIR, DEMO } = parseEnv();
  if (!DEMO) throw new Error("The browser tests' preparation runs on the demo (DEMO=1).");
  holdDataFolder(DATA_DIR, "tests/e2e/prepare.ts");
  const db = await getDb();
  const ctx = await loadDemoContext(db);
  for (const journey of Object.keys(STEPS) as Journey[]) {
    const tenderId = await db.transaction((tx) => insertGaugesCopy(tx, ctx, JOURNEY_TENDERS[journey]));
    for (const step of STEPS[journey]) await step(db, ctx, tenderId);
  }
  await checkpointNow(db, "schedule");
  await flushMail();
}

main()
  .catch((error) => {
    console.error(error);
    process.exitCode = 1;
  })
  .finally(async () => {
    await closeDb();
    // The local mail and object-store fakes started for notices and memos keep the process alive.
    process.exit();
  });

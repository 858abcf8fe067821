import "server-only";
import { eq } from "drizzle-orm";
import { getDb } from "./database";
import { approvalBands } from "@/db/schema";
import { bandGaps, bandProblems, describeBand } from "@/lib/approvals/bands";
import type { ApprovalBandInput } from "@/lib/validation/approvals";
import { InputError, NotFoundError } from "./errors";
import { allBands, bandWarnings, type ApprovalBandRow } from "./approval-coverage";
import { appendLedger } from "./ledger";
import { authorize, ledgerActor, type Viewer } from "./session";

/** The bands, with the values each currency leaves uncovered and the bands today's approvers cannot meet. */
export async function listApprovalBands(viewer: Viewer) {
  authorize(viewer, "read", "ApprovalLimit", "Only admins, buyers and approvers read the approval limits.");
  const db = await getDb();
  const bands = await allBands(db);
  const currencies = [...new Set(bands.map((b) => b.currency))];
  return {
    bands,
    gaps: currencies.flatMap((currency) => bandGaps(bands, currency).map((gap) => ({ currency, ...gap }))),
    warnings: await bandWarnings(db, bands),
  };
}

const bandFields = (b: Pick<ApprovalBandRow, "currency" | "minValue" | "maxValue" | "approvalsNeeded" | "minApproverLimit">) => ({
  currency: b.currency,
  minValue: b.minValue,
  maxValue: b.maxValue,
  approvalsNeeded: b.approvalsNeeded,
  minApproverLimit: b.minApproverLimit,
});

/** Rejects a set of bands that overlap, naming the bands (nothing is written). */
function assertNoOverlap(bands: Parameters<typeof bandProblems>[0]) {
  const problems = bandProblems(bands);
  if (problems.length) throw new InputError(problems.join(" "), { minValue: problems });
}

/** Adds, changes (id given) or removes (input null) one band; a ledger entry in the same transaction. */
async function writeBand(viewer: Viewer, id: string | null, input: ApprovalBandInput | null) {
  authorize(viewer, id === null ? "create" : input === null ? "delete" : "update", "ApprovalLimit", "Only an admin changes the approval limits.");
  const db = await getDb();
  return db.transaction(async (tx) => {
    const bands = await allBands(tx);
    const before = id === null ? null : bands.find((b) => b.id === id);
    if (before === undefined) throw new NotFoundError("No such approval band.");
    const others = bands.filter((b) => b.id !== id);
    if (input) assertNoOverlap([...others, input]);
    let row: ApprovalBandRow | null = null;
    if (input && before) [row] = await tx.update(approvalBands).set(input).where(eq(approvalBands.id, before.id)).returning();
    else if (input) [row] = await tx.insert(approvalBands).values(input).returning();
    else await tx.delete(approvalBands).where(eq(approvalBands.id, before!.id));
    const action = !before ? "approval-band.added" : input ? "approval-band.changed" : "approval-band.removed";
    await appendLedger(tx, {
      actor: ledgerActor(viewer),
      action,
      subjectType: "ApprovalLimit",
      subjectId: row?.id ?? before!.id,
      data: {
        band: describeBand(input ?? before!),
        ...(before ? { from: bandFields(before) } : {}),
        ...(input ? { to: bandFields(input) } : {}),
      },
    });
    return row;
  });
}

export const createApprovalBand = (viewer: Viewer, input: ApprovalBandInput) => writeBand(viewer, null, input);
export const updateApprovalBand = (viewer: Viewer, id: string, input: ApprovalBandInput) => writeBand(viewer, id, input);
export const removeApprovalBand = (viewer: Viewer, id: string) => writeBand(viewer, id, null);

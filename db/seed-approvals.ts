import type { Queryable } from "./client";
import { approvalBands } from "./schema";
import type { DemoContext } from "./seed-context";
import { appendLedger } from "@/lib/server/ledger";

/** The demo value bands in EUR; with the approver's limit (250,000) and the director's (2,000,000), a high-value award needs both. */
export const DEMO_APPROVAL_BANDS = [
  { currency: "EUR", minValue: 0, maxValue: 50_000, approvalsNeeded: 1, minApproverLimit: 50_000 },
  { currency: "EUR", minValue: 50_000, maxValue: 250_000, approvalsNeeded: 1, minApproverLimit: 250_000 },
  { currency: "EUR", minValue: 250_000, maxValue: null, approvalsNeeded: 2, minApproverLimit: 250_000 },
];

export async function seedDemoApprovalBands(tx: Queryable, ctx: DemoContext): Promise<void> {
  await tx.insert(approvalBands).values(DEMO_APPROVAL_BANDS);
  await appendLedger(tx, {
    actor: { id: ctx.userIds.admin, label: "Dana Whitlock" },
    action: "approval-band.seeded",
    subjectType: "ApprovalLimit",
    data: { bands: DEMO_APPROVAL_BANDS.length, currency: "EUR" },
  });
}

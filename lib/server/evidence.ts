import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { asSubject } from "@/policies";
import { getDb } from "./database";
import { claims, evidenceRuns, offers } from "@/db/schema";
import { assessRun } from "@/lib/review/evidence";
import type { CsvClaim, CsvReport, ValidRow } from "@/lib/review/csv";
import type { EvidenceRunInput } from "@/lib/validation/review";
import { inEngine } from "./engine";
import { ConflictError, InputError } from "./errors";
import { appendLedger } from "./ledger";
import { insertEvidenceRun } from "./evidence-runs";
import { claimJoin, loadClaim, type LoadedClaim } from "./review";
import { authorize, ledgerActor, type Viewer } from "./session";

type ClaimRow = typeof claims.$inferSelect;
const runSubject = (c: Pick<ClaimRow, "id" | "tenderId" | "vendorOrgId">) =>
  asSubject("EvidenceRun", { claimId: c.id, tenderId: c.tenderId, vendorOrgId: c.vendorOrgId });

/** Lab runs are recorded while the tender is in technical evaluation, by an engineer declared on it. */
async function claimForRecording(viewer: Viewer, claimId: string): Promise<LoadedClaim> {
  const loaded = await loadClaim(viewer, claimId);
  authorize(viewer, "record", runSubject(loaded.claim), "Only an engineer who has declared on this tender records lab runs.");
  if (loaded.tender.state !== "technical") throw new ConflictError("Lab runs are recorded only during technical evaluation.");
  return loaded;
}

export async function listEvidence(viewer: Viewer, claimId: string) {
  const { claim } = await loadClaim(viewer, claimId);
  authorize(viewer, "read", runSubject(claim), "Lab runs belong to the buying team.");
  const db = await getDb();
  return db.select().from(evidenceRuns).where(eq(evidenceRuns.claimId, claimId)).orderBy(asc(evidenceRuns.recordedAt));
}

/** One run typed in by an engineer, with its Clopper-Pearson status against the claim. */
export async function recordEvidence(viewer: Viewer, claimId: string, input: EvidenceRunInput) {
  const { claim, tender } = await claimForRecording(viewer, claimId);
  const assessed = assessRun({ ...claim, channelModel: tender.channelModel }, input);
  if (!assessed.ok) throw new InputError(assessed.message, { [assessed.field]: [assessed.message] });
  const db = await getDb();
  return db.transaction(async (tx) => {
    const run = await insertEvidenceRun(tx, claim, input, assessed, { userId: viewer.actor.id, source: "manual" });
    await appendLedger(tx, {
      tenderId: claim.tenderId,
      actor: ledgerActor(viewer),
      action: "evidence.recorded",
      subjectType: "EvidenceRun",
      subjectId: run.id,
      data: {
        claimId,
        channel: input.channelValue,
        unit: input.unit,
        trials: input.trials,
        errors: input.errors,
        confidence: input.confidence,
        status: run.status,
        finding: run.finding,
      },
    });
    return run;
  });
}

/** One row that would be stored (preview) or was stored, with what it counts for against its claim. */
export interface ImportedRow {
  line: number;
  id: string | null;
  claimId: string;
  status: string;
  upper: number;
  finding: string;
}

export interface ImportOutcome extends Omit<CsvReport, "valid"> {
  /** True when nothing was written: the rows are what an import would store. */
  preview: boolean;
  stored: ImportedRow[];
}

/**
 * Many runs from a lab's CSV file. Rows name their claim (claim_id, or vendor and point) or fall
 * to the claim imported on. A preview checks every row and writes nothing; an import stores the
 * valid rows together in one transaction and reports the rest.
 */
export async function importEvidence(viewer: Viewer, claimId: string, csv: string, options: { preview?: boolean } = {}): Promise<ImportOutcome> {
  const { claim } = await claimForRecording(viewer, claimId);
  const db = await getDb();
  const rows = await claimJoin(db).where(and(eq(claims.tenderId, claim.tenderId), eq(offers.status, "submitted")));
  const recordable: CsvClaim[] = rows
    .filter((r) => viewer.ability.can("record", runSubject(r.claim)))
    .map(({ claim: c, vendorName, tender }) => ({ ...c, vendorName, channelModel: tender.channelModel }));
  const report = await inEngine(
    "csv",
    { csv, claims: recordable, fallbackId: claimId },
    () => "checking this lab file",
    "Nothing was stored: split the file into smaller ones and import them one by one.",
  );
  if (report.fileErrors.length > 0) throw new InputError(report.fileErrors.join(" "), { csv: report.fileErrors });
  const outcome = (row: ValidRow, id: string | null): ImportedRow => ({
    line: row.line,
    id,
    claimId: row.claimId,
    status: row.result.status,
    upper: row.result.upper,
    finding: row.finding,
  });
  if (options.preview) return { preview: true, stored: report.valid.map((row) => outcome(row, null)), rejected: report.rejected, fileErrors: [] };
  const byId = new Map(rows.map((r) => [r.claim.id, r.claim]));
  const stored =
    report.valid.length === 0
      ? []
      : await db.transaction(async (tx) => {
          const out: ImportedRow[] = [];
          for (const row of report.valid) {
            const run = await insertEvidenceRun(tx, byId.get(row.claimId)!, row, row, { userId: viewer.actor.id, source: "csv" });
            out.push(outcome(row, run.id));
          }
          await appendLedger(tx, {
            tenderId: claim.tenderId,
            actor: ledgerActor(viewer),
            action: "evidence.imported",
            subjectType: "EvidenceRun",
            subjectId: null,
            data: { stored: out.length, rejected: report.rejected.length, claims: [...new Set(out.map((r) => r.claimId))] },
          });
          return out;
        });
  return { preview: false, stored, rejected: report.rejected, fileErrors: [] };
}

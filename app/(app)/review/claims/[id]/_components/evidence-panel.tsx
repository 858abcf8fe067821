import { DateTime } from "@/app/_components/date-time";
import { formatSci } from "@/lib/format";
import { EVIDENCE_LABELS } from "@/lib/review/labels";
import type { evidenceRuns } from "@/db/schema";
import { CsvImport } from "./csv-import";
import { RecordRunForm } from "./record-run-form";

type Run = typeof evidenceRuns.$inferSelect;

/** Lab runs with their Clopper-Pearson bounds and status against the claim, and the forms to add more. */
export function EvidencePanel(props: { claimId: string; runs: Run[]; unit: "bits" | "frames"; channelValue: number; claimedRate: number | null; mayRecord: boolean }) {
  const { runs, unit } = props;
  return (
    <section className="panel space-y-3" aria-label="Lab evidence">
      <h2>Lab evidence</h2>
      <p className="text-xs text-ink-soft">
        Runs are counted in {unit} against the claimed rate {props.claimedRate == null ? "–" : formatSci(props.claimedRate)}. One-sided Clopper-Pearson bounds at the run&apos;s confidence: verified when the upper bound is at or below the claim, contradicted when the lower bound is above it.
      </p>
      {runs.length === 0 ? <p className="text-sm text-ink-soft">No lab run recorded.</p> : (
        <table className="data-table" aria-label="Lab runs">
          <thead><tr><th>Recorded</th><th>Channel</th><th>Errors / trials</th><th>Confidence</th><th>Lower</th><th>Upper</th><th>Status</th><th>Error-free run needed</th><th>Source</th></tr></thead>
          <tbody>
            {runs.map((r) => (
              <tr key={r.id} data-status={r.status}>
                <td><DateTime value={r.recordedAt} /></td>
                <td className="tabular-nums">{formatSci(r.channelValue)}</td>
                <td className="tabular-nums">{r.errors.toLocaleString("en-GB")} / {r.trials.toLocaleString("en-GB")} {r.unit}</td>
                <td className="tabular-nums">{(r.confidence * 100).toFixed(0)} %</td>
                <td className="tabular-nums">{formatSci(r.lower)}</td>
                <td className="tabular-nums">{formatSci(r.upper)}</td>
                <td>{EVIDENCE_LABELS[r.status]}</td>
                <td className="tabular-nums">{r.errorFreeTrialsNeeded == null ? "–" : `${r.errorFreeTrialsNeeded.toLocaleString("en-GB")} ${r.unit}`}</td>
                <td>{r.source === "csv" ? "CSV" : "typed"}{r.note ? `: ${r.note}` : ""}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {props.mayRecord ? (
        <div className="grid gap-4 border-t border-ink-faint/20 pt-3 md:grid-cols-2">
          <RecordRunForm claimId={props.claimId} unit={unit} channelValue={props.channelValue} />
          <CsvImport claimId={props.claimId} />
        </div>
      ) : null}
    </section>
  );
}

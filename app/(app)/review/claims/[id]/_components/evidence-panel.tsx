import { DateTime } from "@/app/_components/date-time";
import { CHANNEL_LABELS, formatCondition, formatSci } from "@/lib/format";
import { EVIDENCE_LABELS } from "@/lib/review/labels";
import { evidenceCsvTemplate } from "@/lib/review/csv";
import { claimedRate, unitForMetric } from "@/lib/review/evidence";
import type { claims, evidenceRuns } from "@/db/schema";
import type { ChannelModel } from "@/db/schema/tenders";
import { CsvImport } from "./csv-import";
import { RecordRunForm } from "./record-run-form";

type Run = typeof evidenceRuns.$inferSelect;
type Claim = typeof claims.$inferSelect;

/** Lab runs with their Clopper-Pearson bounds and what each counts for against the claim, and the forms to add more. */
export function EvidencePanel({ claim, model, runs, mayRecord }: { claim: Claim; model: ChannelModel; runs: Run[]; mayRecord: boolean }) {
  const unit = unitForMetric(claim.metric);
  const claimed = claimedRate(claim);
  const harsher = model === "biawgn" ? "a lower Eb/N0" : `a larger ${CHANNEL_LABELS[model].parameter}`;
  return (
    <section className="panel space-y-3" aria-label="Lab evidence">
      <h2>Lab evidence</h2>
      <p className="text-xs text-ink-soft">
        Runs are counted in {unit} against the claimed rate {claimed == null ? "–" : formatSci(claimed)} at {formatCondition(model, claim.channelValue)}.
        One-sided Clopper-Pearson bounds at the run&apos;s confidence: verified when the upper bound is at or below the claim, contradicted when the lower bound
        is above it. A run verifies only at the claim&apos;s channel or a harsher one ({harsher}), and contradicts only at the claim&apos;s channel or a milder
        one.
      </p>
      {runs.length === 0 ? (
        <p className="text-sm text-ink-soft">No lab run recorded.</p>
      ) : (
        <table className="data-table" aria-label="Lab runs">
          <thead>
            <tr>
              <th>Recorded</th>
              <th>Channel</th>
              <th>Errors / trials</th>
              <th>Confidence</th>
              <th>Lower</th>
              <th>Upper</th>
              <th>Counts as</th>
              <th>Why</th>
              <th>Error-free run needed</th>
              <th>Source</th>
            </tr>
          </thead>
          <tbody>
            {runs.map((r) => (
              <tr key={r.id} data-status={r.status}>
                <td>
                  <DateTime value={r.recordedAt} />
                </td>
                <td className="tabular-nums">{formatCondition(model, r.channelValue)}</td>
                <td className="tabular-nums">
                  {r.errors.toLocaleString("en-GB")} / {r.trials.toLocaleString("en-GB")} {r.unit}
                </td>
                <td className="tabular-nums">{(r.confidence * 100).toFixed(0)} %</td>
                <td className="tabular-nums">{formatSci(r.lower)}</td>
                <td className="tabular-nums">{formatSci(r.upper)}</td>
                <td>{EVIDENCE_LABELS[r.status]}</td>
                <td className="text-xs">{r.finding}</td>
                <td className="tabular-nums">{r.errorFreeTrialsNeeded == null ? "–" : `${r.errorFreeTrialsNeeded.toLocaleString("en-GB")} ${r.unit}`}</td>
                <td>
                  {r.source === "csv" ? "CSV" : "typed"}
                  {r.note ? `: ${r.note}` : ""}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {mayRecord ? (
        <div className="grid gap-4 border-t border-ink-faint/20 pt-3 md:grid-cols-2">
          <RecordRunForm claimId={claim.id} unit={unit} channelValue={claim.channelValue} />
          <CsvImport claimId={claim.id} template={evidenceCsvTemplate(claim)} />
        </div>
      ) : null}
    </section>
  );
}

"use client";

import { useState } from "react";
import { useRouter } from "next/navigation";
import { EVIDENCE_LABELS } from "@/lib/review/labels";
import type { EvidenceStatus } from "@/db/schema/evaluation";

interface Report {
  error?: string;
  preview?: boolean;
  stored?: { line: number; status: EvidenceStatus; finding: string }[];
  rejected?: { line: number; reasons: string[] }[];
}

/**
 * Reads a lab's CSV file, shows what each row would count for (or why it is refused), and stores
 * the valid rows only when the engineer confirms. A template for this claim can be downloaded.
 */
export function CsvImport({ claimId, template }: { claimId: string; template: string }) {
  const router = useRouter();
  const [csv, setCsv] = useState<string | null>(null);
  const [phase, setPhase] = useState("");
  const [report, setReport] = useState<Report | null>(null);
  const [busy, setBusy] = useState(false);

  const send = async (text: string, preview: boolean) => {
    setBusy(true);
    setPhase(preview ? "Checking every row…" : "Storing…");
    const response = await fetch(`/api/v1/claims/${claimId}/evidence/import`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ csv: text, preview }),
    });
    const body: Report = await response.json().catch(() => ({ error: "The server's answer could not be read." }));
    setBusy(false);
    setReport(body);
    if (!response.ok) return setPhase(body.error ?? "Nothing was stored.");
    const count = body.stored?.length ?? 0;
    if (preview)
      return setPhase(
        count === 0
          ? "No row can be stored: see why below."
          : `${count} row${count === 1 ? "" : "s"} can be stored; ${body.rejected?.length ?? 0} refused. Nothing is stored until you confirm.`,
      );
    setCsv(null);
    setPhase(`Stored ${count} run${count === 1 ? "" : "s"}.`);
    router.refresh();
  };

  const choose = async (file: File | undefined) => {
    setReport(null);
    setCsv(null);
    if (!file) return;
    const text = await file.text();
    setCsv(text);
    await send(text, true);
  };

  const rows = [
    ...(report?.stored ?? []).map((r) => ({ line: r.line, outcome: EVIDENCE_LABELS[r.status], why: r.finding, ok: true })),
    ...(report?.rejected ?? []).map((r) => ({ line: r.line, outcome: "Refused", why: r.reasons.join(" "), ok: false })),
  ].sort((a, b) => a.line - b.line);
  return (
    <div className="space-y-2 print:hidden" aria-label="Import lab runs" role="group">
      <h3 className="text-sm font-semibold">Import runs from a CSV file</h3>
      <p className="text-xs text-ink-soft">
        Columns: claim_id (or vendor and point), channel, unit (bits or frames), trials, errors, confidence, note. Rows without a claim count for this one; rows
        without a channel are at the claim&apos;s.{" "}
        <a href={`data:text/csv;charset=utf-8,${encodeURIComponent(template)}`} download="lab-runs-template.csv">
          Download a template
        </a>
      </p>
      <label className="label" htmlFor="csv-file">
        CSV file
      </label>
      <input id="csv-file" type="file" accept=".csv,text/csv" className="text-sm" onChange={(e) => choose(e.target.files?.[0])} />
      {phase ? (
        <p role="status" className="text-sm">
          {phase}
        </p>
      ) : null}
      {rows.length > 0 ? (
        <table className="data-table" aria-label={report?.preview ? "Rows to import" : "Imported rows"}>
          <thead>
            <tr>
              <th>Line</th>
              <th>Outcome</th>
              <th>Why</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.line} data-ok={r.ok}>
                <td className="tabular-nums">{r.line}</td>
                <td>{r.outcome}</td>
                <td className="text-xs">{r.why}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      {report?.preview && csv && (report.stored?.length ?? 0) > 0 ? (
        <button type="button" className="btn" disabled={busy} onClick={() => send(csv, false)}>
          Store {report.stored!.length} run{report.stored!.length === 1 ? "" : "s"}
        </button>
      ) : null}
    </div>
  );
}

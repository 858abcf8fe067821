"use client";

import { useState } from "react";
import { useRouter } from "next/navigation";
import Papa from "papaparse";

interface Report {
  error?: string;
  stored?: { line: number; status: string }[];
  rejected?: { line: number; reasons: string[] }[];
}

/** Reads a lab's CSV in the browser (with progress), sends it, and lists what was stored and what was refused. */
export function CsvImport({ claimId }: { claimId: string }) {
  const router = useRouter();
  const [progress, setProgress] = useState<number | null>(null);
  const [phase, setPhase] = useState("");
  const [report, setReport] = useState<Report | null>(null);

  const send = async (csv: string) => {
    setPhase("Checking and storing…");
    const response = await fetch(`/api/v1/claims/${claimId}/evidence/import`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ csv }),
    });
    const body: Report = await response.json().catch(() => ({ error: "The server's answer could not be read." }));
    setReport(body);
    setProgress(100);
    setPhase(response.ok ? `Stored ${body.stored?.length ?? 0} runs.` : body.error ?? "Nothing was stored.");
    if (response.ok) router.refresh();
  };

  const choose = (file: File | undefined) => {
    if (!file) return;
    setReport(null);
    setProgress(0);
    let rows = 0;
    Papa.parse<string[]>(file, {
      skipEmptyLines: "greedy",
      step: (row) => {
        rows += 1;
        setProgress(Math.round((100 * row.meta.cursor) / Math.max(file.size, 1) * 0.8));
      },
      complete: async () => {
        setPhase(`Read ${Math.max(rows - 1, 0)} data rows.`);
        await send(await file.text());
      },
      error: (err) => setPhase(`The file could not be read: ${err.message}`),
    });
  };

  return (
    <div className="space-y-2" aria-label="Import lab runs" role="group">
      <h3 className="text-sm font-semibold">Import runs from a CSV file</h3>
      <p className="text-xs text-ink-soft">Columns: claim_id (or vendor and point), channel, unit (bits or frames), trials, errors, confidence, note. Rows without a claim count for this one.</p>
      <label className="label" htmlFor="csv-file">CSV file</label>
      <input id="csv-file" type="file" accept=".csv,text/csv" className="text-sm" onChange={(e) => choose(e.target.files?.[0])} />
      {progress !== null ? <progress aria-label="Import progress" max={100} value={progress} className="w-full" /> : null}
      {phase ? <p role="status" className="text-sm">{phase}</p> : null}
      {report?.rejected && report.rejected.length > 0 ? (
        <table className="data-table" aria-label="Rejected rows">
          <thead><tr><th>Line</th><th>Why it was refused</th></tr></thead>
          <tbody>{report.rejected.map((r) => <tr key={r.line}><td className="tabular-nums">{r.line}</td><td>{r.reasons.join(" ")}</td></tr>)}</tbody>
        </table>
      ) : null}
    </div>
  );
}

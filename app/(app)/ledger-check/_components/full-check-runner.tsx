"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import type { FullCheck } from "@/lib/server/ledger-full-check";

type Progress = Pick<FullCheck, "status" | "checked" | "total" | "brokenAt" | "reason">;

async function call(path: string): Promise<FullCheck> {
  const response = await fetch(path, { method: "POST", headers: { "content-type": "application/json" }, body: "{}" });
  const json = await response.json().catch(() => ({}));
  if (!response.ok) throw new Error(json.error ?? `The check failed (${response.status}).`);
  return json as FullCheck;
}

/** Starts a full check and runs it batch by batch, showing how far it got and what it found. */
export function FullCheckRunner() {
  const router = useRouter();
  const [progress, setProgress] = useState<Progress | null>(null);
  const [error, setError] = useState<string | null>(null);
  const running = progress?.status === "running";

  async function run() {
    setError(null);
    try {
      let check = await call("/api/v1/ledger/checks");
      setProgress(check);
      while (check.status === "running") {
        check = await call(`/api/v1/ledger/checks/${check.id}`);
        setProgress(check);
      }
      router.refresh();
    } catch (caught) {
      setError(caught instanceof Error ? caught.message : String(caught));
      setProgress(null);
    }
  }

  return (
    <div className="space-y-2">
      <button type="button" className="btn" onClick={run} disabled={running}>
        {running ? "Checking…" : "Check the whole ledger"}
      </button>
      {progress ? (
        <div className="space-y-1">
          <progress className="w-full" max={Math.max(progress.total, 1)} value={progress.checked} aria-label="Entries checked" />
          <p
            role="status"
            aria-label="Full check progress"
            className={`text-sm ${progress.status === "broken" ? "font-semibold text-verdict-impossible" : ""}`}
          >
            {progress.status === "running"
              ? `${progress.checked.toLocaleString("en-GB")} of ${progress.total.toLocaleString("en-GB")} entries checked…`
              : progress.status === "intact"
                ? `Intact: all ${progress.checked.toLocaleString("en-GB")} entries and every signed checkpoint hold.`
                : `Broken at entry #${progress.brokenAt}: ${progress.reason}.`}
          </p>
        </div>
      ) : null}
      {error ? (
        <p role="alert" className="text-sm text-verdict-impossible">
          {error}
        </p>
      ) : null}
    </div>
  );
}

"use client";

import { useState, useTransition } from "react";
import { DateTime } from "@/app/_components/date-time";
import { headLabel } from "@/lib/ledger/head";
import type { MemoCheckResult as Result } from "@/lib/server/memos";
import { fingerprintSchema } from "@/lib/validation/approvals";

async function post(body: FormData | { sha256: string }): Promise<{ result?: Result; error?: string }> {
  const response = await fetch(
    "/api/v1/memo-check",
    body instanceof FormData ? { method: "POST", body } : { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) },
  );
  const json = await response.json().catch(() => ({}));
  return response.ok ? { result: json as Result } : { error: json.error ?? `The check failed (${response.status}).` };
}

/** A memo file or a pasted fingerprint, sent to the public check route; the answer in words. */
export function MemoCheckForm() {
  const [file, setFile] = useState<File | null>(null);
  const [fingerprint, setFingerprint] = useState("");
  const [outcome, setOutcome] = useState<{ result?: Result; error?: string }>({});
  const [pending, startTransition] = useTransition();
  const checkFile = () =>
    startTransition(async () => {
      if (!file) return setOutcome({ error: "Choose the memo file first." });
      const form = new FormData();
      form.set("file", file);
      setOutcome(await post(form));
    });
  const checkFingerprint = () =>
    startTransition(async () => {
      const parsed = fingerprintSchema.safeParse({ sha256: fingerprint });
      setOutcome(parsed.success ? await post(parsed.data) : { error: parsed.error.issues[0].message });
    });
  return (
    <div className="space-y-4">
      <div className="grid gap-4 md:grid-cols-2">
        <form
          className="panel space-y-2"
          aria-label="Check a memo file"
          onSubmit={(e) => {
            e.preventDefault();
            checkFile();
          }}
        >
          <label className="label" htmlFor="memo-file">
            Memo file (PDF)
          </label>
          <input id="memo-file" type="file" accept="application/pdf,.pdf" className="text-sm" onChange={(e) => setFile(e.target.files?.[0] ?? null)} />
          <button type="submit" className="btn" disabled={pending}>
            Check the file
          </button>
        </form>
        <form
          className="panel space-y-2"
          aria-label="Check a fingerprint"
          onSubmit={(e) => {
            e.preventDefault();
            checkFingerprint();
          }}
        >
          <label className="label" htmlFor="memo-sha256">
            SHA-256 fingerprint
          </label>
          <input
            id="memo-sha256"
            className="field font-mono text-xs"
            spellCheck={false}
            value={fingerprint}
            onChange={(e) => setFingerprint(e.target.value)}
            placeholder="64 hexadecimal characters"
          />
          <button type="submit" className="btn" disabled={pending}>
            Check the fingerprint
          </button>
        </form>
      </div>
      {pending ? (
        <p className="text-sm text-ink-soft" role="status">
          Checking…
        </p>
      ) : null}
      {outcome.error ? (
        <p role="alert" className="text-sm text-verdict-impossible">
          {outcome.error}
        </p>
      ) : null}
      {outcome.result ? <Answer result={outcome.result} /> : null}
    </div>
  );
}

function Answer({ result }: { result: Result }) {
  if (!result.authentic) {
    return (
      <section role="status" aria-label="Check result" className="panel border-verdict-impossible">
        <p className="font-semibold text-verdict-impossible">✕ Not an authentic Ratecourt memo</p>
        <p className="text-sm">No memo was issued with this fingerprint. The file may have been changed, or it was never issued.</p>
        <p className="break-all font-mono text-xs text-ink-soft">{result.sha256}</p>
      </section>
    );
  }
  return (
    <section role="status" aria-label="Check result" className="panel space-y-1 border-verdict-plausible">
      <p className="font-semibold text-verdict-plausible">● Authentic memo {result.identifier}</p>
      <p className="text-sm">
        Tender {result.tender.reference}: {result.tender.title}
      </p>
      <p className="text-sm">
        Awarded <DateTime value={result.awardedAt} />
      </p>
      <ul className="text-sm">
        {result.approvedBy.map((a) => (
          <li key={a.name + a.at}>
            Approved by {a.name}, <DateTime value={a.at} />
          </li>
        ))}
      </ul>
      {result.ledgerHead ? (
        <p aria-label="Ledger head" className={`text-sm ${result.ledgerHead.inVerifiedChain ? "" : "font-semibold text-verdict-impossible"}`}>
          Issued at ledger {headLabel(result.ledgerHead)}. {result.ledgerHead.standing}
        </p>
      ) : null}
      <p className="break-all font-mono text-xs text-ink-soft">{result.sha256}</p>
    </section>
  );
}

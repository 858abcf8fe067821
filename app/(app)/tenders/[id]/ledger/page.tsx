import type { Metadata } from "next";
import { DateTime } from "@/app/_components/date-time";
import { orPage, pageViewer } from "@/lib/server/pages";
import { getTenderLedger } from "@/lib/server/tenders";
import { verifyTenderLedger } from "@/lib/server/ledger-verify";
import { summariseLedgerData } from "@/lib/tenders/ledger-summary";

export const metadata: Metadata = { title: "Tender ledger" };

/** The tender's audit trail: every change, who made it, and its place in the hash chain. */
export default async function TenderLedgerPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await pageViewer();
  const [ledger, check] = await orPage(Promise.all([getTenderLedger(viewer, id), verifyTenderLedger(viewer, id)]));
  return (
    <section className="panel overflow-x-auto" aria-label="Ledger">
      <h2>Ledger</h2>
      <p className="text-xs text-ink-soft">Append-only; each entry&apos;s hash covers its content and the entry before it, so a silent edit breaks the chain.</p>
      <p role="status" aria-label="Chain check" className={`mt-2 text-sm ${check.ok ? "text-verdict-plausible" : "font-semibold text-verdict-impossible"}`}>
        {check.ok
          ? `Chain verified through entry #${check.verifiedThrough.seq} (${check.checkedNow} new entries checked just now): all ${check.entries} entries of this tender are intact.`
          : `Chain broken at entry #${check.brokenAt} (${check.position === null ? "not one of this tender's" : `position ${check.position} of this tender`}): ${check.reason}.`}
      </p>
      <table className="data-table mt-2">
        <thead><tr><th>#</th><th>When</th><th>Who</th><th>What</th><th>Details</th><th>Hash</th></tr></thead>
        <tbody>
          {ledger.map((e) => (
            <tr key={e.seq}>
              <td className="tabular-nums">{e.seq}</td>
              <td className="whitespace-nowrap"><DateTime value={e.at} /></td>
              <td>{e.actorLabel}</td>
              <td className="font-mono text-xs">{e.action}</td>
              <td className="max-w-md text-xs text-ink-soft">{summariseLedgerData(e.data)}</td>
              <td className="font-mono text-xs text-ink-soft" title={e.hash}>{e.hash.slice(0, 12)}…</td>
            </tr>
          ))}
          {ledger.length === 0 ? <tr><td colSpan={6} className="text-ink-soft">No entry yet.</td></tr> : null}
        </tbody>
      </table>
    </section>
  );
}

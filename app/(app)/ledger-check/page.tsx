import type { Metadata } from "next";
import { DateTime } from "@/app/_components/date-time";
import { TablePanel } from "@/app/_components/table-panel";
import { recentFullChecks } from "@/lib/server/ledger-full-check";
import { verifyWholeLedger } from "@/lib/server/ledger-verify";
import { orPage, pageViewer } from "@/lib/server/pages";
import { FullCheckRunner } from "./_components/full-check-runner";

export const metadata: Metadata = { title: "Ledger check" };

/** The admin's full re-verification of the whole ledger, with where the everyday checks stand. */
export default async function LedgerCheckPage() {
  const viewer = await pageViewer();
  const [checks, chain] = await orPage(Promise.all([recentFullChecks(viewer), verifyWholeLedger(viewer)]));
  return (
    <div className="space-y-5">
      <h1>Ledger check</h1>
      <p className="max-w-3xl text-sm text-ink-soft">
        Every view of a ledger hashes only the entries added since the last check, and compares the newest signed checkpoints with the chain. A full check
        hashes every entry again, in batches, and finds an old entry edited in place as well.
      </p>
      <section className="panel space-y-1" aria-label="Chain now">
        <h2>The chain now</h2>
        <p role="status" aria-label="Chain state" className={`text-sm ${chain.ok ? "text-verdict-plausible" : "font-semibold text-verdict-impossible"}`}>
          {chain.ok
            ? `Verified through entry #${chain.verifiedThrough.seq} of ${chain.entries} entries.`
            : `Broken at entry #${chain.brokenAt}: ${chain.reason}.`}
        </p>
        <p className="text-sm">
          {chain.anchors.newest
            ? `${chain.anchors.outside} signed checkpoints kept outside the database; the newest is at entry #${chain.anchors.newest.seq}.`
            : "No signed checkpoint yet."}
        </p>
        <p className="text-xs text-ink-soft">{chain.anchors.limit}</p>
      </section>
      <section className="panel space-y-2" aria-label="Full check">
        <h2>Full check</h2>
        <FullCheckRunner />
      </section>
      <TablePanel
        label="Recent full checks"
        title="Recent full checks"
        columns={["Started", "By", "Entries", "Result"]}
        empty="No full check yet."
        isEmpty={checks.length === 0}
      >
        {checks.map((c) => (
          <tr key={c.id}>
            <td className="whitespace-nowrap">
              <DateTime value={c.createdAt} />
            </td>
            <td>{c.startedByName}</td>
            <td className="tabular-nums">
              {c.checked} of {c.total}
            </td>
            <td>{c.status === "running" ? "Not finished" : c.status === "intact" ? "Intact" : `Broken at entry #${c.brokenAt}: ${c.reason}`}</td>
          </tr>
        ))}
      </TablePanel>
    </div>
  );
}

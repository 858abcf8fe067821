import type { Metadata } from "next";
import Link from "next/link";
import { DateTime } from "@/app/_components/date-time";
import { orPage, pageViewer } from "@/lib/server/pages";
import { readTenderLedger } from "@/lib/server/tender-ledger";
import { verifyTenderLedger } from "@/lib/server/ledger-verify";

export const metadata: Metadata = { title: "Tender ledger" };

/** The tender's audit trail, newest first: each change as a sentence, its details on request, its place in the hash chain. */
export default async function TenderLedgerPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ page?: string }> }) {
  const { id } = await params;
  const asked = Number((await searchParams).page ?? "1");
  const viewer = await pageViewer();
  const [ledger, check] = await orPage(Promise.all([readTenderLedger(viewer, id, Number.isFinite(asked) ? asked : 1), verifyTenderLedger(viewer, id)]));
  const pageLink = (page: number) => `/tenders/${id}/ledger?page=${page}`;
  return (
    <section className="panel" aria-label="Ledger">
      <h2>Ledger</h2>
      <p className="text-xs text-ink-soft">
        Append-only; each entry&apos;s hash covers its content and the entry before it, so a silent edit breaks the chain. Details your role does not read are
        withheld.
      </p>
      <p role="status" aria-label="Chain check" className={`mt-2 text-sm ${check.ok ? "text-verdict-plausible" : "font-semibold text-verdict-impossible"}`}>
        {check.ok
          ? `Chain verified through entry #${check.verifiedThrough.seq} (${check.checkedNow} new entries checked just now): all ${check.entries} entries of this tender are intact.`
          : `Chain broken at entry #${check.brokenAt} (${check.position === null ? "not one of this tender's" : `position ${check.position} of this tender`}): ${check.reason}.`}
      </p>
      <ol className="mt-3 space-y-1" aria-label="Entries, newest first">
        {ledger.entries.map((e) => (
          <li key={e.seq} className="border-t border-ink-faint/20 pt-1">
            <details>
              <summary className="cursor-pointer text-sm">
                <span className="mr-2 tabular-nums text-ink-muted">#{e.seq}</span>
                {e.sentence}{" "}
                <span className="text-xs text-ink-soft">
                  <DateTime value={e.at} />
                </span>
              </summary>
              <dl className="ml-6 mt-1 grid grid-cols-[max-content_1fr] gap-x-3 text-xs">
                {e.details.map((d) => (
                  <div key={d.key} className="contents">
                    <dt className="text-ink-soft">{d.key}</dt>
                    <dd>{d.text}</dd>
                  </div>
                ))}
                {e.masked.length ? (
                  <div className="contents">
                    <dt className="text-ink-soft">withheld</dt>
                    <dd className="italic">{e.masked.join(", ")} (your role does not read these)</dd>
                  </div>
                ) : null}
                <div className="contents">
                  <dt className="text-ink-soft">record</dt>
                  <dd className="font-mono">{e.action}</dd>
                </div>
                <div className="contents">
                  <dt className="text-ink-soft">hash</dt>
                  <dd className="break-all font-mono">{e.hash}</dd>
                </div>
              </dl>
            </details>
          </li>
        ))}
        {ledger.entries.length === 0 ? <li className="text-sm text-ink-soft">No entry yet.</li> : null}
      </ol>
      {ledger.pages > 1 ? (
        <nav aria-label="Ledger pages" className="mt-3 flex items-center gap-3 text-sm">
          {ledger.page > 1 ? <Link href={pageLink(ledger.page - 1)}>Newer</Link> : null}
          <span>
            Page {ledger.page} of {ledger.pages} ({ledger.total} entries)
          </span>
          {ledger.page < ledger.pages ? <Link href={pageLink(ledger.page + 1)}>Older</Link> : null}
        </nav>
      ) : null}
    </section>
  );
}

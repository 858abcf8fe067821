import type { Metadata } from "next";
import { DateTime } from "@/app/_components/date-time";
import { StateTag } from "@/app/_components/state-tag";
import { CHANNEL_LABELS, formatCondition, formatSci } from "@/lib/format";
import { orPage, pageViewer } from "@/lib/server/pages";
import { getTender, getTenderLedger } from "@/lib/server/tenders";

export const metadata: Metadata = { title: "Tender" };

export default async function TenderPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await pageViewer();
  const tender = await orPage(getTender(viewer, id));
  const ledger = viewer.ability.can("read", "Ledger") ? await orPage(getTenderLedger(viewer, id)) : null;
  return (
    <div className="space-y-5">
      <div className="flex items-baseline gap-3">
        <span className="font-mono text-sm text-ink-soft">{tender.reference}</span>
        <h1 className="flex-1">{tender.title}</h1>
        <StateTag state={tender.state} />
      </div>
      <section className="panel space-y-3" aria-label="Requirements">
        <h2>Requirements</h2>
        <p className="text-sm">{tender.description}</p>
        <dl className="grid grid-cols-2 gap-x-6 gap-y-2 text-sm md:grid-cols-4">
          <div><dt className="label">Channel</dt><dd>{CHANNEL_LABELS[tender.channelModel].name}</dd></div>
          <div><dt className="label">Residual error required</dt><dd>{tender.targetMetric.toUpperCase()} ≤ {formatSci(tender.targetValue)}</dd></div>
          <div><dt className="label">Longest frame</dt><dd>{tender.maxFrameBits ? `${tender.maxFrameBits.toLocaleString("en-GB")} bits` : "no limit"}</dd></div>
          <div><dt className="label">Quantity</dt><dd className="tabular-nums">{tender.quantity.toLocaleString("en-GB")} ({tender.currency})</dd></div>
          <div><dt className="label">Closes</dt><dd><DateTime value={tender.closesAt} zone={tender.closesZone} /></dd></div>
          <div><dt className="label">If a claim is impossible</dt><dd>{tender.impossibleRule === "disqualify" ? "offer disqualified" : `penalty of ${tender.impossiblePenalty} points`}</dd></div>
        </dl>
        <div>
          <h3 className="label mt-2">Operating points</h3>
          <ul className="text-sm">
            {tender.operatingPoints.map((point) => (
              <li key={point.label}>{point.label}: {formatCondition(tender.channelModel, point.value)}</li>
            ))}
          </ul>
        </div>
      </section>
      {ledger ? (
        <section className="panel" aria-label="Ledger">
          <h2>Ledger</h2>
          <table className="data-table mt-2">
            <thead><tr><th>#</th><th>When</th><th>Who</th><th>What</th><th>Hash</th></tr></thead>
            <tbody>
              {ledger.map((e) => (
                <tr key={e.seq}>
                  <td className="tabular-nums">{e.seq}</td>
                  <td><DateTime value={e.at} /></td>
                  <td>{e.actorLabel}</td>
                  <td>{e.action}</td>
                  <td className="font-mono text-xs text-ink-soft">{e.hash.slice(0, 12)}…</td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      ) : null}
    </div>
  );
}

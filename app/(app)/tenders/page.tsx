import type { Metadata } from "next";
import Link from "next/link";
import { DateTime } from "@/app/_components/date-time";
import { StateTag } from "@/app/_components/state-tag";
import { CHANNEL_LABELS } from "@/lib/format";
import { orPage, pageViewer } from "@/lib/server/pages";
import { listTenders } from "@/lib/server/tenders";

export const metadata: Metadata = { title: "Tenders" };

export default async function TendersPage() {
  const viewer = await pageViewer();
  const tenders = await orPage(listTenders(viewer));
  return (
    <div className="space-y-4">
      <div className="flex items-center justify-between gap-3">
        <h1>Tenders</h1>
        {viewer.ability.can("create", "Tender") ? (
          <Link href="/tenders/new" className="btn no-underline hover:no-underline">New tender</Link>
        ) : null}
      </div>
      <div className="panel overflow-x-auto p-0">
        <table className="data-table">
          <thead>
            <tr>
              <th>Reference</th>
              <th>Title</th>
              <th>Channel</th>
              <th>State</th>
              <th className="text-right">Quantity</th>
              <th>Closes</th>
            </tr>
          </thead>
          <tbody>
            {tenders.map((t) => (
              <tr key={t.id}>
                <td className="font-mono text-xs">{t.reference}</td>
                <td><Link href={`/tenders/${t.id}`}>{t.title}</Link></td>
                <td className="text-ink-soft">{CHANNEL_LABELS[t.channelModel].name}</td>
                <td><StateTag state={t.state} /></td>
                <td className="text-right tabular-nums">{t.quantity.toLocaleString("en-GB")}</td>
                <td><DateTime value={t.closesAt} zone={t.closesZone} /></td>
              </tr>
            ))}
            {tenders.length === 0 ? (
              <tr><td colSpan={6} className="text-ink-soft">No tender to show.</td></tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}

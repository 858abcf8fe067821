import type { Metadata } from "next";
import { FormStatus } from "@/app/_components/form-status";
import Link from "next/link";
import { DateTime } from "@/app/_components/date-time";
import { FilterForm, FilterSelect, FilterText } from "@/app/_components/list-filters";
import { Pager, pageHref } from "@/app/_components/pager";
import { STATE_LABELS, StateTag } from "@/app/_components/state-tag";
import { CHANNEL_LABELS } from "@/lib/format";
import { orPage, pageQuery, pageViewer } from "@/lib/server/pages";
import { listTenderPage } from "@/lib/server/tenders";
import { tenderListQuerySchema } from "@/lib/validation/tender";

export const metadata: Metadata = { title: "Tenders" };

type Search = Promise<Record<string, string | string[] | undefined>>;

/** One page of the tenders the viewer may read; the state, text and page live in the address. */
export default async function TendersPage({ searchParams }: { searchParams: Search }) {
  const viewer = await pageViewer();
  const { query, problem } = pageQuery(await searchParams, tenderListQuerySchema);
  const { tenders, paging } = await orPage(listTenderPage(viewer, query));
  const filters = { state: query.state, q: query.q, size: query.size === tenderListQuerySchema.parse({}).size ? undefined : query.size };
  const filtered = Boolean(query.state || query.q);
  return (
    <div className="space-y-4">
      <div className="flex items-center justify-between gap-3">
        <h1>Tenders</h1>
        {viewer.ability.can("create", "Tender") ? (
          <Link href="/tenders/new" className="btn no-underline hover:no-underline">
            New tender
          </Link>
        ) : null}
      </div>
      <FilterForm action="/tenders" label="Find tenders" filtered={filtered}>
        <FilterText id="tender-q" name="q" label="Reference or title contains" value={query.q} />
        <FilterSelect id="tender-state" name="state" label="State" value={query.state} any="Any state" options={Object.entries(STATE_LABELS)} />
      </FilterForm>
      <FormStatus result={{ ok: false, message: problem ?? undefined }} />
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
                <td>
                  <Link href={`/tenders/${t.id}`}>{t.title}</Link>
                </td>
                <td className="text-ink-soft">{CHANNEL_LABELS[t.channelModel].name}</td>
                <td>
                  <StateTag state={t.state} />
                </td>
                <td className="text-right tabular-nums">{t.quantity.toLocaleString("en-GB")}</td>
                <td>
                  <DateTime value={t.closesAt} zone={t.closesZone} />
                </td>
              </tr>
            ))}
            {tenders.length === 0 ? (
              <tr>
                <td colSpan={6} className="text-ink-soft">
                  {filtered ? "No tender matches these filters." : "No tender to show."}
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
      <Pager info={paging} noun={["tender", "tenders"]} href={(page) => pageHref("/tenders", filters, page)} />
    </div>
  );
}

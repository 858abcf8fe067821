"use client";

import { formatMarginDb } from "@/lib/offers/radio";
import { useMemo, useState } from "react";
import Link from "next/link";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { QueryClient, QueryClientProvider, useQuery } from "@tanstack/react-query";
import type { ColDef, ICellRendererParams } from "ag-grid-community";
import { DataGrid } from "@/app/_components/data-grid";
import { Pager, pageHref } from "@/app/_components/pager";
import { VerdictBadge } from "@/app/_components/verdict-badge";
import { formatCondition, formatSci } from "@/lib/format";
import { VERDICT_LABELS, VERDICTS } from "@/lib/bounds/vocabulary";
import { EVIDENCE_LABELS, MARK_LABELS } from "@/lib/review/labels";
import type { ClaimQueuePage, QueueRow } from "@/lib/server/review";

const FILTERS = ["tenderId", "vendor", "verdict", "mark"] as const;
type Filter = (typeof FILTERS)[number];
/** What the address carries: the filters, then the page and its size. */
const PARAMS = [...FILTERS, "page", "size"] as const;

async function fetchQueue(query: string): Promise<ClaimQueuePage> {
  const response = await fetch(`/api/v1/claims?${query}`, { headers: { accept: "application/json" } });
  const body = await response.json();
  if (!response.ok) throw new Error(body.error ?? "The queue could not be read.");
  return body;
}

/** The queue, kept fresh by polling; its filters live in the URL so a filtered view can be shared. */
export function ReviewQueue(props: { tenders: { id: string; reference: string }[] }) {
  const [client] = useState(() => new QueryClient());
  return (
    <QueryClientProvider client={client}>
      <Queue {...props} />
    </QueryClientProvider>
  );
}

function Queue({ tenders }: { tenders: { id: string; reference: string }[] }) {
  const router = useRouter();
  const pathname = usePathname();
  const search = useSearchParams();
  const asked = Object.fromEntries(PARAMS.flatMap((f) => (search.get(f) ? [[f, search.get(f)!]] : [])));
  const query = new URLSearchParams(asked).toString();
  const { data, error, isFetching } = useQuery({ queryKey: ["claims", query], queryFn: () => fetchQueue(query), refetchInterval: 5000 });
  const rows = useMemo(() => data?.claims ?? [], [data]);
  const vendors = useMemo(() => (data?.vendors ?? []).map((v): [string, string] => [v.id, v.name]), [data]);

  const setFilter = (name: Filter, value: string) => {
    const next = new URLSearchParams(search.toString());
    if (value) next.set(name, value);
    else next.delete(name);
    // Another filter is another list: back to its first page.
    next.delete("page");
    router.replace(`${pathname}${next.size ? `?${next}` : ""}`, { scroll: false });
  };
  const select = (name: Filter, label: string, options: [string, string][]) => (
    <div>
      <label className="label" htmlFor={`filter-${name}`}>
        {label}
      </label>
      <select id={`filter-${name}`} className="field" value={search.get(name) ?? ""} onChange={(e) => setFilter(name, e.target.value)}>
        <option value="">All</option>
        {options.map(([value, text]) => (
          <option key={value} value={value}>
            {text}
          </option>
        ))}
      </select>
    </div>
  );

  const columns = useMemo<ColDef<QueueRow>[]>(
    () => [
      {
        field: "verdict",
        headerName: "Verdict",
        width: 160,
        cellRenderer: (p: ICellRendererParams<QueueRow>) => (p.data ? <VerdictBadge verdict={p.data.verdict} /> : null),
      },
      { field: "tenderReference", headerName: "Tender", width: 130 },
      { field: "vendorName", headerName: "Vendor", flex: 1 },
      { field: "moduleName", headerName: "Module", flex: 1 },
      {
        headerName: "Operating point",
        flex: 1.2,
        valueGetter: (p) => p.data && `${p.data.pointLabel}: ${formatCondition(p.data.channelModel, p.data.channelValue)}`,
      },
      {
        headerName: "Claimed",
        width: 140,
        valueGetter: (p) =>
          p.data &&
          (p.data.sensitivityDbm !== null
            ? `${p.data.sensitivityDbm} dBm at PER ${formatSci(p.data.value)}, worst margin ${formatMarginDb(p.data.worstMarginDb)}`
            : p.data.metric === "ncg"
              ? `NCG ${p.data.value} dB`
              : `${p.data.metric.toUpperCase()} ${formatSci(p.data.value)}`),
      },
      { headerName: "Mark", width: 190, valueGetter: (p) => (p.data?.mark ? MARK_LABELS[p.data.mark as keyof typeof MARK_LABELS] : "Not marked") },
      { headerName: "Evidence", width: 130, valueGetter: (p) => (p.data?.evidence ? EVIDENCE_LABELS[p.data.evidence] : "") },
      {
        headerName: "",
        width: 90,
        sortable: false,
        cellRenderer: (p: ICellRendererParams<QueueRow>) =>
          p.data ? (
            <Link href={`/review/claims/${p.data.id}`} aria-label={`Open claim ${p.data.vendorName} ${p.data.pointLabel}`}>
              Open
            </Link>
          ) : null,
      },
    ],
    [],
  );

  return (
    <section className="space-y-3" aria-label="Claims to review">
      <div className="grid grid-cols-2 gap-3 md:grid-cols-4">
        {select(
          "tenderId",
          "Tender",
          tenders.map((t) => [t.id, t.reference]),
        )}
        {select("vendor", "Vendor", vendors)}
        {select(
          "verdict",
          "Verdict",
          VERDICTS.map((v) => [v, VERDICT_LABELS[v]]),
        )}
        {select("mark", "Mark", [["unmarked", "Not marked"], ...(Object.entries(MARK_LABELS) as [string, string][])])}
      </div>
      <p className="text-xs text-ink-soft" role="status">
        {error ? error.message : data ? `${data.total} ${data.total === 1 ? "claim" : "claims"}${isFetching ? ", refreshing…" : ""}` : "Reading the queue…"}
      </p>
      <DataGrid<QueueRow>
        label="Claims"
        rowData={rows}
        columnDefs={columns}
        defaultColDef={{ sortable: false }}
        getRowId={(p) => p.data.id}
        height={460}
        empty={
          query
            ? { title: "No claims match these filters", hint: "Set a filter above back to “All” to widen the list." }
            : {
                title: "No claims to review",
                hint: "Claims of tenders in technical evaluation appear here once you have declared on them (above); this list refreshes on its own.",
              }
        }
      />
      {data ? <Pager info={data} noun={["claim", "claims"]} href={(page) => pageHref(pathname, asked, page)} /> : null}
    </section>
  );
}

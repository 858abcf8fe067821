"use client";

import { useMemo, useState } from "react";
import type { ColDef, ColGroupDef, GridApi, ValueFormatterParams } from "ag-grid-community";
import { DataGrid } from "@/app/_components/data-grid";
import { VerdictBadge, type Verdict } from "@/app/_components/verdict-badge";
import { formatMoney } from "@/lib/format";
import { comparisonRows, CRITERIA, CRITERION_LABELS, csvCell, type ComparisonRow, type ScoreSheet, type ScoringInput } from "@/lib/scoring";

const score = (p: ValueFormatterParams<ComparisonRow>) => (p.value == null ? "–" : Number(p.value).toFixed(1));
// Numbers sort rather than filter: with a handful of offers a sort answers the question, so only the
// columns one narrows by (vendor, module, verdict, evidence, status) carry a filter.
const numeric = { type: "rightAligned", width: 110 } as const;

function columnsFor(input: ScoringInput, currency: string): (ColDef<ComparisonRow> | ColGroupDef<ComparisonRow>)[] {
  const money = (p: ValueFormatterParams<ComparisonRow>) => (p.value == null ? "–" : formatMoney(Number(p.value), currency));
  return [
    { field: "vendorName", headerName: "Vendor", pinned: "left", filter: true, width: 190 },
    {
      headerName: "Code",
      children: [
        { field: "moduleName", headerName: "Module", filter: true, width: 170 },
        { field: "n", headerName: "n (bits)", ...numeric, width: 95 },
        { field: "k", headerName: "k (bits)", ...numeric, width: 95 },
        { field: "rate", headerName: "Rate", ...numeric, width: 85, valueFormatter: (p) => (p.value == null ? "–" : Number(p.value).toFixed(3)) },
      ],
    },
    {
      headerName: "Operating points",
      children: [
        ...input.tender.operatingPoints.flatMap((point, i): ColDef<ComparisonRow>[] => [
          {
            colId: `verdict-${i}`,
            headerName: `${point.label}: verdict`,
            valueGetter: (p) => p.data?.points[i]?.verdict ?? "no claim",
            cellRenderer: (p: { value: string }) => (p.value === "no claim" ? "–" : <VerdictBadge verdict={p.value as Verdict} />),
            filter: true,
            width: 180,
          },
          {
            colId: `margin-${i}`,
            headerName: point.sensitivity ? `${point.label}: worst margin (dB Eb/N0 over the limit)` : `${point.label}: channel margin`,
            valueGetter: (p) => p.data?.points[i]?.margin ?? "–",
            width: point.sensitivity ? 260 : 150,
            type: "rightAligned",
          },
        ]),
        { field: "evidence", headerName: "Evidence", filter: true, width: 140 },
      ],
    },
    {
      headerName: "Commercial",
      children: [
        // Total price, total score and rank stay in view however far the grid scrolls.
        { field: "totalPrice", headerName: `Total price (${currency})`, ...numeric, width: 160, valueFormatter: money, pinned: "right" },
        { field: "unitPrice", headerName: `Unit price (${currency})`, ...numeric, width: 140, valueFormatter: money },
        { field: "leadTimeWeeks", headerName: "Lead time (weeks)", ...numeric, width: 140 },
        { field: "warrantyMonths", headerName: "Warranty (months)", ...numeric, width: 140 },
      ],
    },
    {
      headerName: "Scores",
      children: [
        ...CRITERIA.map((c): ColDef<ComparisonRow> => ({
          colId: `score-${c}`,
          headerName: `${CRITERION_LABELS[c]} score`,
          valueGetter: (p) => p.data?.scores[c] ?? null,
          valueFormatter: score,
          ...numeric,
        })),
        { field: "total", headerName: "Total", ...numeric, width: 100, valueFormatter: score, pinned: "right" },
        { field: "rank", headerName: "Rank", ...numeric, width: 80, valueFormatter: (p) => (p.value == null ? "–" : String(p.value)), pinned: "right" },
        { field: "status", headerName: "Status", filter: true, width: 260, tooltipField: "status" },
      ],
    },
  ];
}

/** The Comparison grid: one row per current offer; sort, filter, keyboard and CSV export are AG Grid's own. */
export function ComparisonGrid({
  input,
  sheet,
  reference,
  canExport,
  onSelect,
}: {
  input: ScoringInput;
  sheet: ScoreSheet;
  reference: string;
  canExport: boolean;
  onSelect: (offerId: string | null) => void;
}) {
  const [api, setApi] = useState<GridApi<ComparisonRow> | null>(null);
  const rows = useMemo(() => comparisonRows(input, sheet), [input, sheet]);
  const columns = useMemo(() => columnsFor(input, sheet.currency), [input, sheet.currency]);
  const exportCsv = () =>
    api?.exportDataAsCsv({ fileName: `${reference}-comparison.csv`, skipColumnGroupHeaders: true, processCellCallback: (p) => csvCell(p.value) });

  return (
    <section className="print-wide space-y-2" aria-label="Comparison">
      <div className="flex items-center gap-3">
        <h2 className="flex-1">
          Comparison of {rows.length} {rows.length === 1 ? "offer" : "offers"}
        </h2>
        {canExport ? (
          <button type="button" className="btn-quiet" onClick={exportCsv} disabled={!api}>
            Export CSV
          </button>
        ) : null}
      </div>
      <DataGrid<ComparisonRow>
        label="Comparison grid"
        rowData={rows}
        columnDefs={columns}
        getRowId={(p) => p.data.offerId}
        defaultColDef={{ sortable: true, resizable: true }}
        rowSelection={{ mode: "singleRow", checkboxes: false, enableClickSelection: true }}
        onSelectionChanged={(e) => onSelect(e.api.getSelectedRows()[0]?.offerId ?? null)}
        onGridReady={(e) => setApi(e.api)}
        empty={{
          title: "No offers to compare yet",
          hint: "Offers appear here once the envelopes are opened. Vendors can submit until the deadline; check the tender's Offers tab.",
        }}
        ensureDomOrder
        // Every column in the page, not only those scrolled into view: screen readers and the export checks read them all.
        suppressColumnVirtualisation
        height={Math.min(560, 110 + rows.length * 34)}
      />
    </section>
  );
}

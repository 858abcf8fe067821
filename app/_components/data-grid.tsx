"use client";

import { useEffect, useMemo, useRef, useSyncExternalStore } from "react";
import { AgGridReact, type AgGridReactProps } from "ag-grid-react";
import { AllCommunityModule, ModuleRegistry, themeQuartz, type ColDef, type ColGroupDef, type GridApi, type GridReadyEvent } from "ag-grid-community";

ModuleRegistry.registerModules([AllCommunityModule]);

// Ratecourt's grid look, in one place: Inter at the app's size, ink on paper, a quiet sunk header with
// small-caps labels (like the app's .data-table), hairline row rules, no vertical rules, dense rows,
// the teal accent only for focus and selection. Colours are the tokens of tailwind.config.ts.
const theme = themeQuartz.withParams({
  fontFamily: "var(--font-sans)",
  fontSize: 13,
  foregroundColor: "#1c2430",
  textColor: "#1c2430",
  backgroundColor: "#ffffff",
  accentColor: "#0f5e6b",
  borderColor: "rgba(138,148,166,0.30)",
  wrapperBorder: { color: "rgba(138,148,166,0.35)" },
  wrapperBorderRadius: 8,
  spacing: 6,
  rowHeight: 34,
  headerHeight: 34,
  headerBackgroundColor: "#eef1f5",
  headerTextColor: "#4a5568",
  headerFontSize: 11,
  headerFontWeight: 600,
  headerColumnBorder: false,
  headerColumnResizeHandleColor: "rgba(138,148,166,0.45)",
  headerRowBorder: { color: "rgba(138,148,166,0.45)" },
  columnBorder: false,
  rowBorder: { color: "rgba(138,148,166,0.18)" },
  oddRowBackgroundColor: "#ffffff",
  rowHoverColor: "rgba(15,94,107,0.05)",
  selectedRowBackgroundColor: "rgba(15,94,107,0.12)",
  pinnedColumnBorder: { color: "rgba(138,148,166,0.45)" },
  iconSize: 14,
  inputFocusBorder: { color: "#0f5e6b" },
});

export interface EmptyState {
  /** What is missing, in the words of the page ("No claims wait for review"). */
  title: string;
  /** What to do next ("Change a filter above, or come back when vendors submit"). */
  hint?: string;
}

const DEFAULT_EMPTY: EmptyState = {
  title: "Nothing to list yet",
  hint: "Rows appear here as soon as there is something to show; check the filters above if you expected some.",
};

function EmptyOverlay({ title, hint }: EmptyState) {
  return (
    <div className="rc-grid-empty" role="status">
      <p className="text-sm font-medium text-ink">{title}</p>
      {hint ? <p className="mt-1 max-w-sm text-xs text-ink-soft">{hint}</p> : null}
    </div>
  );
}

const PHONE = "(max-width: 767px)";
const subscribe = (change: () => void) => {
  const query = window.matchMedia(PHONE);
  query.addEventListener("change", change);
  return () => query.removeEventListener("change", change);
};
/** True below the md breakpoint; false on the server, so the first paint matches the server's. */
function useNarrow() {
  return useSyncExternalStore(
    subscribe,
    () => window.matchMedia(PHONE).matches,
    () => false,
  );
}

function unpin<T>(defs: (ColDef<T> | ColGroupDef<T>)[]): (ColDef<T> | ColGroupDef<T>)[] {
  return defs.map((d) => ("children" in d ? { ...d, children: unpin(d.children) } : { ...d, pinned: null }));
}

/** AG Grid in Ratecourt's theme; every table of records uses it. */
export function DataGrid<T>(props: AgGridReactProps<T> & { height?: number; label: string; empty?: EmptyState }) {
  const { height = 420, label, empty = DEFAULT_EMPTY, onGridReady, ...rest } = props;
  const api = useRef<GridApi<T> | null>(null);
  const box = useRef<HTMLDivElement>(null);
  const narrow = useNarrow();
  // On a phone, pinned columns would fill the screen and leave no room to scroll: nothing is pinned.
  const columnDefs = useMemo(() => (narrow && rest.columnDefs ? unpin(rest.columnDefs) : rest.columnDefs), [narrow, rest.columnDefs]);
  // On paper every row prints at full height: the grid takes its print layout for the print only.
  useEffect(() => {
    const layout = (domLayout: "print" | "normal") => () => {
      if (box.current) box.current.style.height = domLayout === "print" ? "auto" : `${height}px`;
      api.current?.setGridOption("domLayout", domLayout);
    };
    const before = layout("print");
    const after = layout("normal");
    window.addEventListener("beforeprint", before);
    window.addEventListener("afterprint", after);
    return () => {
      window.removeEventListener("beforeprint", before);
      window.removeEventListener("afterprint", after);
    };
  }, [height]);
  return (
    // The grid scrolls inside its own box; the page itself never grows wider than the screen.
    <div ref={box} className="rc-grid max-w-full" style={{ height }} aria-label={label} role="region">
      <AgGridReact<T>
        theme={theme}
        animateRows={false}
        noRowsOverlayComponent={EmptyOverlay}
        noRowsOverlayComponentParams={empty}
        overlayComponentParams={{
          noMatchingRows: { overlayText: "No rows match the column filters. Clear a filter (the funnel in its header) to see them again." },
        }}
        {...rest}
        columnDefs={columnDefs}
        onGridReady={(e: GridReadyEvent<T>) => {
          api.current = e.api;
          onGridReady?.(e);
        }}
      />
    </div>
  );
}

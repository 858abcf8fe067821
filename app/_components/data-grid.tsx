"use client";

import { AgGridReact, type AgGridReactProps } from "ag-grid-react";
import { AllCommunityModule, ModuleRegistry, themeQuartz } from "ag-grid-community";

ModuleRegistry.registerModules([AllCommunityModule]);

// Ratecourt's grid look: the same slate and teal as the rest of the app, dense rows.
const theme = themeQuartz.withParams({
  fontFamily: "var(--font-sans)",
  fontSize: 13,
  accentColor: "#0f5e6b",
  headerBackgroundColor: "#eef1f5",
  rowHeight: 34,
  headerHeight: 36,
  borderColor: "rgba(138,148,166,0.3)",
});

/** AG Grid with the app's theme; every table of records uses it. */
export function DataGrid<T>(props: AgGridReactProps<T> & { height?: number; label: string }) {
  const { height = 420, label, ...rest } = props;
  return (
    <div style={{ height }} aria-label={label} role="region">
      <AgGridReact<T> theme={theme} animateRows={false} {...rest} />
    </div>
  );
}

"use client";

// Ratecourt's chart frame: the axis titles and the key are plain text outside the plot, and the
// labels of vertical marker lines each get their own row above it, so none of them can cover
// another at any width. Markers differ by shape and fill as well as colour (grey-scale print).
import type { ReactNode } from "react";

export const INK = { grid: "#e4e8ee", axis: "#5b6678", text: "#4a5568" };

export type MarkerShape = "cross" | "diamond" | "disc" | "ring" | "square";

/** A marker drawn at (cx, cy); recharts calls shape functions with those props. */
export function Marker({
  cx = 0,
  cy = 0,
  shape,
  colour,
  size = 5,
  title,
}: {
  cx?: number;
  cy?: number;
  shape: MarkerShape;
  colour: string;
  size?: number;
  title?: string;
}) {
  const s = size;
  const body =
    shape === "cross" ? (
      <path d={`M${cx - s} ${cy - s}L${cx + s} ${cy + s}M${cx - s} ${cy + s}L${cx + s} ${cy - s}`} stroke={colour} strokeWidth={2.5} strokeLinecap="round" />
    ) : shape === "diamond" ? (
      <path d={`M${cx} ${cy - s - 1}L${cx + s + 1} ${cy}L${cx} ${cy + s + 1}L${cx - s - 1} ${cy}Z`} fill="#fff" stroke={colour} strokeWidth={2} />
    ) : shape === "square" ? (
      <rect x={cx - s} y={cy - s} width={2 * s} height={2 * s} fill={colour} stroke="#fff" strokeWidth={1} />
    ) : (
      <circle cx={cx} cy={cy} r={s} fill={shape === "disc" ? colour : "#fff"} stroke={colour} strokeWidth={2} />
    );
  return (
    <g>
      {title ? <title>{title}</title> : null}
      {body}
    </g>
  );
}

/** A key entry: a line sample (with its dash pattern) or a marker. */
export type KeyEntry = { name: string; colour: string } & ({ dash?: string; width?: number; marker?: never } | { marker: MarkerShape });

function Swatch({ entry }: { entry: KeyEntry }) {
  return (
    <svg width="26" height="12" aria-hidden className="shrink-0">
      {entry.marker ? (
        <Marker cx={13} cy={6} shape={entry.marker} colour={entry.colour} size={4} />
      ) : (
        <line x1="1" y1="6" x2="25" y2="6" stroke={entry.colour} strokeWidth={entry.width ?? 2} strokeDasharray={entry.dash} />
      )}
    </svg>
  );
}

/** Height of one row of marker-line labels above the plot, in pixels. */
export const LABEL_ROW = 14;

/**
 * The label of a vertical marker line, on its own row above the plot (recharts passes the line's
 * viewBox). Anchored towards the middle of the plot so it never runs off either edge.
 */
export function LineTag({
  viewBox,
  row,
  text,
  colour,
  anchorEnd,
}: {
  viewBox?: { x: number; y: number };
  row: number;
  text: string;
  colour: string;
  anchorEnd: boolean;
}) {
  if (!viewBox) return null;
  return (
    <text
      data-chart-part="line-label"
      x={viewBox.x + (anchorEnd ? -3 : 3)}
      y={viewBox.y - 5 - row * LABEL_ROW}
      textAnchor={anchorEnd ? "end" : "start"}
      fontSize={11}
      fill={colour}
    >
      {text}
    </text>
  );
}

/** The frame: y title above the plot, x title below it, then the key, all outside the drawing. */
export function ChartFrame({
  label,
  xTitle,
  yTitle,
  entries,
  children,
}: {
  label: string;
  xTitle: string;
  yTitle: string;
  entries: KeyEntry[];
  children: ReactNode;
}) {
  return (
    <figure aria-label={label} className="w-full min-w-0 space-y-1">
      <div data-chart-part="y-title" className="text-xs font-medium tracking-wide text-ink-soft">
        {yTitle}
      </div>
      <div className="h-72 w-full min-w-0">{children}</div>
      <div data-chart-part="x-title" className="text-center text-xs font-medium tracking-wide text-ink-soft">
        {xTitle}
      </div>
      <ul data-chart-part="legend" aria-label="Key" className="flex flex-wrap gap-x-4 gap-y-1 border-t border-ink-faint/20 pt-2 text-xs text-ink">
        {entries.map((e) => (
          <li key={e.name} className="flex items-center gap-1.5">
            <Swatch entry={e} />
            <span>{e.name}</span>
          </li>
        ))}
      </ul>
    </figure>
  );
}

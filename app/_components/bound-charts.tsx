"use client";

import { CartesianGrid, ComposedChart, Line, ReferenceLine, ResponsiveContainer, Scatter, Tooltip, XAxis, YAxis } from "recharts";
import type { BoundCharts, VendorCurvePoint } from "@/lib/explorer";
import { formatSci } from "@/lib/format";
import { ChartFrame, INK, LABEL_ROW, LineTag, Marker, type KeyEntry, type MarkerShape } from "./chart-frame";

const COLOURS = { converse: "#b42318", achievable: "#1f7a3a", normal: "#0f5e6b", capacity: "#4a5568", energy: "#8a5a00", claim: "#1c2430", run: "#6b3fa0" };

type LineLook = { colour: string; dash?: string; width?: number };
/** How each bound is drawn, in the chart and in its key alike. */
const LOOK = {
  converse: { colour: COLOURS.converse },
  achievable: { colour: COLOURS.achievable, dash: "6 3" },
  normal: { colour: COLOURS.normal, dash: "2 3", width: 1.5 },
  energy: { colour: COLOURS.energy, dash: "8 3 2 3" },
  capacity: { colour: COLOURS.capacity, width: 1.5 },
} satisfies Record<string, LineLook>;

/** A lab run on the channel chart: its channel and the upper bound of its error rate. */
export interface ChartRun {
  x: number;
  upper: number;
  label: string;
}

/** A vendor's waterfall point, judged: Eb/N0 against the error rate it states (BLER, BER or PER). */
export type { VendorCurvePoint };

// The same shapes as the verdict badges: a cross, an open diamond, a filled disc.
const VERDICT_MARK: Record<string, { shape: MarkerShape; colour: string; words: string }> = {
  impossible: { shape: "cross", colour: "#b42318", words: "beyond the limits" },
  "needs-evidence": { shape: "diamond", colour: "#8a5a00", words: "needs evidence" },
  plausible: { shape: "disc", colour: "#1f7a3a", words: "plausible" },
};
const markOf = (verdict: string) => VERDICT_MARK[verdict] ?? { shape: "ring" as const, colour: INK.text, words: verdict };

const pow10 = (v: number) => formatSci(10 ** v, 1);
const AXIS = { stroke: INK.axis, tick: { fontSize: 11, fill: INK.text }, tickLine: false };
const METRIC = { bler: "BLER", ber: "BER", per: "PER" } as const;

type Point = { x: number; y: number; title: string };
const shapeFn = (shape: MarkerShape, colour: string, size?: number) =>
  function MarkerShapeFn(props: unknown) {
    const p = props as { cx?: number; cy?: number; payload?: Point };
    return <Marker cx={p.cx} cy={p.cy} shape={shape} colour={colour} size={size} title={p.payload?.title} />;
  };

/** One bound as a line of the chart (called as a function, so the chart sees the Line itself). */
const curve = (dataKey: string, name: string, look: LineLook) => (
  <Line dataKey={dataKey} name={name} stroke={look.colour} dot={false} strokeWidth={look.width ?? 2} strokeDasharray={look.dash} isAnimationActive={false} />
);

/** Points of one kind, each drawn with the same marker. */
const points = (key: string, data: Point[], name: string, shape: MarkerShape, colour: string, size?: number) => (
  <Scatter key={key} data={data} dataKey="y" name={name} shape={shapeFn(shape, colour, size)} isAnimationActive={false} />
);

/** Least possible BLER, random-coding BLER and the normal approximation against the channel, with the claim, lab runs and a vendor's curve as points. */
export function ChannelChart({ charts, runs = [], vendorCurve = [] }: { charts: BoundCharts; runs?: ChartRun[]; vendorCurve?: VendorCurvePoint[] }) {
  const { view, result, channel } = charts;
  const soft = view.model === "biawgn";
  const logX = !soft;
  const xTitle = view.model === "bsc" ? "Raw BER p (log scale)" : view.model === "bec" ? "Erasure probability e (log scale)" : "Eb/N0 (dB)";
  const fmtX = (v: number) => (logX ? formatSci(v, 1) : `${Number(v.toFixed(1))}`);
  const xs = channel.map((p) => p.x);
  const [xMin, xMax] = [Math.min(...xs), Math.max(...xs)];
  const inRange = (v: number) => v >= xMin && v <= xMax;
  const frac = (v: number) => (logX ? Math.log(v / xMin) / Math.log(xMax / xMin) : (v - xMin) / (xMax - xMin));
  // whole decibels on the soft-decision axis (every second one on a wide range), not the span's fifths
  const step = xMax - xMin > 10 ? 2 : 1;
  const ticks = soft ? Array.from({ length: Math.floor(xMax / step) - Math.ceil(xMin / step) + 1 }, (_, i) => (Math.ceil(xMin / step) + i) * step) : undefined;
  const dB = (v: number) => (soft ? `${v.toFixed(2)} dB` : formatSci(v, 2));
  const thresholds = [
    { key: "capacity", label: soft ? "Shannon limit" : "capacity", value: result.thresholds.capacity, colour: COLOURS.capacity },
    { key: "converse", label: "converse", value: soft ? null : result.thresholds.converse, colour: COLOURS.converse },
    { key: "achievable", label: "random coding", value: soft ? null : result.thresholds.achievable, colour: COLOURS.achievable },
    { key: "sphere", label: "1959 bound", value: soft ? result.thresholds.spherePacking : null, colour: COLOURS.converse },
    { key: "energy", label: "energy limit", value: soft ? (result.energy?.converseEbn0Db ?? null) : null, colour: COLOURS.energy },
  ]
    .filter((t): t is { key: string; label: string; value: number; colour: string } => t.value != null && Number.isFinite(t.value) && inRange(t.value))
    .sort((a, b) => a.value - b.value);

  const claim: Point[] = inRange(view.x) ? [{ x: view.x, y: Math.log10(view.target), title: `claim: BLER ${formatSci(view.target)} at ${dB(view.x)}` }] : [];
  const labRuns: Point[] = runs.filter((r) => inRange(r.x) && r.upper > 0).map((r) => ({ x: r.x, y: Math.log10(r.upper), title: r.label }));
  const shown = soft ? vendorCurve.filter((p) => inRange(p.ebn0Db)) : [];
  const vendorGroups = [...new Set(shown.map((p) => p.verdict))].map((verdict) => ({
    verdict,
    mark: markOf(verdict),
    points: shown
      .filter((p) => p.verdict === verdict)
      .map((p): Point => ({
        x: p.ebn0Db,
        y: Math.log10(p.value),
        title: `vendor: ${METRIC[p.metric]} ${formatSci(p.value)} at ${p.ebn0Db} dB, ${markOf(p.verdict).words}`,
      })),
  }));

  const entries: KeyEntry[] = [
    { name: soft ? "least possible BLER (1959 sphere packing)" : "least possible BLER (converse)", ...LOOK.converse },
    soft
      ? { name: `least possible BLER for k = ${view.k} bits, any bandwidth (energy limit)`, ...LOOK.energy }
      : { name: "random-coding BLER (achievable)", ...LOOK.achievable },
    { name: "normal approximation", ...LOOK.normal },
    ...(thresholds.length > 0 ? [{ name: "thin dashed lines: where each limit allows the claimed BLER", colour: INK.axis, dash: "3 3", width: 1 }] : []),
    ...(claim.length > 0 ? [{ name: "this claim", colour: COLOURS.claim, marker: "square" as const }] : []),
    ...(labRuns.length > 0 ? [{ name: "lab runs (upper bound of each measured error rate)", colour: COLOURS.run, marker: "ring" as const }] : []),
    ...vendorGroups.map((g) => ({ name: `vendor curve: ${g.mark.words}`, colour: g.mark.colour, marker: g.mark.shape })),
  ];

  return (
    <ChartFrame label="Block error rate against the channel" xTitle={xTitle} yTitle="Block error rate (log scale)" entries={entries}>
      <ResponsiveContainer width="100%" height="100%">
        <ComposedChart data={channel} margin={{ top: 8 + thresholds.length * LABEL_ROW, right: 12, bottom: 4, left: 0 }}>
          <CartesianGrid stroke={INK.grid} />
          <XAxis
            dataKey="x"
            type="number"
            scale={logX ? "log" : "linear"}
            domain={[xMin, xMax]}
            ticks={ticks}
            tickFormatter={fmtX}
            allowDataOverflow
            {...AXIS}
          />
          <YAxis width={52} domain={[(min: number) => Math.max(Math.floor(min), -30), 0]} tickFormatter={pow10} allowDataOverflow {...AXIS} />
          <Tooltip formatter={(v) => (typeof v === "number" ? pow10(v) : String(v))} labelFormatter={(v) => fmtX(Number(v))} />
          {curve("converse", entries[0].name, LOOK.converse)}
          {soft ? curve("energy", "energy limit", LOOK.energy) : curve("achievable", "random-coding BLER", LOOK.achievable)}
          {curve("normal", "normal approximation", LOOK.normal)}
          {thresholds.map((t, i) => (
            <ReferenceLine
              key={t.key}
              x={t.value}
              stroke={t.colour}
              strokeDasharray="3 3"
              label={<LineTag row={thresholds.length - 1 - i} text={`${t.label} ${dB(t.value)}`} colour={t.colour} anchorEnd={frac(t.value) > 0.5} />}
            />
          ))}
          {labRuns.length > 0 ? points("runs", labRuns, "lab run", "ring", COLOURS.run, 4) : null}
          {vendorGroups.map((g) => points(g.verdict, g.points, `vendor: ${g.mark.words}`, g.mark.shape, g.mark.colour))}
          {claim.length > 0 ? points("claim", claim, "claim", "square", COLOURS.claim) : null}
        </ComposedChart>
      </ResponsiveContainer>
    </ChartFrame>
  );
}

/** Best rate against block length at the target, with capacity as the ceiling and the claim as a point. */
export function RateChart({ charts }: { charts: BoundCharts }) {
  const { view, rate } = charts;
  const soft = view.model === "biawgn";
  const entries: KeyEntry[] = [
    { name: "capacity", ...LOOK.capacity },
    { name: soft ? "largest rate allowed (1959 sphere packing)" : "largest rate allowed (converse)", ...LOOK.converse },
    ...(soft ? [] : [{ name: "rate guaranteed (random coding)", ...LOOK.achievable }]),
    { name: "normal approximation", ...LOOK.normal },
    { name: "this claim", colour: COLOURS.claim, marker: "square" },
  ];
  const claim: Point[] = [{ x: view.n, y: view.k / view.n, title: `claim: rate ${(view.k / view.n).toFixed(4)} at n = ${view.n.toLocaleString("en-GB")}` }];
  return (
    <ChartFrame label="Best rate against block length" xTitle="Block length n (bits, log scale)" yTitle="Rate (bits per channel use)" entries={entries}>
      <ResponsiveContainer width="100%" height="100%">
        <ComposedChart data={rate.map((r) => ({ ...r, x: r.n }))} margin={{ top: 8, right: 12, bottom: 4, left: 0 }}>
          <CartesianGrid stroke={INK.grid} />
          <XAxis dataKey="x" type="number" scale="log" domain={["dataMin", "dataMax"]} tickFormatter={(v: number) => v.toLocaleString("en-GB")} {...AXIS} />
          <YAxis width={40} domain={[0, 1]} tickFormatter={(v: number) => v.toFixed(2)} {...AXIS} />
          <Tooltip formatter={(v) => (typeof v === "number" ? v.toFixed(4) : String(v))} labelFormatter={(v) => `n = ${Number(v).toLocaleString("en-GB")}`} />
          {curve("capacity", "capacity", LOOK.capacity)}
          {curve("converseRate", entries[1].name, LOOK.converse)}
          {soft ? null : curve("achievableRate", "rate guaranteed", LOOK.achievable)}
          {curve("normalRate", "normal approximation", LOOK.normal)}
          {points("claim", claim, "claim", "square", COLOURS.claim)}
        </ComposedChart>
      </ResponsiveContainer>
    </ChartFrame>
  );
}

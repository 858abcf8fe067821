"use client";

import {
  CartesianGrid,
  Legend,
  Line,
  LineChart,
  ReferenceDot,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import type { BoundCharts } from "@/lib/explorer";
import { formatSci } from "@/lib/format";

const COLOURS = { converse: "#b42318", achievable: "#1f7a3a", normal: "#0f5e6b", capacity: "#4a5568", energy: "#8a5a00", claim: "#1c2430", run: "#6b3fa0" };

/** A lab run on the channel chart: its channel and the upper bound of its error rate. */
export interface ChartRun {
  x: number;
  upper: number;
  label: string;
}
const pow10 = (v: number) => formatSci(10 ** v, 1);

/** Least possible BLER, random-coding BLER and the normal approximation against the channel, with the claim as a point. */
export function ChannelChart({ charts, runs = [] }: { charts: BoundCharts; runs?: ChartRun[] }) {
  const { view, result, channel } = charts;
  const logX = view.model !== "biawgn";
  const xLabel = view.model === "bsc" ? "raw BER p" : view.model === "bec" ? "erasure probability e" : "Eb/N0 (dB)";
  const fmtX = (v: number) => (logX ? formatSci(v, 1) : `${v.toFixed(1)} dB`);
  const soft = view.model === "biawgn";
  // Soft decision: thresholds in Eb/N0 (the capacity one is in the claim's unit, Eb/N0 here)
  const thresholds = [
    { key: "capacity", label: "capacity", value: result.thresholds.capacity, colour: COLOURS.capacity },
    { key: "converse", label: "converse", value: result.thresholds.converse, colour: COLOURS.converse },
    { key: "achievable", label: "random coding", value: result.thresholds.achievable, colour: COLOURS.achievable },
    { key: "sphere", label: "sphere packing", value: soft ? result.thresholds.spherePacking : null, colour: COLOURS.converse },
    { key: "energy", label: `energy limit, k = ${view.k}`, value: soft ? (result.energy?.converseEbn0Db ?? null) : null, colour: COLOURS.energy },
  ].filter((t): t is { key: string; label: string; value: number; colour: string } => t.value != null && Number.isFinite(t.value));
  const xs = channel.map((p) => p.x);
  const inRange = (v: number) => v >= Math.min(...xs) && v <= Math.max(...xs);
  return (
    <figure aria-label="Block error rate against the channel" className="h-80 w-full">
      <ResponsiveContainer width="100%" height="100%">
        <LineChart data={channel} margin={{ top: 10, right: 20, bottom: 20, left: 10 }}>
          <CartesianGrid stroke="#e2e6ec" />
          <XAxis dataKey="x" type="number" scale={logX ? "log" : "linear"} domain={["dataMin", "dataMax"]} tickFormatter={fmtX} label={{ value: xLabel, position: "insideBottom", offset: -12 }} allowDataOverflow />
          <YAxis domain={[(min: number) => Math.max(Math.floor(min), -30), 0]} tickFormatter={pow10} label={{ value: "BLER", angle: -90, position: "insideLeft" }} allowDataOverflow />
          <Tooltip formatter={(v) => (typeof v === "number" ? pow10(v) : String(v))} labelFormatter={(v) => fmtX(Number(v))} />
          <Legend verticalAlign="top" />
          <Line dataKey="converse" name={soft ? "least possible BLER (1959 sphere packing)" : "least possible BLER (converse)"} stroke={COLOURS.converse} dot={false} strokeWidth={2} isAnimationActive={false} />
          {soft ? null : <Line dataKey="achievable" name="random-coding BLER (achievable)" stroke={COLOURS.achievable} dot={false} strokeWidth={2} strokeDasharray="6 3" isAnimationActive={false} />}
          <Line dataKey="normal" name="normal approximation" stroke={COLOURS.normal} dot={false} strokeWidth={1.5} strokeDasharray="2 3" isAnimationActive={false} />
          {thresholds.filter((t) => inRange(t.value)).map((t) => (
            <ReferenceLine key={t.key} x={t.value} stroke={t.colour} strokeDasharray="3 3" label={{ value: t.label, position: "top", fontSize: 11, fill: t.colour }} />
          ))}
          {runs.filter((r) => inRange(r.x) && r.upper > 0).map((r, i) => (
            <ReferenceDot key={`run-${i}`} x={r.x} y={Math.log10(r.upper)} r={4} fill="#fff" stroke={COLOURS.run} strokeWidth={2} label={{ value: r.label, position: "left", fontSize: 11, fill: COLOURS.run }} />
          ))}
          {inRange(view.x) ? <ReferenceDot x={view.x} y={Math.log10(view.target)} r={6} fill={COLOURS.claim} stroke="#fff" label={{ value: "claim", position: "right", fontSize: 12 }} /> : null}
        </LineChart>
      </ResponsiveContainer>
    </figure>
  );
}

/** Best rate against block length at the target, with capacity as the ceiling and the claim as a point. */
export function RateChart({ charts }: { charts: BoundCharts }) {
  const { view, rate } = charts;
  const soft = view.model === "biawgn";
  return (
    <figure aria-label="Best rate against block length" className="h-80 w-full">
      <ResponsiveContainer width="100%" height="100%">
        <LineChart data={rate} margin={{ top: 10, right: 20, bottom: 20, left: 10 }}>
          <CartesianGrid stroke="#e2e6ec" />
          <XAxis dataKey="n" type="number" scale="log" domain={["dataMin", "dataMax"]} tickFormatter={(v: number) => v.toLocaleString("en-GB")} label={{ value: "block length n (bits)", position: "insideBottom", offset: -12 }} />
          <YAxis domain={[0, 1]} tickFormatter={(v: number) => v.toFixed(2)} label={{ value: "rate (bits per channel use)", angle: -90, position: "insideLeft", dy: 80 }} />
          <Tooltip formatter={(v) => (typeof v === "number" ? v.toFixed(4) : String(v))} labelFormatter={(v) => `n = ${Number(v).toLocaleString("en-GB")}`} />
          <Legend verticalAlign="top" />
          <Line dataKey="capacity" name="capacity" stroke={COLOURS.capacity} dot={false} isAnimationActive={false} />
          <Line dataKey="converseRate" name={soft ? "largest rate allowed (1959 sphere packing)" : "largest rate allowed (converse)"} stroke={COLOURS.converse} dot={false} strokeWidth={2} isAnimationActive={false} />
          {soft ? null : <Line dataKey="achievableRate" name="rate guaranteed (random coding)" stroke={COLOURS.achievable} dot={false} strokeWidth={2} strokeDasharray="6 3" isAnimationActive={false} />}
          <Line dataKey="normalRate" name="normal approximation" stroke={COLOURS.normal} dot={false} strokeDasharray="2 3" isAnimationActive={false} />
          <ReferenceDot x={view.n} y={view.k / view.n} r={6} fill={COLOURS.claim} stroke="#fff" label={{ value: "claim", position: "right", fontSize: 12 }} />
        </LineChart>
      </ResponsiveContainer>
    </figure>
  );
}

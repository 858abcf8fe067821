import type { CurveMetric, SensitivityView } from "@/lib/validation/explorer";
import {
  channelAt,
  channelCurve,
  ebn0ToEsn0,
  ebn0ToSensitivityDbm,
  energyConverseEbn0Db,
  orthogonalEbn0Db,
  sensitivityToEbn0Db,
  evaluateClaim,
  rateCurve,
  type ChannelCurvePoint,
  type ClaimResult,
  type RateCurvePoint,
} from "@/lib/bounds";

import type { ChannelModel } from "@/lib/bounds/vocabulary";
export type { ChannelModel };

export interface BoundView {
  model: ChannelModel;
  /** p, e, or Eb/N0 in dB. */
  x: number;
  n: number;
  k: number;
  /** Target block error rate. */
  target: number;
  /** A vendor's waterfall to judge and overlay (BI-AWGN only): Eb/N0 against an error rate. */
  curve?: { ebn0Db: number; value: number; metric: CurveMetric }[];
}

/** One judged point of a vendor's curve, as the charts overlay it. */
export interface VendorCurvePoint {
  ebn0Db: number;
  value: number;
  metric: CurveMetric;
  verdict: string;
}

export interface BoundCharts {
  view: BoundView;
  result: ClaimResult;
  channel: ChannelCurvePoint[];
  rate: RateCurvePoint[];
  /** The view's vendor curve, each point judged at the view's n and k. */
  vendorCurve: VendorCurvePoint[];
}

/** The waterfall of the bounds, widened where needed so that the claim's own channel (and any vendor curve) is on the chart. */
function channelCurveAround(view: BoundView): ChannelCurvePoint[] {
  const base = { model: view.model, n: view.n, k: view.k, points: 48 };
  const auto = channelCurve(base);
  const lo = auto[0].x;
  const hi = auto[auto.length - 1].x;
  const wanted = [view.x, ...(view.model === "biawgn" ? (view.curve ?? []).map((p) => p.ebn0Db) : [])];
  const [wLo, wHi] = [Math.min(...wanted), Math.max(...wanted)];
  if (wLo >= lo && wHi <= hi) return auto;
  if (view.model === "biawgn") return channelCurve({ ...base, from: Math.min(lo, wLo - 0.5), to: Math.max(hi, wHi + 0.5) });
  const ceiling = view.model === "bsc" ? 0.5 : 0.999;
  return channelCurve({ ...base, from: Math.min(lo, wLo / 1.5), to: Math.min(ceiling, Math.max(hi, wHi * 1.5)) });
}

/** Everything the bound charts plot for one code and channel: the verdict, BLER against the channel, best rate against n. */
export function buildBoundCharts(view: BoundView): BoundCharts {
  const result = evaluateClaim({
    channel: channelAt(view.model, view.x),
    code: { n: view.n, k: view.k },
    target: { metric: "bler", value: view.target },
  } as Parameters<typeof evaluateClaim>[0]);
  const channel = channelCurveAround(view);
  const x = view.model === "biawgn" ? ebn0ToEsn0(view.x, view.k / view.n) : view.x;
  const rate = rateCurve({ model: view.model, x, targetBler: view.target, nMin: 16, nMax: Math.max(10_000, view.n * 4), points: 28 });
  return { view, result, channel, rate, vendorCurve: judgeCurve(view) };
}

/**
 * Each point of the view's vendor curve judged as a claim of the view's code (n, k) on the
 * BI-AWGN channel. A packet error rate is judged as a block error rate: one packet, one codeword.
 */
export function judgeCurve(view: BoundView): VendorCurvePoint[] {
  if (view.model !== "biawgn") return [];
  return (view.curve ?? []).map((p) => {
    const r = evaluateClaim({
      channel: { model: "biawgn", ebn0Db: p.ebn0Db },
      code: { n: view.n, k: view.k },
      target: { metric: p.metric === "ber" ? "ber" : "bler", value: p.value },
    } as Parameters<typeof evaluateClaim>[0]);
    return { ...p, verdict: r.verdict };
  });
}

/** The chart view of a stored verdict: its code and the channel the engine actually used (null without n and k). */
export function boundViewOfResult(result: ClaimResult): BoundView | null {
  const { n, channel, target } = result;
  // The engine gives a whole k; results stored by engines before 1.1 may carry a fractional one.
  const k = result.k == null ? null : Math.round(result.k);
  if (n == null || k == null || k < 1 || k > n || n < 2) return null;
  const x =
    channel.model === "bsc"
      ? channel.p
      : channel.model === "bec"
        ? channel.e
        : (channel.ebn0Db ?? (channel.esn0Db == null ? undefined : channel.esn0Db - 10 * Math.log10(k / n)));
  if (x == null || !Number.isFinite(x) || (x <= 0 && channel.model !== "biawgn")) return null;
  return { model: channel.model, x, n, k, target: Math.min(target.value, 0.49) };
}

export interface SensitivityResult {
  /** Eb/N0 (dB) at the level given, or the level (dBm) at the Eb/N0 given, at the noise figure. */
  ebn0Db: number;
  levelDbm: number;
  /** Least Eb/N0 to send the payload at the PER (PPV 2011 converse), and the level it needs. */
  limitEbn0Db: number | null;
  limitLevelDbm: number | null;
  /** Orthogonal signalling's Eb/N0 at the same PER (achievable), and its level. */
  achievableEbn0Db: number | null;
  achievableLevelDbm: number | null;
}

/** The sensitivity calculator: input level to Eb/N0 and back, with the energy limits for a payload. */
export function sensitivityResult(v: SensitivityView): SensitivityResult {
  const ebn0Db = v.level !== undefined ? sensitivityToEbn0Db(v.level, v.rb, v.nf) : (v.ebn0 ?? 0);
  const toLevel = (e: number | null) => (e === null ? null : ebn0ToSensitivityDbm(e, v.rb, v.nf));
  const lnPer = Math.log(v.per);
  const limitEbn0Db = energyConverseEbn0Db(v.payload, lnPer);
  const achievableEbn0Db = orthogonalEbn0Db(v.payload, lnPer);
  return {
    ebn0Db,
    levelDbm: toLevel(ebn0Db) as number,
    limitEbn0Db,
    limitLevelDbm: toLevel(limitEbn0Db),
    achievableEbn0Db,
    achievableLevelDbm: toLevel(achievableEbn0Db),
  };
}

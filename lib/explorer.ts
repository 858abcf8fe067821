import type { SensitivityView } from "@/lib/validation/explorer";
import {
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

export type ChannelModel = "bsc" | "bec" | "biawgn";

export interface BoundView {
  model: ChannelModel;
  /** p, e, or Eb/N0 in dB. */
  x: number;
  n: number;
  k: number;
  /** Target block error rate. */
  target: number;
}

export interface BoundCharts {
  view: BoundView;
  result: ClaimResult;
  channel: ChannelCurvePoint[];
  rate: RateCurvePoint[];
}

const channelOf = (model: ChannelModel, x: number) =>
  model === "bsc" ? { model, p: x } : model === "bec" ? { model, e: x } : { model, ebn0Db: x };

/** The waterfall of the bounds, widened where needed so that the claim's own channel is on the chart. */
function channelCurveAround(view: BoundView): ChannelCurvePoint[] {
  const base = { model: view.model, n: view.n, k: view.k, points: 48 };
  const auto = channelCurve(base);
  const lo = auto[0].x;
  const hi = auto[auto.length - 1].x;
  if (view.x >= lo && view.x <= hi) return auto;
  if (view.model === "biawgn") return channelCurve({ ...base, from: Math.min(lo, view.x - 0.5), to: Math.max(hi, view.x + 0.5) });
  const ceiling = view.model === "bsc" ? 0.5 : 0.999;
  return channelCurve({ ...base, from: Math.min(lo, view.x / 1.5), to: Math.min(ceiling, Math.max(hi, view.x * 1.5)) });
}

/** Everything the bound charts plot for one code and channel: the verdict, BLER against the channel, best rate against n. */
export function buildBoundCharts(view: BoundView): BoundCharts {
  const result = evaluateClaim({
    channel: channelOf(view.model, view.x),
    code: { n: view.n, k: view.k },
    target: { metric: "bler", value: view.target },
  } as Parameters<typeof evaluateClaim>[0]);
  const channel = channelCurveAround(view);
  const x = view.model === "biawgn" ? ebn0ToEsn0(view.x, view.k / view.n) : view.x;
  const rate = rateCurve({ model: view.model, x, targetBler: view.target, nMin: 16, nMax: Math.max(10_000, view.n * 4), points: 28 });
  return { view, result, channel, rate };
}

/** The chart view of a stored verdict: its code and the channel the engine actually used (null without n and k). */
export function boundViewOfResult(result: ClaimResult): BoundView | null {
  const { n, channel, target } = result;
  // The engine gives a whole k; results stored by engines before 1.1 may carry a fractional one.
  const k = result.k == null ? null : Math.round(result.k);
  if (n == null || k == null || k < 1 || k > n || n < 2) return null;
  const x =
    channel.model === "bsc" ? channel.p
    : channel.model === "bec" ? channel.e
    : channel.ebn0Db ?? (channel.esn0Db == null ? undefined : channel.esn0Db - 10 * Math.log10(k / n));
  if (x == null || !Number.isFinite(x) || x <= 0 && channel.model !== "biawgn") return null;
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

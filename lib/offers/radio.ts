// Sensitivity claims and waterfall curves on operating points stated in dBm: the engine input of
// each, the limit and margin read from the engine's result, and the worst point. Pure, no I/O.
import Papa from "papaparse";
import type { ClaimInput, ClaimResult } from "@/lib/bounds";
import { THERMAL_DBM_PER_HZ } from "@/lib/bounds/thermal";
import { parseDecimal } from "@/lib/numbers";

import type { Verdict as VerdictName } from "@/lib/bounds/vocabulary";
export type { VerdictName };
export type CurveUnit = "ebn0Db" | "dBm";
export type CurveMetric = "bler" | "ber" | "per";
export const CURVE_UNITS: readonly CurveUnit[] = ["ebn0Db", "dBm"];
export const CURVE_METRICS: readonly CurveMetric[] = ["bler", "ber", "per"];
export const MAX_CURVE_POINTS = 40;

/** The buyer's point in sensitivity terms (db/schema/tenders.ts SensitivityPoint, with the level in dBm). */
export interface SensitivityTerms {
  requiredDbm: number;
  bitRate: number;
  payloadBits: number;
  targetPer: number;
  /** The tender's assumed receiver noise figure (dB), for plausibility where the vendor states none. */
  assumedNoiseFigureDb: number;
}

/** One point of a vendor's waterfall: Eb/N0 (dB) or input level (dBm) against BLER, BER or PER. */
export interface CurvePoint {
  x: number;
  unit: CurveUnit;
  metric: CurveMetric;
  value: number;
}

/** What a vendor states at a sensitivity point: the level, the code's n and k and modulation if known, and optionally a curve. */
export interface SensitivityStatement {
  dbm: number;
  noiseFigureDb?: number | null;
  modulation?: "bpsk" | "qpsk" | null;
  n?: number | null;
  k?: number | null;
  curve?: CurvePoint[] | null;
}

/** Implied Eb/N0, the limit it is judged against, and the margin between them (dB; negative = beyond the limit). */
export interface PointJudgement {
  verdict: VerdictName;
  impliedEbn0Db: number | null;
  limitEbn0Db: number | null;
  marginDb: number | null;
}

export interface JudgedCurvePoint extends CurvePoint, PointJudgement {
  result: ClaimResult | Record<string, unknown>;
}

/** Stored with a claim on a sensitivity point (claims.radio). */
export interface RadioClaim extends SensitivityTerms {
  sensitivityDbm: number;
  noiseFigureDb: number | null;
  modulation: "bpsk" | "qpsk" | null;
  n: number | null;
  k: number | null;
  line: PointJudgement;
  curve: JudgedCurvePoint[];
  /** The worst of the line and the curve: "line" or the index of the curve point. */
  worst: PointJudgement & { at: "line" | number };
}

const given = (v: number | null | undefined): v is number => v !== null && v !== undefined;

/** Eb/N0 (dB) = S - 10 log10(k_B T0 / 1 mW) - 10 log10(Rb) - NF (BOUNDS.md section 9; the engine's own constant). */
export function impliedEbn0Db(dbm: number, bitRate: number, noiseFigureDb: number): number {
  return dbm - THERMAL_DBM_PER_HZ - 10 * Math.log10(bitRate) - noiseFigureDb;
}

/** The code the engine gets: n, k and modulation when the vendor gave both n and k, else the payload alone (energy checks). */
function radioCode(terms: SensitivityTerms, s: SensitivityStatement): ClaimInput["code"] {
  if (given(s.n) && given(s.k)) return { n: s.n, k: s.k, ...(s.modulation ? { modulation: s.modulation } : {}) };
  return { k: terms.payloadBits };
}

function radioChannel(terms: SensitivityTerms, s: SensitivityStatement, dbm: number): ClaimInput["channel"] {
  return {
    model: "biawgn",
    sensitivityDbm: dbm,
    bitRate: terms.bitRate,
    ...(given(s.noiseFigureDb) ? { noiseFigureDb: s.noiseFigureDb } : {}),
    assumedNoiseFigureDb: terms.assumedNoiseFigureDb,
  };
}

/** The sensitivity line: "PER `per` at `dbm` dBm" for the point's bit rate and payload. */
export function sensitivityClaimInput(terms: SensitivityTerms, s: SensitivityStatement, per: number): ClaimInput {
  return { channel: radioChannel(terms, s, s.dbm), code: radioCode(terms, s), target: { metric: "bler", value: per } };
}

/** One curve point: PER is the packet's BLER; an Eb/N0 point carries no noise figure. */
export function curvePointInput(terms: SensitivityTerms, s: SensitivityStatement, p: CurvePoint): ClaimInput {
  const channel: ClaimInput["channel"] = p.unit === "dBm" ? radioChannel(terms, s, p.x) : { model: "biawgn", ebn0Db: p.x };
  return { channel, code: radioCode(terms, s), target: { metric: p.metric === "ber" ? "ber" : "bler", value: p.value } };
}

/**
 * The limit an implied Eb/N0 is judged against: the highest lower bound the engine reports in Eb/N0
 * dB (energy converse at k, the 1959 sphere-packing threshold, and, for an Eb/N0 claim with a
 * block length, the finite-length converse and capacity thresholds). Null when none applies.
 */
export function limitEbn0Db(result: Pick<ClaimResult, "energy" | "thresholds">): number | null {
  const { thresholds: t } = result;
  const inDb = t.unit === "ebn0Db";
  const candidates = [result.energy?.converseEbn0Db, t.spherePacking, inDb ? t.converse : null, inDb ? t.capacity : null];
  const finite = candidates.filter((x): x is number => typeof x === "number" && Number.isFinite(x));
  return finite.length ? Math.max(...finite) : null;
}

/** Verdict, implied Eb/N0, limit and margin of one engine result (an unfinished one has no numbers). */
export function judgement(result: ClaimResult | { verdict: VerdictName }): PointJudgement {
  if (!("thresholds" in result)) return { verdict: result.verdict, impliedEbn0Db: null, limitEbn0Db: null, marginDb: null };
  const implied = result.implied?.ebn0Db ?? result.channel.ebn0Db ?? null;
  const limit = limitEbn0Db(result);
  return { verdict: result.verdict, impliedEbn0Db: implied, limitEbn0Db: limit, marginDb: implied !== null && limit !== null ? implied - limit : null };
}

const RANK: Record<VerdictName, number> = { impossible: 0, "needs-evidence": 1, plausible: 2 };

/** The worst point: the worst verdict first, then the smallest margin (a missing margin counts last). */
export function worstPoint(line: PointJudgement, curve: readonly PointJudgement[]): PointJudgement & { at: "line" | number } {
  let worst: PointJudgement & { at: "line" | number } = { ...line, at: "line" };
  curve.forEach((p, i) => {
    const byVerdict = RANK[p.verdict] - RANK[worst.verdict];
    const byMargin = (p.marginDb ?? Infinity) - (worst.marginDb ?? Infinity);
    if (byVerdict < 0 || (byVerdict === 0 && byMargin < 0)) worst = { ...p, at: i };
  });
  return worst;
}

/** The stored record of a sensitivity claim, from the engine's results for the line and each curve point. */
export function radioClaim(
  terms: SensitivityTerms,
  s: SensitivityStatement,
  lineResult: ClaimResult | { verdict: VerdictName },
  curveResults: readonly (ClaimResult | { verdict: VerdictName })[],
): RadioClaim {
  const line = judgement(lineResult as ClaimResult);
  const curve = (s.curve ?? []).map((p, i) => ({
    ...p,
    ...judgement(curveResults[i] as ClaimResult),
    result: curveResults[i] as unknown as JudgedCurvePoint["result"],
  }));
  return {
    ...terms,
    sensitivityDbm: s.dbm,
    noiseFigureDb: s.noiseFigureDb ?? null,
    modulation: s.modulation ?? null,
    n: s.n ?? null,
    k: s.k ?? null,
    line,
    curve,
    worst: worstPoint(line, curve),
  };
}

/** A sensitivity claim meets the buyer's point when its level is at or below the required one at a PER no worse than the target. */
export function meetsSensitivity(radio: Pick<RadioClaim, "sensitivityDbm" | "requiredDbm" | "targetPer">, per: number): { meets: boolean; note: string } {
  if (per > radio.targetPer) return { meets: false, note: `Stated at PER ${per}, worse than the required ${radio.targetPer}.` };
  if (radio.sensitivityDbm > radio.requiredDbm)
    return { meets: false, note: `Sensitivity ${radio.sensitivityDbm} dBm is above the required ${radio.requiredDbm} dBm.` };
  return { meets: true, note: "" };
}

/** "-1.23 dB", with the sign always shown; "n/a" without a margin. */
export function formatMarginDb(margin: number | null): string {
  if (margin === null || !Number.isFinite(margin)) return "n/a";
  return `${margin >= 0 ? "+" : "−"}${Math.abs(margin).toFixed(2)} dB`;
}

export const formatDb = (x: number | null, unit = "dB") => (x === null || !Number.isFinite(x) ? "n/a" : `${x.toFixed(2)} ${unit}`);

export const CURVE_UNIT_WORDS: Record<CurveUnit, string> = { ebn0Db: "Eb/N0 (dB)", dBm: "input level (dBm)" };
export const CURVE_METRIC_WORDS: Record<CurveMetric, string> = { bler: "BLER", ber: "BER", per: "PER" };

/** Where a worst point sits, in words: "the sensitivity line" or "curve point 3 (-120 dBm, PER 1e-3)". */
export function worstPlace(radio: Pick<RadioClaim, "worst" | "curve">): string {
  if (radio.worst.at === "line") return "the sensitivity line";
  const p = radio.curve[radio.worst.at];
  return `curve point ${radio.worst.at + 1} (${p.x} ${p.unit === "dBm" ? "dBm" : "dB Eb/N0"}, ${CURVE_METRIC_WORDS[p.metric]} ${p.value})`;
}

// ---------- Curve CSV ----------

/** The columns of a curve file: level (dBm) or ebn0_db, and one of per, bler, ber. */
export const CURVE_CSV_HELP = "Columns: one of level_dbm or ebn0_db, and one of per, bler or ber; one row per point, e.g. level_dbm,per / -121,1e-2.";

export interface CurveCsvReport {
  points: CurvePoint[];
  errors: string[];
}

const X_COLUMNS: Record<string, CurveUnit> = { level_dbm: "dBm", dbm: "dBm", ebn0_db: "ebn0Db", ebn0: "ebn0Db" };
const Y_COLUMNS: Record<string, CurveMetric> = { per: "per", bler: "bler", ber: "ber" };

/** Reads a waterfall curve from CSV text (papaparse), row by row, naming each bad row and why. */
export function parseCurveCsv(text: string): CurveCsvReport {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ""), {
    header: true,
    skipEmptyLines: "greedy",
    transformHeader: (h) =>
      h
        .trim()
        .toLowerCase()
        .replace(/[\s/-]+/g, "_"),
  });
  const fields = parsed.meta.fields ?? [];
  const xCol = fields.find((f) => f in X_COLUMNS);
  const yCol = fields.find((f) => f in Y_COLUMNS);
  const errors: string[] = [];
  if (!xCol || !yCol) return { points: [], errors: [`The header must name the x and y columns. ${CURVE_CSV_HELP}`] };
  if (parsed.data.length > MAX_CURVE_POINTS) errors.push(`At most ${MAX_CURVE_POINTS} points; the file has ${parsed.data.length}.`);
  const points: CurvePoint[] = [];
  parsed.data.slice(0, MAX_CURVE_POINTS).forEach((row, i) => {
    const line = i + 2;
    const x = parseDecimal(String(row[xCol] ?? ""));
    const value = parseDecimal(String(row[yCol] ?? ""));
    const why: string[] = [];
    if (x === null || !Number.isFinite(x)) why.push(`${xCol} is not a number`);
    if (value === null || !(value > 0 && value < 1)) why.push(`${yCol} must be a probability strictly between 0 and 1`);
    if (why.length) errors.push(`Line ${line}: ${why.join("; ")}.`);
    else points.push({ x: x!, unit: X_COLUMNS[xCol], metric: Y_COLUMNS[yCol], value: value! });
  });
  return { points, errors };
}

/** "Sensitivity -133 dBm at PER 1.0e-2, NF 4 dB, BPSK, (320, 160)": the line as the vendor stated it. */
export function describeSensitivity(
  radio: Pick<RadioClaim, "sensitivityDbm" | "noiseFigureDb" | "modulation" | "n" | "k">,
  per: number,
  sci: (x: number) => string,
): string {
  const parts = [`Sensitivity ${radio.sensitivityDbm} dBm at PER ${sci(per)}`];
  parts.push(radio.noiseFigureDb !== null ? `NF ${radio.noiseFigureDb} dB` : "no NF stated");
  if (radio.modulation) parts.push(radio.modulation.toUpperCase());
  if (radio.n !== null && radio.k !== null) parts.push(`(${radio.n}, ${radio.k})`);
  return parts.join(", ");
}

/** The worst point in one line: "Worst: curve point 1 (…): implied Eb/N0 -2.82 dB, limit -1.01 dB, margin −1.81 dB". */
export function describeWorst(radio: Pick<RadioClaim, "worst" | "curve">): string {
  const w = radio.worst;
  return `Worst: ${worstPlace(radio)}: implied Eb/N0 ${formatDb(w.impliedEbn0Db)}, limit ${formatDb(w.limitEbn0Db)}, margin ${formatMarginDb(w.marginDb)}`;
}

/** What scoring reads from a sensitivity claim: the worst margin (dB) and whether the line meets the buyer's level and PER. */
export function sensitivityScoring(radio: RadioClaim, per: number): { marginDb: number | null; meets: boolean; note: string; place: string } {
  const { meets, note } = meetsSensitivity(radio, per);
  return { marginDb: radio.worst.marginDb, meets, note, place: worstPlace(radio) };
}

/**
 * The curve in the shape the bound charts overlay (`vendorCurve`): each point at the Eb/N0 it
 * amounts to (a dBm point at the vendor's noise figure or 0 dB), with its verdict. Points the
 * engine did not finish have no Eb/N0 and are left out.
 */
export function vendorCurvePoints(radio: Pick<RadioClaim, "curve">): { ebn0Db: number; value: number; metric: CurveMetric; verdict: VerdictName }[] {
  return radio.curve
    .filter((p): p is JudgedCurvePoint & { impliedEbn0Db: number } => p.impliedEbn0Db !== null)
    .map((p) => ({ ebn0Db: p.impliedEbn0Db, value: p.value, metric: p.metric, verdict: p.verdict }));
}

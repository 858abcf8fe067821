import Papa from "papaparse";
import { assessRun, unitForMetric, type EvidenceUnit } from "./evidence";
import { parseCount, parseDecimal } from "@/lib/numbers";
import type { EvidenceResult } from "@/lib/bounds";
import type { ClaimMetric } from "@/db/schema/offers";
import type { ChannelModel } from "@/db/schema/tenders";

/** The columns a lab file may carry; claim_id, or vendor with point, names the claim (else the claim imported on). */
export const CSV_COLUMNS = ["claim_id", "vendor", "point", "channel", "unit", "trials", "errors", "confidence", "note"] as const;
export const MAX_CSV_ROWS = 5000;

export interface CsvClaim {
  id: string;
  vendorName: string;
  pointLabel: string;
  pointIndex: number;
  metric: ClaimMetric;
  value: number;
  ncgOutputBer: number | null;
  channelValue: number;
  channelModel: ChannelModel;
}

export interface ValidRow {
  line: number;
  claimId: string;
  channelValue: number;
  unit: EvidenceUnit;
  trials: number;
  errors: number;
  confidence: number;
  note: string;
  result: EvidenceResult;
  /** The run's channel against the claim's, and what it counts for. */
  finding: string;
}

export interface RejectedRow {
  line: number;
  raw: Record<string, string>;
  reasons: string[];
}

export interface CsvReport {
  valid: ValidRow[];
  rejected: RejectedRow[];
  /** Problems with the file as a whole (no header, unknown columns, too many rows). */
  fileErrors: string[];
}

const norm = (s: string) => s.trim().toLowerCase();

/** Reads the file's rows with their header names normalised; blank lines are skipped. */
export function parseEvidenceCsv(text: string): { rows: Record<string, string>[]; fields: string[]; errors: string[] } {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ""), {
    header: true,
    skipEmptyLines: "greedy",
    transformHeader: (h) => norm(h).replace(/[\s-]+/g, "_"),
  });
  const errors = parsed.errors
    .filter((e) => e.code !== "UndetectableDelimiter")
    .map((e) => (e.row === undefined ? e.message : `Line ${e.row + 2}: ${e.message}`));
  return { rows: parsed.data, fields: parsed.meta.fields ?? [], errors };
}

const count = (raw: string | undefined) => (raw === undefined ? null : parseCount(raw));
const decimal = (raw: string | undefined) => (raw === undefined ? null : parseDecimal(raw));

function findClaim(raw: Record<string, string>, claims: readonly CsvClaim[], fallbackId: string | null): CsvClaim | string {
  const id = raw.claim_id?.trim();
  if (id) return claims.find((c) => c.id === id) ?? `No claim ${id} in this tender that you may record on.`;
  const vendor = raw.vendor?.trim();
  const point = raw.point?.trim();
  if (vendor || point) {
    if (!vendor || !point) return "Give both vendor and point, or a claim_id.";
    const match = claims.filter((c) => norm(c.vendorName) === norm(vendor) && (norm(c.pointLabel) === norm(point) || String(c.pointIndex + 1) === point));
    if (match.length === 1) return match[0];
    return match.length === 0 ? `No claim of ${vendor} at point "${point}".` : `Several claims of ${vendor} match "${point}".`;
  }
  return claims.find((c) => c.id === fallbackId) ?? "Name the claim: a claim_id, or vendor and point.";
}

/** Checks every row; valid rows carry their Clopper-Pearson assessment, rejected rows every reason. */
export function validateEvidenceRows(text: string, claims: readonly CsvClaim[], fallbackClaimId: string | null): CsvReport {
  const { rows, fields, errors } = parseEvidenceCsv(text);
  const fileErrors = [...errors];
  const unknown = fields.filter((f) => f && !(CSV_COLUMNS as readonly string[]).includes(f));
  if (unknown.length > 0) fileErrors.push(`Unknown columns: ${unknown.join(", ")}. Expected: ${CSV_COLUMNS.join(", ")}.`);
  for (const needed of ["unit", "trials", "errors"]) {
    if (!fields.includes(needed)) fileErrors.push(`The header has no "${needed}" column.`);
  }
  if (rows.length === 0) fileErrors.push("The file has no data rows.");
  if (rows.length > MAX_CSV_ROWS) fileErrors.push(`At most ${MAX_CSV_ROWS} rows per file; this one has ${rows.length}.`);
  if (fileErrors.length > 0) return { valid: [], rejected: [], fileErrors };

  const valid: ValidRow[] = [];
  const rejected: RejectedRow[] = [];
  rows.forEach((raw, index) => {
    const line = index + 2; // the header is line 1
    const reasons: string[] = [];
    const claim = findClaim(raw, claims, fallbackClaimId);
    if (typeof claim === "string") reasons.push(claim);
    const unit = norm(raw.unit ?? "");
    if (unit !== "bits" && unit !== "frames") reasons.push(`Unit must be "bits" or "frames", not "${raw.unit ?? ""}".`);
    const trials = count(raw.trials);
    const errorsCounted = count(raw.errors);
    if (trials === null || Number.isNaN(trials)) reasons.push("Trials must be a number.");
    if (errorsCounted === null || Number.isNaN(errorsCounted)) reasons.push("Errors must be a number.");
    const confidence = decimal(raw.confidence) ?? 0.95;
    const channelRaw = decimal(raw.channel);
    if (Number.isNaN(channelRaw)) reasons.push("Channel must be a number (p, e, or Eb/N0 in dB).");
    if (Number.isNaN(confidence)) reasons.push("Confidence must be 0.9, 0.95 or 0.99.");
    if (reasons.length === 0 && typeof claim !== "string") {
      const run = { channelValue: channelRaw ?? claim.channelValue, unit: unit as EvidenceUnit, trials: trials!, errors: errorsCounted!, confidence };
      const assessed = assessRun(claim, run);
      if (!assessed.ok) reasons.push(assessed.message);
      else {
        valid.push({ line, claimId: claim.id, note: (raw.note ?? "").trim().slice(0, 500), ...run, result: assessed.result, finding: assessed.finding });
        return;
      }
    }
    rejected.push({ line, raw, reasons });
  });
  return { valid, rejected, fileErrors };
}

/** A file to start from: the header and one row for this claim at its own channel, to be filled with the lab's counts. */
export function evidenceCsvTemplate(claim: Pick<CsvClaim, "id" | "metric" | "channelValue">): string {
  return `${CSV_COLUMNS.join(",")}\n${claim.id},,,${claim.channelValue},${unitForMetric(claim.metric)},1000000,0,0.95,replace with the lab's counts\n`;
}

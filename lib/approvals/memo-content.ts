// Words the award memo prints, from plain facts; the PDF renderer only lays them out.
import { formatInTimeZone } from "date-fns-tz";
import { CHANNEL_LABELS, formatCondition, formatMoney, formatPoint, formatSci } from "@/lib/format";
import type { MemoDocument } from "@/lib/pdf/memo";
import { headLine, type Head } from "@/lib/ledger/head";
import type { ChannelModel, OperatingPoint } from "@/db/schema/tenders";
import type { MarkKind } from "@/db/schema/evaluation";
import type { ClaimMetric, Verdict } from "@/db/schema/offers";
import { EVIDENCE_LABELS, MARK_LABELS } from "@/lib/review/labels";
import { acceptedAgainstImpossible } from "@/lib/review/marks";
import { SAFETY_CAUTION, SENSITIVITY_CAUTION } from "@/lib/cautions";
import { CURVE_METRIC_WORDS, describeSensitivity, formatDb, formatMarginDb, worstPlace, type RadioClaim } from "@/lib/offers/radio";
import type { EvidenceStatus } from "@/db/schema/evaluation";
import { deviationWords } from "./award-value";
import { formatScore, standingsOf } from "./score-sheet";

export interface MemoFacts {
  identifier: string;
  draft: boolean;
  issuedAt: Date;
  zone: string;
  buyerOrganisation: string;
  tender: {
    reference: string;
    title: string;
    description: string;
    channelModel: ChannelModel;
    operatingPoints: OperatingPoint[];
    targetMetric: "bler" | "ber";
    targetValue: number;
    maxFrameBits: number | null;
    quantity: number;
    currency: string;
  };
  offers: {
    vendorName: string;
    moduleName: string;
    partNumber: string;
    codeFamily: string;
    decision: "hard" | "soft";
    n: number | null;
    k: number | null;
    rate: number | null;
    claims: {
      pointLabel: string;
      channelValue: number;
      metric: ClaimMetric;
      value: number;
      ncgOutputBer: number | null;
      verdict: Verdict;
      /** A sensitivity claim with its curve, each point judged (null or absent otherwise). */
      radio?: RadioClaim | null;
      mark: MarkKind | null;
      markComment: string;
      /** Lab runs, each with what it counts for against the claim. */
      runs: { channelValue: number; unit: "bits" | "frames"; trials: number; errors: number; confidence: number; upper: number; status: EvidenceStatus }[];
    }[];
  }[];
  safetyRelevant: boolean;
  technical: {
    signatures: { name: string; signedAt: Date; statement: string }[];
    declarations: { name: string; createdAt: Date; statement: string; conflicts: number }[];
  };
  scoreSheet: unknown;
  recommendation: {
    vendorName: string;
    moduleName: string;
    value: number;
    /** The offer's price at the quantity; null on recommendations older than it. */
    computedValue: number | null;
    valueReason: string | null;
    quantityReason: string | null;
    currency: string;
    quantity: number;
    justification: string;
    preparedBy: string;
    preparedAt: Date;
  };
  approvals: { name: string; decidedAt: Date; comment: string }[];
  approvalsNeeded: number;
  cautions: string;
  /** The ledger head an issued memo was issued at (null: the ledger was empty); a preview has none. */
  ledgerHead?: Head | null;
}

export function claimWords(c: Pick<MemoFacts["offers"][number]["claims"][number], "metric" | "value" | "ncgOutputBer">): string {
  if (c.metric === "ncg") return `Net coding gain ${c.value} dB at BER ${c.ncgOutputBer === null ? "?" : formatSci(c.ncgOutputBer)}`;
  return `${c.metric.toUpperCase()} ${formatSci(c.value)}`;
}

export function codeWords(o: Pick<MemoFacts["offers"][number], "codeFamily" | "decision" | "n" | "k" | "rate" | "partNumber">): string {
  const size = o.n !== null && o.k !== null ? ` (n = ${o.n} bits, k = ${o.k} bits)` : "";
  const rate = o.rate !== null ? `, code rate ${o.rate.toFixed(3)}` : o.n && o.k ? `, code rate ${(o.k / o.n).toFixed(3)}` : "";
  return `Part ${o.partNumber}; ${o.codeFamily}${size}${rate}, ${o.decision} decision`;
}

/**
 * A sensitivity claim's numbers for the memo: the line (implied Eb/N0, limit, margin), each curve
 * point's margin, and the worst point that sets the verdict.
 */
export function sensitivityWords(radio: RadioClaim, per: number): string {
  const j = (x: { impliedEbn0Db: number | null; limitEbn0Db: number | null; marginDb: number | null }) =>
    `implied Eb/N0 ${formatDb(x.impliedEbn0Db)}, limit ${formatDb(x.limitEbn0Db)}, margin ${formatMarginDb(x.marginDb)}`;
  const line = `${describeSensitivity(radio, per, formatSci)}: ${j(radio.line)}.`;
  const curve = radio.curve.length
    ? ` Curve of ${radio.curve.length} points: ${radio.curve.map((p, i) => `${i + 1}) ${p.x} ${p.unit === "dBm" ? "dBm" : "dB"}, ${CURVE_METRIC_WORDS[p.metric]} ${formatSci(p.value)}: margin ${formatMarginDb(p.marginDb)}`).join("; ")}.`
    : "";
  return `${line}${curve} Worst: ${worstPlace(radio)}, margin ${formatMarginDb(radio.worst.marginDb)}.`;
}

/** The review column: the mark, and an acceptance against the engine's impossible verdict flagged with its justification. */
export function reviewWords(c: Pick<MemoFacts["offers"][number]["claims"][number], "verdict" | "mark" | "markComment">): string {
  if (!c.mark) return "Not marked";
  if (acceptedAgainstImpossible(c)) return `FLAG: accepted although the engine found it impossible. Justification: ${c.markComment}`;
  return MARK_LABELS[c.mark];
}

/** The lab evidence behind a verdict, one phrase per run. */
export function evidenceWords(model: ChannelModel, runs: MemoFacts["offers"][number]["claims"][number]["runs"]): string {
  if (runs.length === 0) return "No lab run.";
  return runs
    .map(
      (r) =>
        `${EVIDENCE_LABELS[r.status]}: ${r.errors.toLocaleString("en-GB")} errors in ${r.trials.toLocaleString("en-GB")} ${r.unit} at ${formatCondition(model, r.channelValue)} (upper bound ${formatSci(r.upper)} at ${Math.round(r.confidence * 100)} %)`,
    )
    .join("; ");
}

export const when = (date: Date, zone: string) => `${formatInTimeZone(date, zone, "d MMM yyyy, HH:mm")} ${zone}`;

export function memoDocument(f: MemoFacts): MemoDocument {
  const t = f.tender;
  const money = (v: number) => formatMoney(v, f.recommendation.currency);
  const standings = standingsOf(f.scoreSheet);
  return {
    identifier: f.identifier,
    draft: f.draft,
    issuedAt: f.issuedAt,
    issuedAtText: when(f.issuedAt, f.zone),
    ledgerLine: f.ledgerHead === undefined ? null : headLine(f.ledgerHead),
    tender: {
      reference: t.reference,
      title: t.title,
      buyerOrganisation: f.buyerOrganisation,
      description: t.description,
      facts: [
        { label: "Channel", value: CHANNEL_LABELS[t.channelModel].name },
        { label: "Residual error required", value: `${t.targetMetric.toUpperCase()} at most ${formatSci(t.targetValue)}` },
        { label: "Longest frame", value: t.maxFrameBits ? `${t.maxFrameBits.toLocaleString("en-GB")} bits` : "no limit" },
        { label: "Quantity", value: `${t.quantity.toLocaleString("en-GB")} units, prices in ${t.currency}` },
      ],
      operatingPoints: t.operatingPoints.map((p) => `${p.label}: ${formatPoint(t.channelModel, p)}`),
    },
    offers: f.offers.map((o) => ({
      vendorName: o.vendorName,
      module: o.moduleName,
      code: codeWords(o),
      claims: o.claims.map((c) => ({
        point: `${c.pointLabel} (${formatCondition(t.channelModel, c.channelValue)})`,
        claim: c.radio ? `Sensitivity ${c.radio.sensitivityDbm} dBm at PER ${formatSci(c.value)}` : claimWords(c),
        verdict: c.verdict,
        sensitivity: c.radio ? sensitivityWords(c.radio, c.value) : null,
        review: reviewWords(c),
        evidence: evidenceWords(t.channelModel, c.runs),
      })),
    })),
    scores: standings.map((s) => ({
      rank: s.rank === null ? "–" : String(s.rank),
      vendorName: s.vendorName,
      total: formatScore(s.total),
      note: s.flags.join("; "),
    })),
    recommendation: {
      vendorName: f.recommendation.vendorName,
      module: f.recommendation.moduleName,
      value: money(f.recommendation.value),
      quantity: `${f.recommendation.quantity.toLocaleString("en-GB")} units`,
      deviations: deviationWords({ ...f.recommendation, tenderQuantity: t.quantity }),
      justification: f.recommendation.justification,
      prepared: `Prepared by ${f.recommendation.preparedBy}, ${when(f.recommendation.preparedAt, f.zone)}`,
    },
    approvals: f.approvals.map((a) => ({ name: a.name, at: when(a.decidedAt, f.zone), comment: a.comment })),
    approvalsNeeded: f.approvalsNeeded,
    technical: {
      signatures: f.technical.signatures.map((x) => ({ name: x.name, at: when(x.signedAt, f.zone), statement: x.statement })),
      declarations: f.technical.declarations.map((d) => ({
        name: d.name,
        at: when(d.createdAt, f.zone),
        statement: d.statement,
        conflicts:
          d.conflicts === 0 ? "no conflict" : `a conflict with ${d.conflicts} vendor${d.conflicts === 1 ? "" : "s"}, whose offers were hidden from them`,
      })),
    },
    cautions: [f.safetyRelevant ? SAFETY_CAUTION : null, f.cautions, f.tender.operatingPoints.some((p) => p.sensitivity) ? SENSITIVITY_CAUTION : null]
      .filter(Boolean)
      .join(" "),
  };
}

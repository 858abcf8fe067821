// Words the award memo prints, from plain facts; the PDF renderer only lays them out.
import { formatInTimeZone } from "date-fns-tz";
import { CHANNEL_LABELS, formatCondition, formatMoney, formatSci } from "@/lib/format";
import type { MemoDocument } from "@/lib/pdf/memo";
import { headLine, type Head } from "@/lib/ledger/head";
import type { ChannelModel, OperatingPoint } from "@/db/schema/tenders";
import type { MarkKind } from "@/db/schema/evaluation";
import type { ClaimMetric, Verdict } from "@/db/schema/offers";
import { MARK_LABELS } from "@/lib/review/labels";
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
    claims: { pointLabel: string; channelValue: number; metric: ClaimMetric; value: number; ncgOutputBer: number | null; verdict: Verdict; mark: MarkKind | null }[];
  }[];
  scoreSheet: unknown;
  recommendation: { vendorName: string; moduleName: string; value: number; currency: string; quantity: number; justification: string; preparedBy: string; preparedAt: Date };
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
      operatingPoints: t.operatingPoints.map((p) => `${p.label}: ${formatCondition(t.channelModel, p.value)}`),
    },
    offers: f.offers.map((o) => ({
      vendorName: o.vendorName,
      module: o.moduleName,
      code: codeWords(o),
      claims: o.claims.map((c) => ({
        point: `${c.pointLabel} (${formatCondition(t.channelModel, c.channelValue)})`,
        claim: claimWords(c),
        verdict: c.verdict,
        review: c.mark ? MARK_LABELS[c.mark] : "Not marked",
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
      justification: f.recommendation.justification,
      prepared: `Prepared by ${f.recommendation.preparedBy}, ${when(f.recommendation.preparedAt, f.zone)}`,
    },
    approvals: f.approvals.map((a) => ({ name: a.name, at: when(a.decidedAt, f.zone), comment: a.comment })),
    approvalsNeeded: f.approvalsNeeded,
    cautions: f.cautions,
  };
}

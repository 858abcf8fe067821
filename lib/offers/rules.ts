// Business rules of offers: when a vendor may submit, what a submission must match, versions.
import type { ChannelModel, ClaimMetric } from "./claim-input";

export interface TenderTerms {
  reference?: string;
  state: string;
  closesAt: Date;
  channelModel: ChannelModel;
  operatingPoints: { label: string; value: number; sensitivity?: { bitRate: number; payloadBits: number; targetPer: number } | null }[];
  /** The receiver noise figure (dB) the tender assumes where a vendor states none (sensitivity points). */
  assumedNoiseFigureDb?: number;
  currency: string;
}

/** Why a vendor may not submit, upload or withdraw now (a 409), or null when they may. */
export function submissionRefusal(tender: Pick<TenderTerms, "state" | "closesAt">, now: Date): string | null {
  if (tender.state === "cancelled") return "This tender was cancelled; it accepts no offers.";
  if (tender.state === "draft") return "This tender is not open yet.";
  if (tender.state !== "open" || tender.closesAt.getTime() <= now.getTime()) {
    return `This tender closed at ${tender.closesAt.toISOString().replace(".000Z", "Z")}; nothing can be submitted, changed or withdrawn after closing.`;
  }
  return null;
}

interface SubmittedTerms {
  code?: { decision?: "hard" | "soft" };
  claims: { pointIndex: number; metric: ClaimMetric; sensitivity?: unknown }[];
  envelope: { currency: string };
}

/** A soft-decision code cannot be judged on a hard-decision (BSC) tender without judging another receiver than the one offered. */
export const SOFT_ON_HARD =
  "This tender's channel is hard decision (binary symmetric channel), and its verdicts judge codes on hard decisions: offer the module with a hard-decision decoder, or ask the buyer for a soft-decision (BI-AWGN) tender.";

/**
 * What the generic schema cannot know: one claim per operating point of this tender, net coding
 * gain only where the trade states it (hard or soft decision links), a decoder that matches a
 * hard-decision tender, prices in the tender's currency.
 * Returns field errors keyed like the form's fields; empty when the submission fits.
 */
export function termsErrors(tender: TenderTerms, input: SubmittedTerms): Record<string, string[]> {
  const errors: Record<string, string[]> = {};
  const add = (key: string, message: string) => (errors[key] ??= []).push(message);
  const points = tender.operatingPoints.length;
  const indexes = input.claims.map((c) => c.pointIndex);
  const complete = indexes.length === points && new Set(indexes).size === points && indexes.every((i) => i >= 0 && i < points);
  if (!complete) add("claims", `Give exactly one claim for each of the tender's ${points} operating point${points === 1 ? "" : "s"}.`);
  input.claims.forEach((claim, i) => {
    const point = tender.operatingPoints[claim.pointIndex];
    if (point?.sensitivity && !claim.sensitivity) {
      add(
        `claims.${i}.sensitivity.dbm`,
        `The point "${point.label}" is stated as an input level: give your receiver sensitivity in dBm at ${point.sensitivity.bitRate} bit/s and a ${point.sensitivity.payloadBits}-bit payload.`,
      );
    } else if (point && !point.sensitivity && claim.sensitivity) {
      add(
        `claims.${i}.sensitivity`,
        `The point "${point.label}" is stated in ${tender.channelModel === "biawgn" ? "Eb/N0" : "its channel condition"}, not as an input level: claim a BER or BLER there, without a sensitivity.`,
      );
    }
    if (claim.metric === "ncg" && tender.channelModel === "bec") {
      add(`claims.${i}.metric`, "A net coding gain is not stated on an erasure channel: claim a BER or BLER.");
    }
  });
  if (tender.channelModel === "bsc" && input.code?.decision === "soft") add("code.decision", SOFT_ON_HARD);
  if (input.envelope.currency !== tender.currency) {
    add("envelope.currency", `Prices are compared in the tender's currency: use ${tender.currency}.`);
  }
  return errors;
}

/** The next version number for a vendor on a tender. */
export function nextVersion(versions: readonly { version: number }[]): number {
  return versions.reduce((max, v) => Math.max(max, v.version), 0) + 1;
}

/** The version that counts: the newest one that has not been superseded (it may be withdrawn). */
export function currentVersion<T extends { version: number; status: string }>(versions: readonly T[]): T | null {
  return versions.filter((v) => v.status !== "superseded").sort((a, b) => b.version - a.version)[0] ?? null;
}

import type { Verdict as VerdictName } from "@/lib/bounds/vocabulary";
export type { VerdictName };

/** Counts per verdict, for the ledger and the Desk; never prices. */
export function verdictSummary(verdicts: readonly VerdictName[]): Record<VerdictName, number> {
  const out: Record<VerdictName, number> = { impossible: 0, "needs-evidence": 0, plausible: 0 };
  for (const v of verdicts) out[v] += 1;
  return out;
}

/** The worst verdict of an offer's claims: one impossible claim makes the offer's headline impossible. */
export function worstVerdict(verdicts: readonly VerdictName[]): VerdictName | null {
  if (verdicts.length === 0) return null;
  if (verdicts.includes("impossible")) return "impossible";
  return verdicts.includes("needs-evidence") ? "needs-evidence" : "plausible";
}

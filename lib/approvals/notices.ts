// The words of the e-mails sent along the approval and award; pure, so tests can read them.
import type { NoticeDisclosure } from "@/db/schema";
import { formatMoney } from "@/lib/format";
import { closingWords } from "@/lib/tenders/notices";
import { CRITERION_LABELS, type Criterion } from "@/lib/scoring/types";
import { formatScore, type Standing } from "./score-sheet";

export interface NoticeText {
  subject: string;
  text: string;
}

interface TenderWords {
  id: string;
  reference: string;
  title: string;
}

const link = (t: TenderWords, tab = "") => `/tenders/${t.id}${tab}`;
const criterionName = (c: string) => CRITERION_LABELS[c as Criterion] ?? c;

export function awaitingApprovalNotice(t: TenderWords, given: number, needed: number, value: string): NoticeText {
  return {
    subject: `${t.reference}: award recommendation awaits your approval`,
    text: `The award recommendation for ${t.reference} ${t.title} (${value}) has ${given} of the ${needed} approvals it needs.\n\nOpen the Sign-off tab to approve or return it: ${link(t, "/sign-off")}`,
  };
}

/**
 * To an approver who could decide but has not declared on the tender: no vendor, value or reason,
 * only the way to declare (what they may read before declaring is the tender itself).
 */
export function declareToReadNotice(t: TenderWords): NoticeText {
  return {
    subject: `${t.reference}: a recommendation awaits approval`,
    text: `A recommendation on tender ${t.reference} ${t.title} awaits approval within your limit.\n\nDeclare any conflict of interest on the tender's Sign-off tab first; with no conflict declared, you can then read the recommendation and decide: ${link(t, "/sign-off")}`,
  };
}

export function approvalGivenNotice(t: TenderWords, approver: string, given: number, needed: number): NoticeText {
  return {
    subject: `${t.reference}: recommendation approved by ${approver} (${given} of ${needed})`,
    text: `${approver} approved the award recommendation for ${t.reference} ${t.title}. It has ${given} of the ${needed} approvals it needs.\n\n${link(t, "/sign-off")}`,
  };
}

export function returnedNotice(t: TenderWords, approver: string, comment: string): NoticeText {
  return {
    subject: `${t.reference}: recommendation returned by ${approver}`,
    text: `${approver} returned the award recommendation for ${t.reference} ${t.title} to commercial evaluation.\n\nComment: ${comment}\n\nRevise and resubmit it from the Comparison tab: ${link(t)}`,
  };
}

export function withdrawnNotice(t: TenderWords, buyer: string, reason: string): NoticeText {
  return {
    subject: `${t.reference}: recommendation withdrawn by ${buyer}`,
    text: `${buyer} withdrew the award recommendation for ${t.reference} ${t.title} from approval; your approval of it no longer counts. The tender is back in commercial evaluation.\n\nReason: ${reason}\n\n${link(t, "/sign-off")}`,
  };
}

export function awardedNotice(t: TenderWords, vendorName: string, value: string, identifier: string, sha256: string): NoticeText {
  return {
    subject: `${t.reference}: awarded to ${vendorName}`,
    text: `${t.reference} ${t.title} is awarded to ${vendorName} for ${value}. The award memo ${identifier} is on the Sign-off tab.\n\nSHA-256 fingerprint: ${sha256}\nAnyone can check the memo on the Memo check page.\n\n${link(t, "/sign-off")}`,
  };
}

/** What every award notice says about the standstill period, and what each vendor learns. */
export interface AwardDisclosure {
  mode: NoticeDisclosure;
  winnerName: string;
  /** The winner's total score (told only when the tender discloses scores). */
  winnerTotal: number | null;
  standstillDays: number;
  standstillEnds: Date;
  zone: string;
}

function standstillWords(t: TenderWords, d: AwardDisclosure, mayObject: boolean): string {
  const ends = closingWords(d.standstillEnds, d.zone);
  const lead = `The award becomes final at the end of a standstill period of ${d.standstillDays} days, on ${ends}.`;
  return mayObject
    ? `${lead} Until then you may object to it in writing: ${link(t, "/notices")}`
    : `${lead} Until then the other bidders may object to it in writing.`;
}

/** To the winning vendor: the award, the quantity and value of its own offer, and the standstill period. */
export function awardNotice(
  t: TenderWords,
  winner: { vendorName: string; moduleName: string; quantity: number; value: number; currency: string },
  identifier: string,
  disclosure: AwardDisclosure,
): NoticeText {
  return {
    subject: `Award notice: ${t.reference} ${t.title}`,
    text: [
      `Dear ${winner.vendorName},`,
      `we are pleased to tell you that tender ${t.reference} "${t.title}" is awarded to your offer of the ${winner.moduleName}: ${winner.quantity.toLocaleString("en-GB")} units for ${formatMoney(winner.value, winner.currency)}.`,
      standstillWords(t, disclosure, false),
      `The award is recorded in memo ${identifier}. The purchasing team will contact you about the order once the award is final.`,
    ].join("\n\n"),
  };
}

/**
 * To every other vendor with an offer: the winner's name and its own rank, always; its own scores and
 * the winner's total only when the tender discloses scores (a price score lets a vendor that knows its
 * own price compute the winning price). Never anyone's price, nor another loser's name.
 */
export function regretNotice(t: TenderWords, vendorName: string, own: Standing | null, ranked: number, disclosure: AwardDisclosure): NoticeText {
  const scores = disclosure.mode === "rank-and-scores";
  const lines = [`Dear ${vendorName},`, `thank you for your offer to tender ${t.reference} "${t.title}". The tender is awarded to ${disclosure.winnerName}.`];
  if (!own) {
    lines.push("Your offer was not part of the final ranking.");
  } else {
    const place = own.rank === null ? "Your offer was not ranked" : `Your offer ranked ${own.rank} of ${ranked}`;
    lines.push(scores ? `${place}, with a total score of ${formatScore(own.total)} out of 100.` : `${place}.`);
    if (own.flags.length) lines.push(own.flags.join("\n"));
    if (scores) {
      if (disclosure.winnerTotal !== null) lines.push(`The winning offer's total score is ${formatScore(disclosure.winnerTotal)} out of 100.`);
      const parts = own.criteria.map((c) => `- ${criterionName(c.criterion)} (weight ${c.weight}): ${formatScore(c.score)} of 100`);
      if (parts.length) lines.push(`Your scores by criterion:\n${parts.join("\n")}`);
    }
  }
  lines.push(standstillWords(t, disclosure, true));
  lines.push("You may ask the purchasing team for a debriefing.");
  return { subject: `Outcome of tender ${t.reference} ${t.title}`, text: lines.join("\n\n") };
}

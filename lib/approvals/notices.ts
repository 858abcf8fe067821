// The words of the e-mails sent along the approval and award; pure, so tests can read them.
import { formatMoney } from "@/lib/format";
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

export function awardedNotice(t: TenderWords, vendorName: string, value: string, identifier: string, sha256: string): NoticeText {
  return {
    subject: `${t.reference}: awarded to ${vendorName}`,
    text: `${t.reference} ${t.title} is awarded to ${vendorName} for ${value}. The award memo ${identifier} is on the Sign-off tab.\n\nSHA-256 fingerprint: ${sha256}\nAnyone can check the memo on the Memo check page.\n\n${link(t, "/sign-off")}`,
  };
}

/** To the winning vendor: the award, the quantity and value of its own offer. */
export function awardNotice(
  t: TenderWords,
  winner: { vendorName: string; moduleName: string; quantity: number; value: number; currency: string },
  identifier: string,
): NoticeText {
  return {
    subject: `Award notice: ${t.reference} ${t.title}`,
    text: [
      `Dear ${winner.vendorName},`,
      `we are pleased to tell you that tender ${t.reference} "${t.title}" is awarded to your offer of the ${winner.moduleName}: ${winner.quantity.toLocaleString("en-GB")} units for ${formatMoney(winner.value, winner.currency)}.`,
      `The award is recorded in memo ${identifier}. The purchasing team will contact you about the order.`,
    ].join("\n\n"),
  };
}

/**
 * To every other vendor with an offer: their own total, rank and criterion scores only. Nothing
 * about another vendor (not the winner's name, nor anyone's price) appears in it.
 */
export function regretNotice(t: TenderWords, vendorName: string, own: Standing | null, ranked: number): NoticeText {
  const lines = [`Dear ${vendorName},`, `thank you for your offer to tender ${t.reference} "${t.title}". The tender has been awarded to another offer.`];
  if (!own) {
    lines.push("Your offer was not part of the final ranking.");
  } else {
    const place = own.rank === null ? "Your offer was not ranked" : `Your offer ranked ${own.rank} of ${ranked}`;
    lines.push(`${place}, with a total score of ${formatScore(own.total)} out of 100.`);
    if (own.flags.length) lines.push(own.flags.join("\n"));
    const parts = own.criteria.map((c) => `- ${criterionName(c.criterion)} (weight ${c.weight}): ${formatScore(c.score)} of 100`);
    if (parts.length) lines.push(`Your scores by criterion:\n${parts.join("\n")}`);
  }
  lines.push("You may ask the purchasing team for a debriefing.");
  return { subject: `Outcome of tender ${t.reference} ${t.title}`, text: lines.join("\n\n") };
}

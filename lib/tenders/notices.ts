import { formatInTimeZone } from "date-fns-tz";
import { absoluteLink } from "@/lib/mail/words";

interface NoticeTender {
  id: string;
  reference: string;
  title: string;
  closesAt: Date;
  closesZone: string;
}

/** "Friday 15 January 2027, 12:00 (Europe/London)": the closing time in the tender's own zone. */
export function closingWords(closesAt: Date, zone: string): string {
  return `${formatInTimeZone(closesAt, zone, "EEEE d MMMM yyyy, HH:mm")} (${zone})`;
}

export const tenderLink = (baseUrl: string, tenderId: string) => absoluteLink(baseUrl, `/tenders/${tenderId}`);

/** The invitation each invited vendor user receives when a tender opens. */
export function invitationNotice(tender: NoticeTender, baseUrl: string) {
  return {
    subject: `Invitation to tender ${tender.reference}: ${tender.title}`,
    text: [
      `Your organisation is invited to make an offer in tender ${tender.reference}, "${tender.title}".`,
      `Offers close on ${closingWords(tender.closesAt, tender.closesZone)}. The server accepts no offer after that time.`,
      `Read the requirements and make your offer here: ${tenderLink(baseUrl, tender.id)}`,
    ].join("\n\n"),
  };
}

/** The notice of a cancellation, with the buyer's reason. */
export function cancellationNotice(tender: NoticeTender, reason: string, baseUrl: string) {
  return {
    subject: `Tender ${tender.reference} cancelled: ${tender.title}`,
    text: [
      `Tender ${tender.reference}, "${tender.title}", has been cancelled.`,
      `Reason given: ${reason}`,
      `The record stays available here: ${tenderLink(baseUrl, tender.id)}`,
    ].join("\n\n"),
  };
}

// What every e-mail carries, whoever sends it: absolute links and the short caution. Pure.

/** The short form of the product's cautions (PRODUCT.md, "Cautions the product shows"), for e-mails. */
export const MAIL_CAUTION =
  "Caution: verdicts judge coding claims against mathematical limits; they do not certify regulatory approval, safety or fitness for use, nor replace qualification testing. Awards follow your organisation's purchasing policy and the procurement law that applies to it.";

const base = (baseUrl: string) => baseUrl.replace(/\/+$/, "");

/** An absolute link into Ratecourt, from an app path ("/tenders/…"). */
export const absoluteLink = (baseUrl: string, path: string) => `${base(baseUrl)}${path.startsWith("/") ? path : `/${path}`}`;

// An app path standing on its own in a text: "/tenders/…" after a line start, a space or "(".
const RELATIVE_PATH = /(^|[\s(])(\/[a-z][^\s)]*)/gm;

/**
 * A notice's text as it is mailed: every app path turned into an absolute link (a mail client has
 * no page to resolve a relative one against), then the caution and the sender's address.
 */
export function mailText(text: string, baseUrl: string): string {
  const linked = text.replace(RELATIVE_PATH, (_, before: string, path: string) => `${before}${absoluteLink(baseUrl, path)}`);
  return `${linked}\n\n${MAIL_CAUTION}\n\n— Ratecourt, ${base(baseUrl)}`;
}

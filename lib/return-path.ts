// Where sign-in sends a person back to. Pure, so that the page, the action and the tests agree.

export const DESK_PATH = "/desk";
/** The request header the proxy sets with the path (and query) of the page asked for. */
export const PAGE_PATH_HEADER = "x-ratecourt-page";

// Any origin works: a path that resolves to another origin against it is not one of ours.
const PROBE = "http://ratecourt.invalid";

/**
 * The same-origin path to return to after sign-in, or the Desk. Only a plain path is followed:
 * "//x", "/\evil.example" (which browsers read as another host), absolute URLs, control characters
 * and the sign-in page itself all fall back to the Desk.
 */
export function safeReturnPath(next: unknown): string {
  if (typeof next !== "string" || next.length === 0 || next.length > 2000) return DESK_PATH;
  // oxlint-disable-next-line no-control-regex -- control characters are what this refuses
  if (!next.startsWith("/") || next.startsWith("//") || /[\\\u0000-\u001f\u007f]/.test(next)) return DESK_PATH;
  let url: URL;
  try {
    url = new URL(next, PROBE);
  } catch {
    return DESK_PATH;
  }
  if (url.origin !== PROBE || url.pathname.startsWith("/sign-in") || url.pathname.startsWith("/api/")) return DESK_PATH;
  return `${url.pathname}${url.search}${url.hash}`;
}

/** The sign-in page, asked to return to a page afterwards (the Desk needs no asking). */
export function signInPath(returnTo: string | null | undefined): string {
  const path = safeReturnPath(returnTo);
  return path === DESK_PATH ? "/sign-in" : `/sign-in?next=${encodeURIComponent(path)}`;
}

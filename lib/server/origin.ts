import "server-only";
import { env } from "@/lib/env";

/** The origins a signed-in browser's writes may come from: the app's address (and its loopback twins). */
export function trustedOrigins(base = env().appUrl): string[] {
  const url = new URL(base);
  const port = url.port ? `:${url.port}` : "";
  return [base, `${url.protocol}//localhost${port}`, `${url.protocol}//127.0.0.1${port}`];
}

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * Why a write carrying cookies must be refused as cross-site, or null. Browsers send Origin with
 * every POST, PUT, PATCH and DELETE; a foreign one, "null" (sandboxed frames, some redirects) or
 * none at all means the request was not made by Ratecourt's own pages.
 */
export function crossSiteRefusal(method: string, headers: Headers): string | null {
  if (SAFE_METHODS.has(method.toUpperCase()) || !headers.get("cookie")) return null;
  const origin = headers.get("origin");
  if (origin && trustedOrigins().includes(origin)) return null;
  const from = origin === null ? "without an Origin header" : origin === "null" ? "from an opaque origin" : `from ${origin.slice(0, 100)}`;
  return `A signed-in change must come from Ratecourt's own pages (${env().appUrl}); this request came ${from}.`;
}

import { NextResponse, type NextRequest } from "next/server";
import { PAGE_PATH_HEADER } from "@/lib/return-path";
import { crossSiteRefusal } from "@/lib/server/origin";
import { BAD_TEXT_MESSAGE, decodePathSegment, isCleanText } from "@/lib/validation/text";

/**
 * Runs before every page, server action and route. An address whose parts do not decode to clean
 * text answers 400 (instead of reaching the database); a server action posted from another site
 * answers 403 (Next.js would refuse it with a 500). Pages are told which path was asked for, so
 * that one opened while signed out can send the person to sign-in and back (lib/server/pages.ts).
 * No access decision is made here: every action and handler authorises itself.
 */
export function proxy(request: NextRequest) {
  const { pathname, search, searchParams } = request.nextUrl;
  const cleanPath = pathname.split("/").every((segment) => decodePathSegment(segment) !== null);
  if (!cleanPath || ![...searchParams.values()].every(isCleanText)) {
    return NextResponse.json({ error: `The address ${BAD_TEXT_MESSAGE}` }, { status: 400 });
  }
  if (request.headers.has("next-action")) {
    const refusal = crossSiteRefusal(request.method, request.headers);
    if (refusal) return NextResponse.json({ error: refusal }, { status: 403 });
  }
  if (pathname.startsWith("/api/")) return NextResponse.next();
  const headers = new Headers(request.headers);
  headers.set(PAGE_PATH_HEADER, `${pathname}${search}`);
  return NextResponse.next({ request: { headers } });
}

export const config = { matcher: ["/((?!_next/static|_next/image|favicon.ico).*)"] };

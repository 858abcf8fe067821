import { NextResponse, type NextRequest } from "next/server";
import { crossSiteRefusal } from "@/lib/server/origin";
import { BAD_TEXT_MESSAGE, decodePathSegment, isCleanText } from "@/lib/validation/text";

/**
 * Runs before every page, server action and route: an address whose parts do not decode to clean
 * text answers 400 (instead of reaching the database), and a server action posted from another
 * site answers 403 (Next.js would refuse it with a 500).
 */
export function proxy(request: NextRequest) {
  const { pathname, searchParams } = request.nextUrl;
  const cleanPath = pathname.split("/").every((segment) => decodePathSegment(segment) !== null);
  if (!cleanPath || ![...searchParams.values()].every(isCleanText)) {
    return NextResponse.json({ error: `The address ${BAD_TEXT_MESSAGE}` }, { status: 400 });
  }
  if (request.headers.has("next-action")) {
    const refusal = crossSiteRefusal(request.method, request.headers);
    if (refusal) return NextResponse.json({ error: refusal }, { status: 403 });
  }
  return NextResponse.next();
}

export const config = { matcher: ["/((?!_next/static|_next/image|favicon.ico).*)"] };

import { NextResponse, type NextRequest } from "next/server";
import { PAGE_PATH_HEADER } from "@/lib/return-path";

/**
 * Tells the pages which path was asked for, so that a page opened while signed out can send the
 * person to sign-in and back to itself (lib/server/pages.ts). Nothing else: no access decision here.
 */
export function proxy(request: NextRequest) {
  const headers = new Headers(request.headers);
  headers.set(PAGE_PATH_HEADER, `${request.nextUrl.pathname}${request.nextUrl.search}`);
  return NextResponse.next({ request: { headers } });
}

export const config = {
  matcher: ["/((?!api/|_next/|favicon|.*\\.[a-z0-9]+$).*)"],
};

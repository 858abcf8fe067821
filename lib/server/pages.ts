import "server-only";
import { cache } from "react";
import { headers } from "next/headers";
import { forbidden, notFound, redirect } from "next/navigation";
import type { ZodType } from "zod";
import { PAGE_PATH_HEADER, signInPath } from "@/lib/return-path";
import { describeZodError } from "@/lib/validation/messages";
import { ForbiddenError, NotFoundError, UnauthorizedError } from "./errors";
import { getViewer, type Viewer } from "./session";
import { getTender, type TenderWithInvites } from "./tenders";

/** Sign-in, asked to come back to the page that was asked for (the proxy names it). */
async function toSignIn(): Promise<never> {
  redirect(signInPath((await headers()).get(PAGE_PATH_HEADER)));
}

/**
 * For pages: the signed-in viewer, or a redirect to sign-in and back. Looked up once per request
 * (React's cache), however many layouts and pages of the request ask.
 */
export const pageViewer = cache(async (): Promise<Viewer> => {
  const viewer = await getViewer();
  if (!viewer) return toSignIn();
  return viewer;
});

/** For pages: typed failures become the forbidden, not-found or sign-in page. */
export async function orPage<T>(work: Promise<T>): Promise<T> {
  try {
    return await work;
  } catch (error) {
    if (error instanceof ForbiddenError) forbidden();
    if (error instanceof NotFoundError) notFound();
    if (error instanceof UnauthorizedError) await toSignIn();
    throw error;
  }
}

/**
 * For list pages: the URL's filters and page, parsed by the same schema as the API. A bad value
 * does not fail the page: the list shows with the defaults, and `problem` says what was wrong.
 */
export function pageQuery<T>(searchParams: Record<string, string | string[] | undefined>, schema: ZodType<T>): { query: T; problem: string | null } {
  const flat = Object.fromEntries(
    Object.entries(searchParams).flatMap(([k, v]) => (typeof v === "string" ? [[k, v]] : Array.isArray(v) && v.length ? [[k, v[0]]] : [])),
  );
  const parsed = schema.safeParse(flat);
  if (parsed.success) return { query: parsed.data, problem: null };
  return { query: schema.parse({}), problem: `${describeZodError(parsed.error)} Showing the first page without filters instead.` };
}

/**
 * For tender pages: the tender the viewer may read, or the forbidden or not-found page. Read once
 * per request, so the tender layout and its tab share one lookup.
 */
export const pageTender = cache(async (id: string): Promise<TenderWithInvites> => orPage(getTender(await pageViewer(), id)));

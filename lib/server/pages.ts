import "server-only";
import { headers } from "next/headers";
import { forbidden, notFound, redirect } from "next/navigation";
import { PAGE_PATH_HEADER, signInPath } from "@/lib/return-path";
import { ForbiddenError, NotFoundError, UnauthorizedError } from "./errors";
import { getViewer, type Viewer } from "./session";

/** Sign-in, asked to come back to the page that was asked for (the proxy names it). */
async function toSignIn(): Promise<never> {
  redirect(signInPath((await headers()).get(PAGE_PATH_HEADER)));
}

/** For pages: the signed-in viewer, or a redirect to sign-in and back. */
export async function pageViewer(): Promise<Viewer> {
  const viewer = await getViewer();
  if (!viewer) return toSignIn();
  return viewer;
}

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

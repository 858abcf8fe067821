import "server-only";
import { forbidden, notFound, redirect } from "next/navigation";
import { ForbiddenError, NotFoundError, UnauthorizedError } from "./errors";
import { getViewer, type Viewer } from "./session";

/** For pages: the signed-in viewer, or a redirect to sign-in. */
export async function pageViewer(): Promise<Viewer> {
  const viewer = await getViewer();
  if (!viewer) redirect("/sign-in");
  return viewer;
}

/** For pages: typed failures become the forbidden, not-found or sign-in page. */
export async function orPage<T>(work: Promise<T>): Promise<T> {
  try {
    return await work;
  } catch (error) {
    if (error instanceof ForbiddenError) forbidden();
    if (error instanceof NotFoundError) notFound();
    if (error instanceof UnauthorizedError) redirect("/sign-in");
    throw error;
  }
}

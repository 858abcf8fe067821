import { jsonRoute } from "@/lib/server/http";
import { listThreads } from "@/lib/server/threads";
import { requireViewer } from "@/lib/server/session";

/** The clarification threads this viewer may read, optionally of one tender (?tenderId=). */
export const GET = jsonRoute(async (request) => {
  const viewer = await requireViewer(request.headers);
  const tenderId = new URL(request.url).searchParams.get("tenderId") ?? undefined;
  return { threads: await listThreads(viewer, { tenderId: tenderId || undefined }) };
});

import { jsonRoute, readJson } from "@/lib/server/http";
import { closeThread } from "@/lib/server/threads";
import { requireViewer } from "@/lib/server/session";
import { closeThreadSchema } from "@/lib/validation/review";

export const POST = jsonRoute(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const viewer = await requireViewer(request.headers);
  return closeThread(viewer, (await params).id, await readJson(request, closeThreadSchema));
});

import { jsonRoute, readJson } from "@/lib/server/http";
import { requireViewer } from "@/lib/server/session";
import { cancelTender } from "@/lib/server/tender-lifecycle";
import { cancelTenderSchema } from "@/lib/validation/tender";

export const POST = jsonRoute(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const viewer = await requireViewer(request.headers);
  const input = await readJson(request, cancelTenderSchema);
  return cancelTender(viewer, (await params).id, input);
});

import { jsonRoute, readJson } from "@/lib/server/http";
import { requireViewer } from "@/lib/server/session";
import { createTender } from "@/lib/server/tender-lifecycle";
import { listTenderViews } from "@/lib/server/tenders";
import { tenderInputSchema } from "@/lib/validation/tender";

export const GET = jsonRoute(async (request) => listTenderViews(await requireViewer(request.headers)));

export const POST = jsonRoute(async (request) => {
  const viewer = await requireViewer(request.headers);
  const input = await readJson(request, tenderInputSchema);
  return Response.json(await createTender(viewer, input), { status: 201 });
});

import { createRoute, jsonRoute, readQuery } from "@/lib/server/http";
import { requireViewer } from "@/lib/server/session";
import { createTender } from "@/lib/server/tender-lifecycle";
import { listTenderViewPage } from "@/lib/server/tenders";
import { tenderInputSchema, tenderListQuerySchema } from "@/lib/validation/tender";

/** One page of the tenders the viewer may read: ?page=&size=&state=&q= (text in the reference or title). */
export const GET = jsonRoute(async (request) => {
  const viewer = await requireViewer(request.headers);
  return listTenderViewPage(viewer, readQuery(request, tenderListQuerySchema));
});

export const POST = createRoute(tenderInputSchema, createTender);

import { jsonRoute, readQuery } from "@/lib/server/http";
import { listClaimQueue } from "@/lib/server/review";
import { requireViewer } from "@/lib/server/session";
import { claimQueueSchema } from "@/lib/validation/review";

/** One page of the Review bench queue: ?tenderId=&vendor=&verdict=&mark= (mark may be "unmarked") &page=&size=. */
export const GET = jsonRoute(async (request) => {
  const viewer = await requireViewer(request.headers);
  return listClaimQueue(viewer, readQuery(request, claimQueueSchema));
});

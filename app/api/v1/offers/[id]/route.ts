import { jsonRoute } from "@/lib/server/http";
import { getOffer } from "@/lib/server/offers";
import { requireViewer } from "@/lib/server/session";

/** One version of an offer, with the versions the viewer may read. */
export const GET = jsonRoute(async (request, { params }: { params: Promise<{ id: string }> }) =>
  getOffer(await requireViewer(request.headers), (await params).id),
);

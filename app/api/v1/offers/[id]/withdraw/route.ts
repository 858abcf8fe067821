import { jsonRoute } from "@/lib/server/http";
import { withdrawOffer } from "@/lib/server/offers";
import { requireViewer } from "@/lib/server/session";

/** Withdraws the current version of the vendor's offer (kept on record as withdrawn). */
export const POST = jsonRoute(async (request, { params }: { params: Promise<{ id: string }> }) =>
  withdrawOffer(await requireViewer(request.headers), (await params).id),
);

import { jsonRoute, recordRoute } from "@/lib/server/http";
import { listOffers, submitOffer } from "@/lib/server/offers";
import { requireViewer } from "@/lib/server/session";
import { offerSchema } from "@/lib/validation/offer";

type Context = { params: Promise<{ id: string }> };

/** The current offer of each vendor the viewer may read, envelope fields stripped by the policies. */
export const GET = jsonRoute(async (request, { params }: Context) => listOffers(await requireViewer(request.headers), (await params).id));

/** Submits or resubmits the signed-in vendor's offer; answers with its claims and computed verdicts. */
export const POST = recordRoute(offerSchema, submitOffer, 201);

import { jsonRoute, recordRoute } from "@/lib/server/http";
import { listRecommendations, submitRecommendation } from "@/lib/server/recommendations";
import { requireViewer } from "@/lib/server/session";
import { recommendationSchema } from "@/lib/validation/comparison";

type Context = { params: Promise<{ id: string }> };

/** The tender's recommendations, newest (the current one) first. */
export const GET = jsonRoute(async (request, { params }: Context) => {
  const all = await listRecommendations(await requireViewer(request.headers), (await params).id);
  return { current: all[0] ?? null, history: all };
});

/** The buyer's recommendation: { offerId, quantity, value, justification }; 201 with the stored row. */
export const POST = recordRoute(recommendationSchema, submitRecommendation, 201);

import { jsonRoute, readJson } from "@/lib/server/http";
import { withdrawRecommendation } from "@/lib/server/recommendations";
import { requireViewer } from "@/lib/server/session";
import { withdrawalSchema } from "@/lib/validation/comparison";

type Context = { params: Promise<{ id: string }> };

/** The buyer withdraws the recommendation awaiting approval: { reason }; the tender returns to commercial evaluation. */
export const POST = jsonRoute(async (request, { params }: Context) => {
  const viewer = await requireViewer(request.headers);
  const input = await readJson(request, withdrawalSchema);
  return withdrawRecommendation(viewer, (await params).id, input);
});

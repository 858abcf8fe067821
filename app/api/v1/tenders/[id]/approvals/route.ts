import { decideRecommendation } from "@/lib/server/approvals";
import { getAwardSignOff } from "@/lib/server/award-sign-off";
import { jsonRoute, recordRoute } from "@/lib/server/http";
import { requireViewer } from "@/lib/server/session";
import { decisionSchema } from "@/lib/validation/approvals";

type Context = { params: Promise<{ id: string }> };

/** The Sign-off view: recommendation, standings, verdicts, decisions so far, routing, memo. */
export const GET = jsonRoute(async (request, { params }: Context) => getAwardSignOff(await requireViewer(request.headers), (await params).id));

/** { decision: "approve", comment? } or { decision: "return", comment }. */
export const POST = recordRoute(decisionSchema, decideRecommendation);

import { jsonRoute, recordRoute } from "@/lib/server/http";
import { getSignoffState, signTechnical } from "@/lib/server/signoff";
import { requireViewer } from "@/lib/server/session";
import { signoffSchema } from "@/lib/validation/review";

type Context = { params: Promise<{ id: string }> };

export const GET = jsonRoute(async (request, { params }: Context) => getSignoffState(await requireViewer(request.headers), (await params).id));

export const POST = recordRoute(signoffSchema, signTechnical, 201);

import { jsonRoute, recordRoute } from "@/lib/server/http";
import { listObjections, lodgeObjection } from "@/lib/server/objections";
import { requireViewer } from "@/lib/server/session";
import { objectionSchema } from "@/lib/validation/notices";

type Context = { params: Promise<{ id: string }> };

/** The standstill period and the objections the viewer may read. */
export const GET = jsonRoute(async (request, { params }: Context) => listObjections(await requireViewer(request.headers), (await params).id));

export const POST = recordRoute(objectionSchema, lodgeObjection, 201);

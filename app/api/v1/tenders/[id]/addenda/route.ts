import { jsonRoute, recordRoute } from "@/lib/server/http";
import { listAddenda, publishAddendum } from "@/lib/server/addenda";
import { requireViewer } from "@/lib/server/session";
import { addendumSchema } from "@/lib/validation/notices";

type Context = { params: Promise<{ id: string }> };

export const GET = jsonRoute(async (request, { params }: Context) => listAddenda(await requireViewer(request.headers), (await params).id));

export const POST = recordRoute(addendumSchema, publishAddendum, 201);

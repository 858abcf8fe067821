import { jsonRoute, recordRoute } from "@/lib/server/http";
import { getThread, postMessage } from "@/lib/server/threads";
import { requireViewer } from "@/lib/server/session";
import { messageSchema } from "@/lib/validation/review";

type Context = { params: Promise<{ id: string }> };

export const GET = jsonRoute(async (request, { params }: Context) => getThread(await requireViewer(request.headers), (await params).id));

export const POST = recordRoute(messageSchema, postMessage, 201);

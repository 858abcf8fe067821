import { jsonRoute } from "@/lib/server/http";
import { acknowledgeAddendum } from "@/lib/server/addenda";
import { requireViewer } from "@/lib/server/session";

type Context = { params: Promise<{ id: string }> };

export const POST = jsonRoute(async (request, { params }: Context) => acknowledgeAddendum(await requireViewer(request.headers), (await params).id));

import { jsonRoute } from "@/lib/server/http";
import { openEnvelopes } from "@/lib/server/comparison";
import { requireViewer } from "@/lib/server/session";

type Context = { params: Promise<{ id: string }> };

/** Opens the tender's sealed envelopes (buyer, after the technical sign-off); no body. 409 before the sign-off or once open. */
export const POST = jsonRoute(async (request, { params }: Context) => openEnvelopes(await requireViewer(request.headers), (await params).id));

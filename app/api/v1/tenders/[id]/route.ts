import { jsonRoute, recordRoute } from "@/lib/server/http";
import { requireViewer } from "@/lib/server/session";
import { updateTender } from "@/lib/server/tender-lifecycle";
import { getTenderView } from "@/lib/server/tenders";
import { tenderPatchSchema } from "@/lib/validation/tender";

type Context = { params: Promise<{ id: string }> };

export const GET = jsonRoute(async (request, { params }: Context) => getTenderView(await requireViewer(request.headers), (await params).id));

export const PATCH = recordRoute(tenderPatchSchema, updateTender);

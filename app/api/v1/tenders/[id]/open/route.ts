import { jsonRoute } from "@/lib/server/http";
import { requireViewer } from "@/lib/server/session";
import { openTender } from "@/lib/server/tender-lifecycle";

export const POST = jsonRoute(async (request, { params }: { params: Promise<{ id: string }> }) =>
  openTender(await requireViewer(request.headers), (await params).id),
);

import { jsonRoute } from "@/lib/server/http";
import { requireViewer } from "@/lib/server/session";
import { getTender } from "@/lib/server/tenders";

export const GET = jsonRoute(async (request, { params }: { params: Promise<{ id: string }> }) =>
  getTender(await requireViewer(request.headers), (await params).id),
);

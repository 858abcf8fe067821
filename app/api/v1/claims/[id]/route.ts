import { jsonRoute } from "@/lib/server/http";
import { getClaimDetail } from "@/lib/server/review";
import { requireViewer } from "@/lib/server/session";

export const GET = jsonRoute(async (request, { params }: { params: Promise<{ id: string }> }) =>
  getClaimDetail(await requireViewer(request.headers), (await params).id),
);

import { jsonRoute, recordRoute } from "@/lib/server/http";
import { listThreads, openThread } from "@/lib/server/threads";
import { loadClaim } from "@/lib/server/review";
import { requireViewer } from "@/lib/server/session";
import { threadSchema } from "@/lib/validation/review";

type Context = { params: Promise<{ id: string }> };

export const GET = jsonRoute(async (request, { params }: Context) => {
  const viewer = await requireViewer(request.headers);
  const { claim } = await loadClaim(viewer, (await params).id);
  return { threads: await listThreads(viewer, { claimId: claim.id }) };
});

export const POST = recordRoute(threadSchema, openThread, 201);

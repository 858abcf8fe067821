import { jsonRoute, recordRoute } from "@/lib/server/http";
import { listEvidence, recordEvidence } from "@/lib/server/evidence";
import { requireViewer } from "@/lib/server/session";
import { evidenceRunSchema } from "@/lib/validation/review";

type Context = { params: Promise<{ id: string }> };

export const GET = jsonRoute(async (request, { params }: Context) => ({
  runs: await listEvidence(await requireViewer(request.headers), (await params).id),
}));

export const POST = recordRoute(evidenceRunSchema, recordEvidence, 201);

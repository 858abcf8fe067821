import { jsonRoute, recordRoute } from "@/lib/server/http";
import { createMark, listMarks } from "@/lib/server/marks";
import { requireViewer } from "@/lib/server/session";
import { markSchema } from "@/lib/validation/review";

type Context = { params: Promise<{ id: string }> };

export const GET = jsonRoute(async (request, { params }: Context) => ({
  marks: await listMarks(await requireViewer(request.headers), (await params).id),
}));

export const POST = recordRoute(markSchema, createMark, 201);

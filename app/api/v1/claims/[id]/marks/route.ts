import { jsonRoute, readJson } from "@/lib/server/http";
import { createMark, listMarks } from "@/lib/server/marks";
import { requireViewer } from "@/lib/server/session";
import { markSchema } from "@/lib/validation/review";

type Context = { params: Promise<{ id: string }> };

export const GET = jsonRoute(async (request, { params }: Context) => ({
  marks: await listMarks(await requireViewer(request.headers), (await params).id),
}));

export const POST = jsonRoute(async (request, { params }: Context) => {
  const viewer = await requireViewer(request.headers);
  const input = await readJson(request, markSchema);
  return Response.json(await createMark(viewer, (await params).id, input), { status: 201 });
});

import { jsonRoute, readJson } from "@/lib/server/http";
import { answerObjection } from "@/lib/server/objections";
import { requireViewer } from "@/lib/server/session";
import { objectionAnswerSchema } from "@/lib/validation/notices";

type Context = { params: Promise<{ id: string }> };

/** The buying team's written answer to a vendor's objection (buyer), once. */
export const POST = jsonRoute(async (request, { params }: Context) => {
  const viewer = await requireViewer(request.headers);
  const input = await readJson(request, objectionAnswerSchema);
  return Response.json(await answerObjection(viewer, (await params).id, input));
});

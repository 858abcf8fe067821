import { jsonRoute, readJson } from "@/lib/server/http";
import { createUser, listPeople } from "@/lib/server/people";
import { requireViewer } from "@/lib/server/session";
import { createUserSchema } from "@/lib/validation/people";

export const GET = jsonRoute(async (request) => listPeople(await requireViewer(request.headers)));

export const POST = jsonRoute(async (request) => {
  const viewer = await requireViewer(request.headers);
  const input = await readJson(request, createUserSchema);
  return Response.json(await createUser(viewer, input), { status: 201 });
});

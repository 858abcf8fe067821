import { jsonRoute, readJson } from "@/lib/server/http";
import { createOrganisation, listOrganisations } from "@/lib/server/people";
import { requireViewer } from "@/lib/server/session";
import { createOrganisationSchema } from "@/lib/validation/people";

export const GET = jsonRoute(async (request) => listOrganisations(await requireViewer(request.headers)));

export const POST = jsonRoute(async (request) => {
  const viewer = await requireViewer(request.headers);
  const input = await readJson(request, createOrganisationSchema);
  return Response.json(await createOrganisation(viewer, input), { status: 201 });
});

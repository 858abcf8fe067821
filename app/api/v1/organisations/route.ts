import { createRoute, jsonRoute } from "@/lib/server/http";
import { createOrganisation, listOrganisations } from "@/lib/server/people";
import { requireViewer } from "@/lib/server/session";
import { createOrganisationSchema } from "@/lib/validation/people";

export const GET = jsonRoute(async (request) => listOrganisations(await requireViewer(request.headers)));

export const POST = createRoute(createOrganisationSchema, createOrganisation);

import { createRoute, jsonRoute, readQuery } from "@/lib/server/http";
import { createUser, listPeople } from "@/lib/server/people";
import { requireViewer } from "@/lib/server/session";
import { createUserSchema, peopleQuerySchema } from "@/lib/validation/people";

/** One page of people (admin): ?q=&organisationId=&role=&status=&page=&size=. */
export const GET = jsonRoute(async (request) => {
  const viewer = await requireViewer(request.headers);
  return listPeople(viewer, readQuery(request, peopleQuerySchema));
});

export const POST = createRoute(createUserSchema, createUser);

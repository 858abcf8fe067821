import { packRules } from "@casl/ability/extra";
import { jsonRoute } from "@/lib/server/http";
import { requireViewer } from "@/lib/server/session";

export const GET = jsonRoute(async (request) => {
  const viewer = await requireViewer(request.headers);
  return {
    id: viewer.actor.id,
    name: viewer.name,
    email: viewer.email,
    organisation: { id: viewer.actor.organisationId, name: viewer.organisationName, kind: viewer.actor.organisationKind },
    roles: viewer.actor.roles,
    // The client uses these only to hide controls; the server checks every request itself.
    rules: packRules(viewer.ability.rules),
  };
});

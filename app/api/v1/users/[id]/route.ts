import { jsonRoute, readJson } from "@/lib/server/http";
import { updateUser } from "@/lib/server/people";
import { requireViewer } from "@/lib/server/session";
import { updateUserSchema } from "@/lib/validation/people";

export const PATCH = jsonRoute(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const viewer = await requireViewer(request.headers);
  const input = await readJson(request, updateUserSchema);
  const user = await updateUser(viewer, (await params).id, input);
  return user && { id: user.id, email: user.email, name: user.name, active: user.active, roles: user.roles, approvalLimit: user.approvalLimit };
});

import { createBackup } from "@/lib/server/backups";
import { jsonRoute } from "@/lib/server/http";
import { requireViewer } from "@/lib/server/session";

/** A backup of the embedded database and object store while the server runs (admin). */
export const POST = jsonRoute(async (request) => {
  const viewer = await requireViewer(request.headers);
  return Response.json(await createBackup(viewer), { status: 201 });
});

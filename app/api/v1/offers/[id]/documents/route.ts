import { uploadDocument } from "@/lib/server/documents";
import { jsonRoute } from "@/lib/server/http";
import { requireViewer } from "@/lib/server/session";

/** multipart/form-data: "file" (a PDF of at most 20 MB) and "kind" (datasheet or test-report). */
export const POST = jsonRoute(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const viewer = await requireViewer(request.headers);
  return Response.json(await uploadDocument(viewer, (await params).id, request), { status: 201 });
});

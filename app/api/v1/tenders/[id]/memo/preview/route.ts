import { jsonRoute } from "@/lib/server/http";
import { pdfResponse, previewMemo } from "@/lib/server/memos";
import { requireViewer } from "@/lib/server/session";

/** The memo as it would read now, rendered on the fly and never stored. */
export const GET = jsonRoute(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { fileName, bytes } = await previewMemo(await requireViewer(request.headers), (await params).id);
  return pdfResponse(bytes, fileName, "inline");
});

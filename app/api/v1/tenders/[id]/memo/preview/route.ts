import { jsonRoute } from "@/lib/server/http";
import { pdfResponse, previewMemo } from "@/lib/server/memos";
import { requireViewer } from "@/lib/server/session";

/** The memo as it reads now; rendered once per version of what it prints and reused, never issued. */
export const GET = jsonRoute(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { fileName, bytes, renderedAt } = await previewMemo(await requireViewer(request.headers), (await params).id);
  return pdfResponse(bytes, fileName, "inline", { "x-memo-preview-rendered-at": renderedAt.toISOString() });
});

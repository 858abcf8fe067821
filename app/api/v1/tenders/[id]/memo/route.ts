import { jsonRoute } from "@/lib/server/http";
import { getMemoFile, pdfResponse } from "@/lib/server/memos";
import { requireViewer } from "@/lib/server/session";

/** The issued award memo, byte for byte as fingerprinted. */
export const GET = jsonRoute(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { fileName, bytes, memo } = await getMemoFile(await requireViewer(request.headers), (await params).id);
  return pdfResponse(bytes, fileName, "attachment", { "x-memo-sha256": memo.sha256 });
});

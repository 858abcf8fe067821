import { getDocumentFile } from "@/lib/server/documents";
import { jsonRoute } from "@/lib/server/http";
import { requireViewer } from "@/lib/server/session";

/** The stored PDF, after the policy check, as an attachment. */
export const GET = jsonRoute(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const file = await getDocumentFile(await requireViewer(request.headers), (await params).id);
  const ascii = file.fileName.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return new Response(new Blob([file.bytes as Uint8Array<ArrayBuffer>]), {
    headers: {
      "content-type": file.contentType,
      "content-length": String(file.bytes.length),
      "content-disposition": `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(file.fileName)}`,
      "x-content-type-options": "nosniff",
      "cache-control": "private, no-store",
      "x-sha256": file.sha256,
    },
  });
});

import { jsonRoute } from "@/lib/server/http";
import { getComparisonBody } from "@/lib/server/comparison";
import { requireViewer } from "@/lib/server/session";

type Context = { params: Promise<{ id: string }> };

/**
 * The Comparison: the scoring input (what the viewer may read) and the score sheet, recomputed
 * whenever the tender's inputs change.
 * Before the envelopes are opened it answers 200 without any price, lead time or warranty, and
 * without totals or ranks; engineers and vendors get 403.
 */
export const GET = jsonRoute(async (request, { params }: Context) => {
  const body = await getComparisonBody(await requireViewer(request.headers), (await params).id);
  return new Response(body as Uint8Array<ArrayBuffer>, { headers: { "content-type": "application/json", "content-length": String(body.byteLength) } });
});

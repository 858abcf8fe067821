import { removeApprovalBand, updateApprovalBand } from "@/lib/server/approval-bands";
import { jsonRoute, readJson } from "@/lib/server/http";
import { requireViewer } from "@/lib/server/session";
import { approvalBandSchema } from "@/lib/validation/approvals";

type Context = { params: Promise<{ id: string }> };

export const PUT = jsonRoute(async (request, { params }: Context) => {
  const viewer = await requireViewer(request.headers);
  const input = await readJson(request, approvalBandSchema);
  return updateApprovalBand(viewer, (await params).id, input);
});

export const DELETE = jsonRoute(async (request, { params }: Context) => {
  await removeApprovalBand(await requireViewer(request.headers), (await params).id);
  return new Response(null, { status: 204 });
});

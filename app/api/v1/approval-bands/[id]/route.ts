import { removeApprovalBand, updateApprovalBand } from "@/lib/server/approval-bands";
import { jsonRoute, recordRoute } from "@/lib/server/http";
import { requireViewer } from "@/lib/server/session";
import { approvalBandSchema } from "@/lib/validation/approvals";

type Context = { params: Promise<{ id: string }> };

export const PUT = recordRoute(approvalBandSchema, updateApprovalBand);

export const DELETE = jsonRoute(async (request, { params }: Context) => {
  await removeApprovalBand(await requireViewer(request.headers), (await params).id);
  return new Response(null, { status: 204 });
});

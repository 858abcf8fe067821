import { createApprovalBand, listApprovalBands } from "@/lib/server/approval-bands";
import { jsonRoute, readJson } from "@/lib/server/http";
import { requireViewer } from "@/lib/server/session";
import { approvalBandSchema } from "@/lib/validation/approvals";

export const GET = jsonRoute(async (request) => listApprovalBands(await requireViewer(request.headers)));

export const POST = jsonRoute(async (request) => {
  const viewer = await requireViewer(request.headers);
  const band = await createApprovalBand(viewer, await readJson(request, approvalBandSchema));
  return Response.json(band, { status: 201 });
});

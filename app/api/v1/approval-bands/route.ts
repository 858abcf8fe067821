import { createApprovalBand, listApprovalBands } from "@/lib/server/approval-bands";
import { createRoute, jsonRoute } from "@/lib/server/http";
import { requireViewer } from "@/lib/server/session";
import { approvalBandSchema } from "@/lib/validation/approvals";

export const GET = jsonRoute(async (request) => listApprovalBands(await requireViewer(request.headers)));

export const POST = createRoute(approvalBandSchema, createApprovalBand);

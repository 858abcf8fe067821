import { jsonRoute } from "@/lib/server/http";
import { requireViewer } from "@/lib/server/session";
import { listTenders } from "@/lib/server/tenders";

export const GET = jsonRoute(async (request) => listTenders(await requireViewer(request.headers)));

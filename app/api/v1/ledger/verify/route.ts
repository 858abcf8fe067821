import { jsonRoute } from "@/lib/server/http";
import { verifyTenderLedger, verifyWholeLedger } from "@/lib/server/ledger-verify";
import { requireViewer } from "@/lib/server/session";

/** Re-verifies the whole hash chain, or one tender's entries with ?tenderId=. */
export const GET = jsonRoute(async (request) => {
  const viewer = await requireViewer(request.headers);
  const tenderId = new URL(request.url).searchParams.get("tenderId");
  return tenderId ? verifyTenderLedger(viewer, tenderId) : verifyWholeLedger(viewer);
});

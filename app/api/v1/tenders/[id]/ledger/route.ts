import { jsonRoute, readQuery } from "@/lib/server/http";
import { readTenderLedger } from "@/lib/server/tender-ledger";
import { requireViewer } from "@/lib/server/session";
import { ledgerPageSchema } from "@/lib/validation/notices";

type Context = { params: Promise<{ id: string }> };

/** One page (?page=) of the tender's ledger, newest first, with the details the viewer may not read masked. */
export const GET = jsonRoute(async (request, { params }: Context) => {
  const viewer = await requireViewer(request.headers);
  return readTenderLedger(viewer, (await params).id, readQuery(request, ledgerPageSchema).page);
});

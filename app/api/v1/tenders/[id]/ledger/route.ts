import { jsonRoute } from "@/lib/server/http";
import { InputError } from "@/lib/server/errors";
import { readTenderLedger } from "@/lib/server/tender-ledger";
import { requireViewer } from "@/lib/server/session";
import { describeZodError, fieldErrorsOf } from "@/lib/validation/messages";
import { ledgerPageSchema } from "@/lib/validation/notices";

type Context = { params: Promise<{ id: string }> };

/** One page (?page=) of the tender's ledger, newest first, with the details the viewer may not read masked. */
export const GET = jsonRoute(async (request, { params }: Context) => {
  const viewer = await requireViewer(request.headers);
  const parsed = ledgerPageSchema.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!parsed.success) throw new InputError(describeZodError(parsed.error), fieldErrorsOf(parsed.error));
  return readTenderLedger(viewer, (await params).id, parsed.data.page);
});

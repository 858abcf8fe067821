import { InputError } from "@/lib/server/errors";
import { jsonRoute } from "@/lib/server/http";
import { getFullCheck, stepFullCheck } from "@/lib/server/ledger-full-check";
import { requireViewer } from "@/lib/server/session";
import { ledgerStepSchema } from "@/lib/validation/ledger";
import { describeZodError, fieldErrorsOf } from "@/lib/validation/messages";

type Context = { params: Promise<{ id: string }> };

/** How far a full check got, and its result once finished. */
export const GET = jsonRoute(async (request, { params }: Context) => getFullCheck(await requireViewer(request.headers), (await params).id));

/** Verifies the next batch of a running check (?entries= sets its size) and answers with its progress. */
export const POST = jsonRoute(async (request, { params }: Context) => {
  const viewer = await requireViewer(request.headers);
  const parsed = ledgerStepSchema.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!parsed.success) throw new InputError(describeZodError(parsed.error), fieldErrorsOf(parsed.error));
  return stepFullCheck(viewer, (await params).id, parsed.data.entries);
});

import { jsonRoute } from "@/lib/server/http";
import { InputError } from "@/lib/server/errors";
import { listClaimQueue } from "@/lib/server/review";
import { requireViewer } from "@/lib/server/session";
import { claimQueueSchema } from "@/lib/validation/review";
import { describeZodError, fieldErrorsOf } from "@/lib/validation/messages";

/** The Review bench queue: ?tenderId=&vendor=&verdict=&mark= (mark may be "unmarked"). */
export const GET = jsonRoute(async (request) => {
  const viewer = await requireViewer(request.headers);
  const parsed = claimQueueSchema.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!parsed.success) throw new InputError(describeZodError(parsed.error), fieldErrorsOf(parsed.error));
  return { claims: await listClaimQueue(viewer, parsed.data) };
});

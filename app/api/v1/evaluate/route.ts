import { z } from "zod";
import { evaluateClaims } from "@/lib/server/evaluate";
import { jsonRoute, readJson } from "@/lib/server/http";
import { requireViewer } from "@/lib/server/session";

// A batch of 1,000 claims is about 150 kB of JSON; 2 MB leaves room for generous formatting.
const MAX_BODY = 2_000_000;

export const POST = jsonRoute(async (request) => {
  const viewer = await requireViewer(request.headers);
  return evaluateClaims(viewer, await readJson(request, z.unknown(), MAX_BODY));
});

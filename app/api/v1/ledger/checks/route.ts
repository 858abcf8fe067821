import { jsonRoute } from "@/lib/server/http";
import { recentFullChecks, startFullCheck } from "@/lib/server/ledger-full-check";
import { requireViewer } from "@/lib/server/session";

/** The most recent full checks of the ledger (admin). */
export const GET = jsonRoute(async (request) => recentFullChecks(await requireViewer(request.headers)));

/** Starts a full check of every entry up to the current head; POST to its address runs it batch by batch. */
export const POST = jsonRoute(async (request) => Response.json(await startFullCheck(await requireViewer(request.headers)), { status: 201 }));

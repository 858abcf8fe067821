import { jsonRoute, recordRoute } from "@/lib/server/http";
import { createDeclaration, getDeclaration } from "@/lib/server/declarations";
import { requireViewer } from "@/lib/server/session";
import { declarationSchema } from "@/lib/validation/review";

type Context = { params: Promise<{ id: string }> };

/** The viewer's own declaration on the tender (null when none). */
export const GET = jsonRoute(async (request, { params }: Context) => ({
  declaration: await getDeclaration(await requireViewer(request.headers), (await params).id),
}));

export const POST = recordRoute(declarationSchema, createDeclaration, 201);

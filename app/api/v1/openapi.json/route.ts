import { openApiDocument } from "@/lib/openapi/document";

// Public: the description of the API is no secret; every route it lists checks its own access.
export function GET() {
  return Response.json(openApiDocument());
}

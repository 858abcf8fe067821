import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { openApiDocument } from "@/lib/openapi/document";

const apiRoot = path.resolve(import.meta.dirname, "../../app/api/v1");

/** Every (method, path) exported by a route file under app/api/v1, in OpenAPI form. */
function routesOnDisk(): string[] {
  const found: string[] = [];
  const walk = (dir: string) => {
    for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) walk(full);
      else if (entry.name === "route.ts") {
        const rel = path.relative(apiRoot, path.dirname(full)).split(path.sep).join("/");
        const apiPath = `/${rel}`.replace(/\[(\w+)\]/g, "{$1}");
        if (apiPath === "/openapi.json") continue;
        const source = fs.readFileSync(full, "utf8");
        for (const [, method] of source.matchAll(/export (?:const|async function|function) (GET|POST|PUT|PATCH|DELETE)\b/g)) {
          found.push(`${method.toLowerCase()} ${apiPath}`);
        }
      }
    }
  };
  walk(apiRoot);
  return found.sort();
}

describe("the OpenAPI document", () => {
  const doc = openApiDocument();
  const documented = Object.entries(doc.paths)
    .flatMap(([p, ops]) => Object.keys(ops).map((m) => `${m} ${p}`))
    .sort();

  it("describes every route handler under /api/v1, and nothing that does not exist", () => {
    expect(documented).toEqual(routesOnDisk());
  });

  it("takes request bodies from the zod schemas the handlers use", () => {
    const createTender = doc.paths["/tenders"].post as { requestBody: { content: Record<string, { schema: { properties: Record<string, unknown> } }> } };
    const props = createTender.requestBody.content["application/json"].schema.properties;
    expect(Object.keys(props)).toEqual(expect.arrayContaining(["title", "channelModel", "operatingPoints", "weights", "closesLocal", "closesZone"]));
    const evaluate = JSON.stringify(doc.paths["/evaluate"].post);
    expect(evaluate).toContain('"maxItems":1000');
    expect(evaluate).toContain("ncgDb");
  });

  it("is valid JSON with unique operation ids", () => {
    const ids = Object.values(doc.paths).flatMap((ops) => Object.values(ops).map((op) => (op as { operationId: string }).operationId));
    expect(new Set(ids).size).toBe(ids.length);
    expect(JSON.parse(JSON.stringify(doc)).openapi).toBe("3.1.0");
  });
});

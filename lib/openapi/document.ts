import { z, type ZodType } from "zod";
import { API_ROUTES, type ApiRoute } from "./routes";

// JSON Schema straight from the zod schemas the handlers parse with, so nothing is written twice.
const schemaOf = (schema: ZodType) => z.toJSONSchema(schema, { io: "input", unrepresentable: "any" });

const errorBody = {
  type: "object",
  properties: { error: { type: "string" }, fieldErrors: { type: "object", additionalProperties: { type: "array", items: { type: "string" } } } },
  required: ["error"],
};
const errorResponse = (description: string) => ({ description, content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } } });

function operation(route: ApiRoute) {
  const params = [...route.path.matchAll(/\{(\w+)\}/g)].map(([, name]) => ({ name, in: "path", required: true, schema: { type: "string" } }));
  const query = route.query
    ? Object.entries((schemaOf(route.query) as { properties?: Record<string, unknown> }).properties ?? {}).map(([name, schema]) => ({
        name,
        in: "query",
        required: false,
        schema,
      }))
    : [];
  const content: Record<string, unknown> = {};
  if (route.body) content["application/json"] = { schema: schemaOf(route.body) };
  if (route.upload) {
    content["multipart/form-data"] = {
      schema: {
        type: "object",
        properties: Object.fromEntries(
          Object.entries(route.upload).map(([k, d]) => [k, { type: "string", format: k === "file" ? "binary" : undefined, description: d }]),
        ),
      },
    };
  }
  const success = route.produces
    ? { description: "The file", content: { [route.produces]: { schema: { type: "string", format: "binary" } } } }
    : { description: "Success", content: { "application/json": { schema: route.response ? schemaOf(route.response) : { type: "object" } } } };
  return {
    tags: [route.tag],
    summary: route.summary,
    operationId: `${route.method}${route.path.replace(/\{(\w+)\}/g, "By-$1").replace(/[^a-zA-Z0-9]+(.)?/g, (_, c: string) => (c ? c.toUpperCase() : ""))}`,
    parameters: [...params, ...query],
    ...(Object.keys(content).length ? { requestBody: { required: true, content } } : {}),
    security: route.public ? [] : [{ session: [] }],
    responses: {
      [route.created ? "201" : "200"]: success,
      "400": errorResponse("Bad input: the message names the field"),
      ...(route.public ? {} : { "401": errorResponse("Signed out"), "403": errorResponse("Not allowed for this person") }),
      "404": errorResponse("Not found, or not visible to this person"),
      "409": errorResponse("Not possible in the current state"),
      ...(Object.keys(content).length
        ? { "413": errorResponse("The body is larger than the route accepts"), "415": errorResponse("The body is not of a type the route accepts") }
        : {}),
    },
  };
}

/** The OpenAPI 3.1 document of /api/v1. */
export function openApiDocument(serverUrl = "/api/v1") {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const route of API_ROUTES) (paths[route.path] ??= {})[route.method] = operation(route);
  return {
    openapi: "3.1.0",
    info: {
      title: "Ratecourt API",
      version: "1.0.0",
      description:
        "Tenders for radio modules with every coding claim judged against the limits of channel coding. Sign in through /api/auth/sign-in/email; send the session cookie, and with every write an Origin header equal to the app's address (403 otherwise).",
    },
    servers: [{ url: serverUrl }],
    components: {
      securitySchemes: { session: { type: "apiKey", in: "cookie", name: "better-auth.session_token" } },
      schemas: { Error: errorBody },
    },
    paths,
  };
}

import "server-only";
import type { ZodType } from "zod";
import { ForbiddenError as CaslForbidden } from "@casl/ability";
import { describeZodError, fieldErrorsOf } from "@/lib/validation/messages";
import { AppError, InputError } from "./errors";

export const MAX_JSON_BYTES = 1_000_000;

/** Reads a JSON body with a size cap and a schema; every failure is a typed 400 or 413. */
export async function readJson<T>(request: Request, schema: ZodType<T>, maxBytes = MAX_JSON_BYTES): Promise<T> {
  const declared = Number(request.headers.get("content-length") ?? 0);
  if (declared > maxBytes) throw new AppError(`The request body is larger than ${maxBytes} bytes.`, 413);
  const text = await request.text();
  if (Buffer.byteLength(text) > maxBytes) throw new AppError(`The request body is larger than ${maxBytes} bytes.`, 413);
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw new InputError("The request body is not valid JSON.");
  }
  const parsed = schema.safeParse(raw);
  if (!parsed.success) throw new InputError(describeZodError(parsed.error), fieldErrorsOf(parsed.error));
  return parsed.data;
}

export function errorResponse(error: unknown): Response {
  if (error instanceof AppError) {
    return Response.json({ error: error.message, fieldErrors: error.fieldErrors }, { status: error.status });
  }
  if (error instanceof CaslForbidden) return Response.json({ error: error.message }, { status: 403 });
  console.error(error);
  return Response.json({ error: "Something went wrong on the server." }, { status: 500 });
}

type Handler<C> = (request: Request, context: C) => Promise<unknown>;

/** Wraps a route handler: JSON out, typed errors mapped to their statuses. */
export function jsonRoute<C>(handler: Handler<C>) {
  return async (request: Request, context: C): Promise<Response> => {
    try {
      const result = await handler(request, context);
      return result instanceof Response ? result : Response.json(result);
    } catch (error) {
      return errorResponse(error);
    }
  };
}

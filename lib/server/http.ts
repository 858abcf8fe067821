import "server-only";
import type { ZodType } from "zod";
import { ForbiddenError as CaslForbidden } from "@casl/ability";
import { describeZodError, fieldErrorsOf } from "@/lib/validation/messages";
import { BAD_TEXT_MESSAGE, findBadText, isCleanParam, isCleanText } from "@/lib/validation/text";
import { AppError, ForbiddenError, InputError } from "./errors";
import { crossSiteRefusal } from "./origin";
import { requireViewer, type Viewer } from "./session";

export const MAX_JSON_BYTES = 1_000_000;

const tooLarge = (maxBytes: number) => new AppError(`The request body is larger than ${maxBytes} bytes.`, 413);
const mediaType = (request: Request) => (request.headers.get("content-type") ?? "").split(";")[0].trim().toLowerCase();
const isJsonType = (type: string) => type === "application/json" || /^application\/[\w.+-]+\+json$/.test(type);
export const isMultipart = (request: Request) => mediaType(request) === "multipart/form-data";

/** The body's bytes, counted while they arrive: a body past the cap is refused whatever Content-Length said (or did not say). */
export async function readBodyBytes(request: Request, maxBytes: number, tooLargeError = tooLarge(maxBytes)): Promise<Uint8Array<ArrayBuffer>> {
  if (Number(request.headers.get("content-length") ?? 0) > maxBytes) throw tooLargeError;
  if (!request.body) return new Uint8Array(0);
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw tooLargeError;
    }
    chunks.push(value);
  }
  return new Uint8Array(Buffer.concat(chunks));
}

/** Reads a JSON body with a size cap and a schema; every failure is a typed 400, 413 or 415. */
export async function readJson<T>(request: Request, schema: ZodType<T>, maxBytes = MAX_JSON_BYTES): Promise<T> {
  if (!isJsonType(mediaType(request))) throw new AppError('Send the body as JSON, with "Content-Type: application/json".', 415);
  const text = new TextDecoder().decode(await readBodyBytes(request, maxBytes));
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw new InputError("The request body is not valid JSON.");
  }
  const bad = findBadText(raw);
  if (bad) throw new InputError(`${bad === "_" ? "The body" : bad} ${BAD_TEXT_MESSAGE}`, { [bad]: [BAD_TEXT_MESSAGE] });
  const parsed = schema.safeParse(raw);
  if (!parsed.success) throw new InputError(describeZodError(parsed.error), fieldErrorsOf(parsed.error));
  return parsed.data;
}

/** Reads a multipart form with the same cap while reading; only the upload routes call it. */
/** The query string parsed by a zod schema; a bad value is a 400 that names the parameter and says what it takes. */
export function readQuery<T>(request: Request, schema: ZodType<T>): T {
  const parsed = schema.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!parsed.success) throw new InputError(describeZodError(parsed.error), fieldErrorsOf(parsed.error));
  return parsed.data;
}

export async function readForm(request: Request, maxBytes: number, tooLargeError = tooLarge(maxBytes)): Promise<FormData> {
  const bytes = await readBodyBytes(request, maxBytes, tooLargeError);
  try {
    return await new Response(bytes, { headers: { "content-type": request.headers.get("content-type") ?? "" } }).formData();
  } catch {
    throw new InputError("The upload could not be read as multipart/form-data.");
  }
}

/** The one file of a form field: none or several are refused, never silently dropped. */
export function singleFile(form: FormData, field: string, missing: string): File {
  const files = form.getAll(field);
  if (files.length > 1) throw new InputError(`Send one file per upload; this one had ${files.length} in "${field}".`, { [field]: ["One file at a time."] });
  const [file] = files;
  if (!(file instanceof File)) throw new InputError(missing, { [field]: [missing] });
  return file;
}

export function errorResponse(error: unknown): Response {
  if (error instanceof AppError) {
    return Response.json({ error: error.message, fieldErrors: error.fieldErrors }, { status: error.status });
  }
  if (error instanceof CaslForbidden) return Response.json({ error: error.message }, { status: 403 });
  console.error(error);
  return Response.json({ error: "Something went wrong on the server." }, { status: 500 });
}

/** Every check a request passes before its handler runs: where it came from, what it sends, clean URL values. */
async function checkRequest(request: Request, context: unknown): Promise<void> {
  const refusal = crossSiteRefusal(request.method, request.headers);
  if (refusal) throw new ForbiddenError(refusal);
  const type = mediaType(request);
  if (type && !isJsonType(type) && type !== "multipart/form-data") {
    throw new AppError(`Bodies of type ${type.slice(0, 80)} are not accepted; send JSON with "Content-Type: application/json".`, 415);
  }
  const params = context && typeof context === "object" && "params" in context ? await (context as { params: unknown }).params : {};
  const ids = Object.values(params ?? {}).flat();
  if (ids.some((id) => typeof id === "string" && !isCleanParam(id)) || ![...new URL(request.url).searchParams.values()].every(isCleanText)) {
    throw new InputError(`An id or parameter in the address ${BAD_TEXT_MESSAGE}`);
  }
}

type Handler<C> = (request: Request, context: C) => Promise<unknown>;

/** Wraps a route handler: the request checks, JSON out, typed errors mapped to their statuses. */
export function jsonRoute<C>(handler: Handler<C>) {
  return async (request: Request, context: C): Promise<Response> => {
    try {
      await checkRequest(request, context);
      const result = await handler(request, context);
      return result instanceof Response ? result : Response.json(result);
    } catch (error) {
      return errorResponse(error);
    }
  };
}

/** The context of a route under one record: the `[id]` of its folder. */
export type IdContext = { params: Promise<{ id: string }> };

/** A POST that makes one thing from a JSON body: the signed-in viewer first, then the body read by `schema`; 201 with what was made. */
export function createRoute<T>(schema: ZodType<T>, create: (viewer: Viewer, input: T) => Promise<unknown>) {
  return jsonRoute(async (request: Request) => {
    const viewer = await requireViewer(request.headers);
    const input = await readJson(request, schema);
    return Response.json(await create(viewer, input), { status: 201 });
  });
}

/** A write from a JSON body to the record in the address (`[id]`), the same way: `status` with what `act` returns. */
export function recordRoute<T>(schema: ZodType<T>, act: (viewer: Viewer, id: string, input: T) => Promise<unknown>, status = 200) {
  return jsonRoute(async (request: Request, { params }: IdContext) => {
    const viewer = await requireViewer(request.headers);
    const input = await readJson(request, schema);
    return Response.json(await act(viewer, (await params).id, input), { status });
  });
}

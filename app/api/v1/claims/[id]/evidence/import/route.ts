import { AppError, InputError } from "@/lib/server/errors";
import { jsonRoute, MAX_JSON_BYTES, readJson } from "@/lib/server/http";
import { importEvidence } from "@/lib/server/evidence";
import { requireViewer } from "@/lib/server/session";
import { evidenceImportSchema } from "@/lib/validation/review";

/** The CSV as a multipart "file" field, or as JSON { csv }. */
async function readCsv(request: Request): Promise<string> {
  if (!(request.headers.get("content-type") ?? "").startsWith("multipart/form-data")) {
    return (await readJson(request, evidenceImportSchema)).csv;
  }
  if (Number(request.headers.get("content-length") ?? 0) > MAX_JSON_BYTES) throw new AppError("The file is larger than 1 MB.", 413);
  const form = await request.formData().catch(() => null);
  const file = form?.get("file");
  if (!file || typeof file === "string") throw new InputError("Attach the CSV file as the field \"file\".", { file: ["Choose a CSV file."] });
  if (file.size > MAX_JSON_BYTES) throw new AppError("The file is larger than 1 MB.", 413);
  const parsed = evidenceImportSchema.safeParse({ csv: await file.text() });
  if (!parsed.success) throw new InputError("The file is empty.", { file: ["The file is empty."] });
  return parsed.data.csv;
}

/** 201 when rows were stored (the rejected ones listed), 422 when no row could be stored. */
export const POST = jsonRoute(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const viewer = await requireViewer(request.headers);
  const csv = await readCsv(request);
  const outcome = await importEvidence(viewer, (await params).id, csv);
  if (outcome.stored.length === 0) {
    return Response.json({ error: "No row of the file could be stored.", ...outcome }, { status: 422 });
  }
  return Response.json(outcome, { status: 201 });
});

import { AppError, InputError } from "@/lib/server/errors";
import { isMultipart, jsonRoute, MAX_JSON_BYTES, readForm, readJson, singleFile } from "@/lib/server/http";
import { importEvidence } from "@/lib/server/evidence";
import { requireViewer } from "@/lib/server/session";
import { evidenceImportSchema } from "@/lib/validation/review";
import { BAD_TEXT_MESSAGE, isCleanText } from "@/lib/validation/text";

const TOO_LARGE = "The file is larger than 1 MB.";

/** The CSV as a multipart "file" field (with "preview" set to "true" for a preview), or as JSON { csv, preview }. */
async function readCsv(request: Request): Promise<{ csv: string; preview: boolean }> {
  if (!isMultipart(request)) return readJson(request, evidenceImportSchema);
  const form = await readForm(request, MAX_JSON_BYTES + 65_536, new AppError(TOO_LARGE, 413));
  const file = singleFile(form, "file", 'Attach the CSV file as the field "file".');
  if (file.size > MAX_JSON_BYTES) throw new AppError(TOO_LARGE, 413);
  const parsed = evidenceImportSchema.safeParse({ csv: await file.text(), preview: form.get("preview") === "true" });
  if (!parsed.success) throw new InputError("The file is empty.", { file: ["The file is empty."] });
  if (!isCleanText(parsed.data.csv)) throw new InputError(`The file ${BAD_TEXT_MESSAGE}`, { file: [BAD_TEXT_MESSAGE] });
  return parsed.data;
}

/** A preview answers 200 with every row's outcome; an import 201 when rows were stored (the rejected ones listed), 422 when none could be. */
export const POST = jsonRoute(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const viewer = await requireViewer(request.headers);
  const { csv, preview } = await readCsv(request);
  const outcome = await importEvidence(viewer, (await params).id, csv, { preview });
  if (preview) return Response.json(outcome, { status: 200 });
  if (outcome.stored.length === 0) {
    return Response.json({ error: "No row of the file could be stored.", ...outcome }, { status: 422 });
  }
  return Response.json(outcome, { status: 201 });
});

import { jsonRoute, readJson } from "@/lib/server/http";
import { InputError } from "@/lib/server/errors";
import { checkMemo } from "@/lib/server/memos";
import { getViewer } from "@/lib/server/session";
import { fingerprintSchema, MAX_MEMO_BYTES } from "@/lib/validation/approvals";

const TOO_LARGE = "The file is larger than 20 MB; an award memo is far smaller.";

/** A memo file (multipart field "file") or a pasted fingerprint (JSON { sha256 }). */
async function readInput(request: Request): Promise<{ bytes: Uint8Array } | { sha256: string }> {
  const type = request.headers.get("content-type") ?? "";
  if (!type.startsWith("multipart/form-data")) return readJson(request, fingerprintSchema);
  if (Number(request.headers.get("content-length") ?? 0) > MAX_MEMO_BYTES + 65_536) throw new InputError(TOO_LARGE, { file: [TOO_LARGE] });
  const form = await request.formData().catch(() => {
    throw new InputError("The upload could not be read as a form.");
  });
  const file = form.get("file");
  if (!(file instanceof Blob)) throw new InputError('Attach the memo as the form field "file".', { file: ["Choose a file."] });
  if (file.size === 0) throw new InputError("The file is empty.", { file: ["The file is empty."] });
  if (file.size > MAX_MEMO_BYTES) throw new InputError(TOO_LARGE, { file: [TOO_LARGE] });
  return { bytes: new Uint8Array(await file.arrayBuffer()) };
}

/** Public: anyone may check a memo, signed in or not. */
export const POST = jsonRoute(async (request) => {
  const input = await readInput(request);
  return checkMemo(await getViewer(request.headers), input);
});

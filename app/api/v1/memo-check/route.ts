import { isMultipart, jsonRoute, readForm, readJson, singleFile } from "@/lib/server/http";
import { InputError } from "@/lib/server/errors";
import { checkMemo } from "@/lib/server/memos";
import { getViewer } from "@/lib/server/session";
import { fingerprintSchema, MAX_MEMO_BYTES } from "@/lib/validation/approvals";

const TOO_LARGE = "The file is larger than 20 MB; an award memo is far smaller.";

/** A memo file (multipart field "file") or a pasted fingerprint (JSON { sha256 }). */
async function readInput(request: Request): Promise<{ bytes: Uint8Array } | { sha256: string }> {
  if (!isMultipart(request)) return readJson(request, fingerprintSchema);
  const form = await readForm(request, MAX_MEMO_BYTES + 65_536, new InputError(TOO_LARGE, { file: [TOO_LARGE] }));
  const file = singleFile(form, "file", 'Attach the memo as the form field "file".');
  if (file.size === 0) throw new InputError("The file is empty.", { file: ["The file is empty."] });
  if (file.size > MAX_MEMO_BYTES) throw new InputError(TOO_LARGE, { file: [TOO_LARGE] });
  return { bytes: new Uint8Array(await file.arrayBuffer()) };
}

/** Public: anyone may check a memo, signed in or not. */
export const POST = jsonRoute(async (request) => {
  const input = await readInput(request);
  return checkMemo(await getViewer(request.headers), input);
});

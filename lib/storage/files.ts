import { createHash } from "node:crypto";

// Pure helpers for uploaded files: no I/O besides hashing.

export const MAX_UPLOAD_BYTES = 20 * 1024 * 1024;

const MAX_FILE_NAME_LENGTH = 120;
const FALLBACK_FILE_NAME = "file";

export type ExecutableKind = "elf" | "pe" | "mach-o" | "script" | "zip";

const SIGNATURES: { kind: ExecutableKind; bytes: number[] }[] = [
  { kind: "elf", bytes: [0x7f, 0x45, 0x4c, 0x46] },
  { kind: "pe", bytes: [0x4d, 0x5a] }, // "MZ", DOS header of every Windows executable
  { kind: "mach-o", bytes: [0xfe, 0xed, 0xfa, 0xce] },
  { kind: "mach-o", bytes: [0xfe, 0xed, 0xfa, 0xcf] },
  { kind: "mach-o", bytes: [0xce, 0xfa, 0xed, 0xfe] },
  { kind: "mach-o", bytes: [0xcf, 0xfa, 0xed, 0xfe] },
  { kind: "mach-o", bytes: [0xca, 0xfe, 0xba, 0xbe] }, // universal binary (also Java class files)
  { kind: "script", bytes: [0x23, 0x21] }, // "#!"
  { kind: "zip", bytes: [0x50, 0x4b, 0x03, 0x04] },
  { kind: "zip", bytes: [0x50, 0x4b, 0x05, 0x06] },
  { kind: "zip", bytes: [0x50, 0x4b, 0x07, 0x08] },
];

const PDF_MAGIC = [0x25, 0x50, 0x44, 0x46, 0x2d]; // "%PDF-"

function startsWith(bytes: Uint8Array, prefix: number[]): boolean {
  return bytes.length >= prefix.length && prefix.every((byte, index) => bytes[index] === byte);
}

/** Names the executable or archive format the bytes start with, or null. */
export function detectExecutable(bytes: Uint8Array): ExecutableKind | null {
  return SIGNATURES.find((signature) => startsWith(bytes, signature.bytes))?.kind ?? null;
}

/** True only for bytes that begin with "%PDF-"; the file name and declared type are not trusted. */
export function sniffPdf(bytes: Uint8Array): boolean {
  return detectExecutable(bytes) === null && startsWith(bytes, PDF_MAGIC);
}

export type PdfUploadCheck =
  { ok: true } | { ok: false; reason: "empty" | "too-large" | "not-pdf" } | { ok: false; reason: "executable"; kind: ExecutableKind };

/** The whole gate for an uploaded PDF, so route handlers can map each reason to a message. */
export function checkPdfUpload(bytes: Uint8Array): PdfUploadCheck {
  if (bytes.length === 0) return { ok: false, reason: "empty" };
  if (bytes.length > MAX_UPLOAD_BYTES) return { ok: false, reason: "too-large" };
  const kind = detectExecutable(bytes);
  if (kind) return { ok: false, reason: "executable", kind };
  return sniffPdf(bytes) ? { ok: true } : { ok: false, reason: "not-pdf" };
}

// Control and format characters (including bidirectional overrides that can disguise
// "report\u202Efdp.exe" as "reportexe.pdf") are removed outright.
const INVISIBLE = /[\p{Cc}\p{Cf}\p{Zl}\p{Zp}]/gu;
// Letters and digits of any script, marks, and a few punctuation characters survive.
const UNSAFE = /[^\p{L}\p{M}\p{N} ._\-()+,]/gu;
const WINDOWS_RESERVED = /^(con|prn|aux|nul|com\d|lpt\d)$/i;

function truncate(name: string): string {
  const chars = Array.from(name);
  if (chars.length <= MAX_FILE_NAME_LENGTH) return name;
  const dot = name.lastIndexOf(".");
  const extension = dot > 0 ? Array.from(name.slice(dot)) : [];
  if (extension.length === 0 || extension.length > 16) {
    return chars.slice(0, MAX_FILE_NAME_LENGTH).join("");
  }
  const stem = Array.from(name.slice(0, dot)).slice(0, MAX_FILE_NAME_LENGTH - extension.length);
  return stem.join("").trimEnd() + extension.join("");
}

/**
 * A display and download name that is safe to store and send back in a header: no folders,
 * no control characters, no leading dots, at most 120 characters, never empty.
 */
export function sanitizeFileName(name: string): string {
  const lastSegment =
    name
      .split(/[/\\]/)
      .filter((part) => part.length > 0)
      .pop() ?? "";
  const cleaned = lastSegment
    .normalize("NFC")
    .replace(INVISIBLE, "")
    .replace(UNSAFE, "_")
    .replace(/\s+/g, " ")
    .replace(/_{2,}/g, "_")
    .replace(/^[\s.]+/, "")
    .replace(/[\s.]+$/, "");
  const stem = cleaned.split(".")[0] ?? "";
  const safe = WINDOWS_RESERVED.test(stem) ? `_${cleaned}` : cleaned;
  return truncate(safe) || FALLBACK_FILE_NAME;
}

export function sha256Hex(bytes: Uint8Array | string): string {
  return createHash("sha256").update(bytes).digest("hex");
}

/**
 * The download name of an uploaded PDF: the sanitized name with its last extension, whatever it
 * was, replaced by ".pdf" ("setup.exe" -> "setup.pdf", "x.pdf.exe" -> "x.pdf"), so a saved copy
 * always opens as what the server checked it to be.
 */
export function pdfFileName(name: string): string {
  const safe = sanitizeFileName(name);
  const stem = safe === FALLBACK_FILE_NAME ? "document" : safe.replace(/\.[^.]*$/, "").replace(/\.pdf$/i, "");
  return sanitizeFileName(`${stem || "document"}.pdf`);
}

import { mkdirSync, readFileSync, renameSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { localEndpoints } from "../runtime/local-endpoints";
import { pageInfo, pageWindow, type PageInfo, type PagingInput } from "../validation/paging";

// Mail the local fake SMTP server received; the Mailroom page (development only) lists it.
export type CapturedMail = {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  /** ISO 8601, so the same shape survives the file backend and props to client components. */
  receivedAt: string;
};

export const MAX_CAPTURED_MAIL = 500;

// Next.js can load this module twice in one process; one list must serve both copies.
const STORE_KEY = Symbol.for("ratecourt.mail.captured");
type Store = { messages: CapturedMail[] };

function memoryStore(): Store {
  const holder = globalThis as typeof globalThis & { [STORE_KEY]?: Store };
  holder[STORE_KEY] ??= { messages: [] };
  return holder[STORE_KEY];
}

/** The data folder's mailroom file while the local SMTP fake runs (it survives restarts), else memory. */
function captureFile(): string | undefined {
  return localEndpoints().mailCaptureFile;
}

function readFromFile(file: string): CapturedMail[] {
  try {
    const parsed: unknown = JSON.parse(readFileSync(file, "utf8"));
    return Array.isArray(parsed) ? (parsed as CapturedMail[]) : [];
  } catch {
    // Missing or half-written file: an empty mailroom is the honest answer.
    return [];
  }
}

function writeToFile(file: string, messages: CapturedMail[]): void {
  mkdirSync(path.dirname(file), { recursive: true });
  const temporary = `${file}.${process.pid}.tmp`;
  writeFileSync(temporary, JSON.stringify(messages));
  renameSync(temporary, file);
}

/** Oldest first, as stored. */
function readAll(): CapturedMail[] {
  const file = captureFile();
  return file ? readFromFile(file) : memoryStore().messages;
}

export function recordCapturedMail(message: CapturedMail): void {
  const file = captureFile();
  const messages = [...readAll(), message].slice(-MAX_CAPTURED_MAIL);
  if (file) writeToFile(file, messages);
  else memoryStore().messages = messages;
}

/** Newest first. Returns copies: callers cannot change the store by accident. */
export function listCapturedMail(): CapturedMail[] {
  return readAll()
    .map((message) => ({ ...message, to: [...message.to] }))
    .reverse();
}

export function getCapturedMail(id: string): CapturedMail | undefined {
  return listCapturedMail().find((message) => message.id === id);
}

export function clearCapturedMail(): void {
  const file = captureFile();
  if (file) rmSync(file, { force: true });
  memoryStore().messages = [];
}

/** One page of the captured mail, newest first, to a recipient containing `to` and with `subject` in its subject. */
export function findCapturedMail(query: { to?: string; subject?: string } & PagingInput): { mail: CapturedMail[] } & PageInfo {
  const to = query.to?.toLowerCase();
  const subject = query.subject?.toLowerCase();
  const matching = listCapturedMail().filter(
    (m) => (!to || m.to.some((address) => address.toLowerCase().includes(to))) && (!subject || m.subject.toLowerCase().includes(subject)),
  );
  const window = pageWindow(matching.length, query);
  return { mail: matching.slice(window.offset, window.offset + window.pageSize), ...pageInfo(window) };
}

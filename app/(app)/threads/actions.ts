"use server";

import { closeThreadSchema, messageSchema } from "@/lib/validation/review";
import { closeThread, postMessage } from "@/lib/server/threads";
import { runForm, type FormResult } from "@/lib/server/form-action";

/** A message in a clarification thread, from either side; the page it was sent from is refreshed. */
export async function postMessageAction(threadId: string, path: string, values: unknown): Promise<FormResult> {
  return runForm(messageSchema, values, (viewer, input) => postMessage(viewer, String(threadId), input), [String(path), "/threads"], "Message sent.", {
    threadId,
    path,
  });
}

/** Closes a question with a reason; the page it was closed from is refreshed. */
export async function closeThreadAction(threadId: string, path: string, values: unknown): Promise<FormResult> {
  return runForm(closeThreadSchema, values, (viewer, input) => closeThread(viewer, String(threadId), input), [String(path), "/threads"], "Question closed.", {
    threadId,
    path,
  });
}

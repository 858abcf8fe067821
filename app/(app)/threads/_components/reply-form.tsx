"use client";

import { messageSchema } from "@/lib/validation/review";
import { FieldError, FormStatus } from "@/app/_components/form-status";
import { useActionForm } from "@/app/_components/use-action-form";
import { postMessageAction } from "../actions";

export function ReplyForm({ threadId, path, subject }: { threadId: string; path: string; subject: string }) {
  const { register, formState, submit, result, pending } = useActionForm({
    schema: messageSchema,
    defaultValues: { body: "" },
    send: (values) => postMessageAction(threadId, path, values),
    resetOnSuccess: true,
  });
  const id = `reply-${threadId}`;
  return (
    <form onSubmit={submit} aria-label={`Reply: ${subject}`} className="mt-3 space-y-2" noValidate>
      <label className="label" htmlFor={id}>
        Reply
      </label>
      <textarea id={id} rows={2} className="field" {...register("body")} />
      <FieldError message={formState.errors.body?.message} />
      <FormStatus result={result} />
      <button type="submit" className="btn-quiet" disabled={pending}>
        {pending ? "Sending…" : "Send reply"}
      </button>
    </form>
  );
}

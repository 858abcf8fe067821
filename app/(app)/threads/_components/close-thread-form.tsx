"use client";

import { closeThreadSchema } from "@/lib/validation/review";
import { FieldError, FormStatus } from "@/app/_components/form-status";
import { useActionForm } from "@/app/_components/use-action-form";
import { closeThreadAction } from "../actions";

/** An evaluator closes a question that needs no answer, with the reason the vendor and the ledger read. */
export function CloseThreadForm({ threadId, path, subject }: { threadId: string; path: string; subject: string }) {
  const { register, formState, submit, result, pending } = useActionForm({
    schema: closeThreadSchema,
    defaultValues: { reason: "" },
    send: (values) => closeThreadAction(threadId, path, values),
  });
  const id = `close-${threadId}`;
  return (
    <details className="mt-2">
      <summary className="cursor-pointer text-xs text-accent">Close this question with a reason</summary>
      <form onSubmit={submit} aria-label={`Close: ${subject}`} className="mt-2 space-y-2" noValidate>
        <label className="label" htmlFor={id}>
          Reason for closing
        </label>
        <textarea id={id} rows={2} className="field" {...register("reason")} />
        <FieldError message={formState.errors.reason?.message} />
        <FormStatus result={result} />
        <button type="submit" className="btn-quiet" disabled={pending}>
          {pending ? "Closing…" : "Close the question"}
        </button>
      </form>
    </details>
  );
}

"use client";

import { threadSchema } from "@/lib/validation/review";
import { openThreadAction } from "@/app/(app)/review/actions";
import { FieldError, FormStatus } from "@/app/_components/form-status";
import { useActionForm } from "@/app/_components/use-action-form";

/** A question to the vendor without changing the claim's mark. */
export function OpenThreadForm({ claimId }: { claimId: string }) {
  const { register, formState, submit, result, pending } = useActionForm({
    schema: threadSchema,
    defaultValues: { subject: "", body: "" },
    send: (values) => openThreadAction(claimId, values),
    resetOnSuccess: true,
  });
  return (
    <details className="border-t border-ink-faint/20 pt-3 print:hidden">
      <summary className="cursor-pointer text-sm text-accent">Ask the vendor a question</summary>
      <form onSubmit={submit} aria-label="Ask the vendor" className="mt-2 space-y-2" noValidate>
        <div>
          <label className="label" htmlFor="thread-subject">
            Subject
          </label>
          <input id="thread-subject" className="field" {...register("subject")} />
          <FieldError message={formState.errors.subject?.message} />
        </div>
        <div>
          <label className="label" htmlFor="thread-body">
            Question
          </label>
          <textarea id="thread-body" rows={3} className="field" {...register("body")} />
          <FieldError message={formState.errors.body?.message} />
        </div>
        <FormStatus result={result} />
        <button type="submit" className="btn-quiet" disabled={pending}>
          Send question
        </button>
      </form>
    </details>
  );
}

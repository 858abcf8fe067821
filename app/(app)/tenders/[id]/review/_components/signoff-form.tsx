"use client";

import { signoffSchema } from "@/lib/validation/review";
import { FieldError, FormStatus } from "@/app/_components/form-status";
import { useActionForm } from "@/app/_components/use-action-form";
import { signoffAction } from "../actions";

export function SignoffForm({ tenderId }: { tenderId: string }) {
  const consequences =
    "The claims' marks are final and the tender moves to commercial evaluation, where the buyer can open the price envelopes. Your name, the time and the statement go into the ledger; this cannot be undone.";
  const { register, formState, submit, result, pending, dialog } = useActionForm({
    schema: signoffSchema,
    defaultValues: { statement: "" },
    send: (values) => signoffAction(tenderId, values),
    confirm: { title: "Sign the technical evaluation?", consequences, action: "Sign" },
  });
  return (
    <form onSubmit={submit} aria-label="Sign the technical evaluation" className="space-y-2" noValidate>
      <label className="label" htmlFor="signoff-statement">
        Statement
      </label>
      <textarea
        id="signoff-statement"
        rows={3}
        className="field"
        placeholder="Every claim was reviewed against the bounds and the lab evidence."
        {...register("statement")}
      />
      <FieldError message={formState.errors.statement?.message} />
      <FormStatus result={result} />
      <button type="submit" className="btn" disabled={pending}>
        {pending ? "Signing…" : "Sign the technical evaluation"}
      </button>
      {dialog}
    </form>
  );
}

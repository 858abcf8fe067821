"use client";

import { useState, useTransition } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { signoffSchema, type SignoffInput } from "@/lib/validation/review";
import type { FormResult } from "@/lib/server/form-action";
import { useConfirm } from "@/app/_components/confirm";
import { FieldError, FormStatus } from "@/app/_components/form-status";
import { signoffAction } from "../actions";

export function SignoffForm({ tenderId }: { tenderId: string }) {
  const [result, setResult] = useState<FormResult>({});
  const [pending, startTransition] = useTransition();
  const { register, handleSubmit, formState } = useForm<SignoffInput>({ resolver: zodResolver(signoffSchema), defaultValues: { statement: "" } });
  const confirm = useConfirm();
  const consequences =
    "The claims' marks are final and the tender moves to commercial evaluation, where the buyer can open the price envelopes. Your name, the time and the statement go into the ledger; this cannot be undone.";
  const submit = handleSubmit((values) =>
    confirm.ask({ title: "Sign the technical evaluation?", consequences, action: "Sign" }, () =>
      startTransition(async () => setResult(await signoffAction(tenderId, values))),
    ),
  );
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
      {confirm.dialog}
    </form>
  );
}

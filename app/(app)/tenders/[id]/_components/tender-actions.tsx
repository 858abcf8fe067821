"use client";

import { useState, useTransition } from "react";
import { useConfirm } from "@/app/_components/confirm";
import { FormStatus } from "@/app/_components/form-status";
import { useActionForm } from "@/app/_components/use-action-form";
import { cancelTenderSchema } from "@/lib/validation/tender";
import { cancelTenderAction, openTenderAction, type TenderFormResult } from "../../actions";

/** Draft -> open, after a confirmation. The server checks again and says what is missing. */
export function OpenTenderButton({ tenderId }: { tenderId: string }) {
  const [result, setResult] = useState<TenderFormResult>({});
  const [pending, startTransition] = useTransition();
  const confirm = useConfirm();
  const open = () => startTransition(async () => setResult(await openTenderAction(tenderId)));
  const consequences =
    "The invited vendors are e-mailed at once and can send offers until the closing time. The requirements, operating points and weights lock for good; this cannot be undone.";
  return (
    <div className="space-y-2">
      <button
        type="button"
        className="btn"
        disabled={pending}
        onClick={() => confirm.ask({ title: "Open this tender for offers?", consequences, action: "Open the tender" }, open)}
      >
        {pending ? "Opening…" : "Open tender"}
      </button>
      <FormStatus result={result} />
      {confirm.dialog}
    </div>
  );
}

/** Cancelling needs a reason; the invited vendors and the buyers are told it. */
export function CancelTenderForm({ tenderId }: { tenderId: string }) {
  const { register, formState, submit, result, pending } = useActionForm({
    schema: cancelTenderSchema,
    defaultValues: { reason: "" },
    send: (values) => cancelTenderAction(tenderId, values),
  });
  const error = formState.errors.reason?.message;
  return (
    <form onSubmit={submit} className="space-y-2" aria-label="Cancel tender" noValidate>
      <label className="label" htmlFor="cancel-reason">
        Reason for cancelling
      </label>
      <textarea id="cancel-reason" rows={2} className="field" aria-invalid={Boolean(error)} aria-describedby="cancel-reason-error" {...register("reason")} />
      {error ? (
        <p id="cancel-reason-error" className="text-xs text-verdict-impossible">
          {error}
        </p>
      ) : null}
      <button type="submit" className="btn-quiet" disabled={pending}>
        {pending ? "Cancelling…" : "Cancel tender"}
      </button>
      <FormStatus result={result} />
    </form>
  );
}

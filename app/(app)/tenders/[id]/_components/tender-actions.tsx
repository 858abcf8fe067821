"use client";

import { useState, useTransition } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useConfirm } from "@/app/_components/confirm";
import { cancelTenderSchema, type CancelTenderInput } from "@/lib/validation/tender";
import { cancelTenderAction, openTenderAction, type TenderFormResult } from "../../actions";

function Outcome({ result }: { result: TenderFormResult }) {
  if (!result.message) return null;
  return (
    <p role={result.ok ? "status" : "alert"} className={`text-sm ${result.ok ? "text-verdict-plausible" : "text-verdict-impossible"}`}>
      {result.message}
    </p>
  );
}

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
      <Outcome result={result} />
      {confirm.dialog}
    </div>
  );
}

/** Cancelling needs a reason; the invited vendors and the buyers are told it. */
export function CancelTenderForm({ tenderId }: { tenderId: string }) {
  const [result, setResult] = useState<TenderFormResult>({});
  const [pending, startTransition] = useTransition();
  const { register, handleSubmit, formState, setError } = useForm<CancelTenderInput>({
    resolver: zodResolver(cancelTenderSchema),
    defaultValues: { reason: "" },
  });
  const submit = handleSubmit((values) =>
    startTransition(async () => {
      const outcome = await cancelTenderAction(tenderId, values);
      setResult(outcome);
      const reason = outcome.fieldErrors?.reason?.[0];
      if (reason) setError("reason", { message: reason });
    }),
  );
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
      <Outcome result={result} />
    </form>
  );
}

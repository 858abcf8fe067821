"use client";

import { useState, useTransition } from "react";
import type { FormResult } from "@/lib/server/form-action";
import { useConfirm } from "@/app/_components/confirm";
import { FieldError, FormStatus } from "@/app/_components/form-status";
import { withdrawalSchema } from "@/lib/validation/comparison";
import { fieldErrorsOf } from "@/lib/validation/messages";
import { withdrawAction } from "../actions";

/** The buyer takes the recommendation out of approval, with a reason that goes into the ledger. */
export function WithdrawForm({ tenderId }: { tenderId: string }) {
  const [reason, setReason] = useState("");
  const [result, setResult] = useState<FormResult>({});
  const [pending, startTransition] = useTransition();
  const confirm = useConfirm();
  const submit = () => {
    const parsed = withdrawalSchema.safeParse({ reason });
    if (!parsed.success) return setResult({ message: "Check the reason.", fieldErrors: fieldErrorsOf(parsed.error) });
    confirm.ask(
      {
        title: "Withdraw the recommendation?",
        consequences:
          "It leaves approval for good, and any approvals given to it stop counting. The tender goes back to commercial evaluation, where you can recommend again. The reason goes into the ledger.",
        action: "Withdraw",
      },
      () => startTransition(async () => setResult(await withdrawAction(tenderId, { reason }))),
    );
  };
  return (
    <form
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
      aria-label="Withdraw the recommendation"
      className="space-y-2"
      noValidate
    >
      <label className="label" htmlFor="withdraw-reason">
        Reason for withdrawing
      </label>
      <textarea id="withdraw-reason" rows={2} className="field" value={reason} onChange={(e) => setReason(e.target.value)} />
      <FieldError message={result.fieldErrors?.reason?.[0]} />
      <FormStatus result={result} />
      <button type="submit" className="btn-quiet" disabled={pending}>
        {pending ? "Withdrawing…" : "Withdraw the recommendation"}
      </button>
      {confirm.dialog}
    </form>
  );
}

"use client";

import { FieldError, FormStatus } from "@/app/_components/form-status";
import { useActionForm } from "@/app/_components/use-action-form";
import { withdrawalSchema } from "@/lib/validation/comparison";
import { withdrawAction } from "../actions";

/** The buyer takes the recommendation out of approval, with a reason that goes into the ledger. */
export function WithdrawForm({ tenderId }: { tenderId: string }) {
  const { register, formState, submit, result, pending, dialog } = useActionForm({
    schema: withdrawalSchema,
    defaultValues: { reason: "" },
    send: (values) => withdrawAction(tenderId, values),
    confirm: {
      title: "Withdraw the recommendation?",
      consequences:
        "It leaves approval for good, and any approvals given to it stop counting. The tender goes back to commercial evaluation, where you can recommend again. The reason goes into the ledger.",
      action: "Withdraw",
    },
    invalidMessage: "Check the reason.",
  });
  return (
    <form onSubmit={submit} aria-label="Withdraw the recommendation" className="space-y-2" noValidate>
      <label className="label" htmlFor="withdraw-reason">
        Reason for withdrawing
      </label>
      <textarea id="withdraw-reason" rows={2} className="field" {...register("reason")} />
      <FieldError message={formState.errors.reason?.message} />
      <FormStatus result={result} />
      <button type="submit" className="btn-quiet" disabled={pending}>
        {pending ? "Withdrawing…" : "Withdraw the recommendation"}
      </button>
      {dialog}
    </form>
  );
}

"use client";

import { formCount, formDecimal, formOptionalDecimal } from "@/lib/numbers";
import { FieldError, FormStatus } from "@/app/_components/form-status";
import { useActionForm } from "@/app/_components/use-action-form";
import { approvalBandSchema, type ApprovalBandInput } from "@/lib/validation/approvals";
import { createBandAction, updateBandAction } from "../actions";

/** Adds a band, or changes one when `band` is given. Overlaps are refused by the server with the bands named. */
export function BandForm({ band, onDone }: { band?: ApprovalBandInput & { id: string }; onDone?: () => void }) {
  const { register, formState, submit, result, pending } = useActionForm({
    schema: approvalBandSchema,
    defaultValues: band ?? { currency: "EUR", minValue: 0, maxValue: null, approvalsNeeded: 1, minApproverLimit: 0 },
    send: (values) => (band ? updateBandAction(band.id, values) : createBandAction(values)),
    resetOnSuccess: !band,
    onSuccess: onDone,
  });
  const prefix = band ? `band-${band.id}` : "band-new";
  const e = formState.errors;
  const field = (name: keyof ApprovalBandInput, label: string, numeric = true) => (
    <div>
      <label className="label" htmlFor={`${prefix}-${name}`}>
        {label}
      </label>
      <input
        id={`${prefix}-${name}`}
        className="field"
        inputMode={numeric ? "decimal" : undefined}
        {...register(name, numeric ? { setValueAs: name === "maxValue" ? formOptionalDecimal : name === "approvalsNeeded" ? formCount : formDecimal } : {})}
      />
      <FieldError message={e[name]?.message} />
    </div>
  );
  return (
    <form onSubmit={submit} aria-label={band ? "Change band" : "New band"} className="space-y-3" noValidate>
      <div className="grid grid-cols-2 gap-3 md:grid-cols-5">
        {field("currency", "Currency", false)}
        {field("minValue", "From (inclusive)")}
        {field("maxValue", "Up to (exclusive; empty = open)")}
        {field("approvalsNeeded", "Approvals needed")}
        {field("minApproverLimit", "Least approver limit")}
      </div>
      <FormStatus result={result} />
      <button type="submit" className="btn" disabled={pending}>
        {pending ? "Saving…" : band ? "Save band" : "Add band"}
      </button>
    </form>
  );
}

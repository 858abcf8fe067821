"use client";

import { useState, useTransition } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import type { FormResult } from "@/lib/server/form-action";
import { formCount, formDecimal, formOptionalDecimal } from "@/lib/numbers";
import { FieldError, FormStatus } from "@/app/_components/form-status";
import { approvalBandSchema, type ApprovalBandInput } from "@/lib/validation/approvals";
import { createBandAction, updateBandAction } from "../actions";

/** Adds a band, or changes one when `band` is given. Overlaps are refused by the server with the bands named. */
export function BandForm({ band, onDone }: { band?: ApprovalBandInput & { id: string }; onDone?: () => void }) {
  const [result, setResult] = useState<FormResult>({});
  const [pending, startTransition] = useTransition();
  const { register, handleSubmit, formState, reset, setError } = useForm<z.input<typeof approvalBandSchema>, unknown, ApprovalBandInput>({
    resolver: zodResolver(approvalBandSchema),
    defaultValues: band ?? { currency: "EUR", minValue: 0, maxValue: null, approvalsNeeded: 1, minApproverLimit: 0 },
  });
  const prefix = band ? `band-${band.id}` : "band-new";
  const submit = handleSubmit((values) =>
    startTransition(async () => {
      const outcome = band ? await updateBandAction(band.id, values) : await createBandAction(values);
      setResult(outcome);
      for (const [field, messages] of Object.entries(outcome.fieldErrors ?? {})) setError(field as keyof ApprovalBandInput, { message: messages[0] });
      if (outcome.ok && !band) reset();
      if (outcome.ok) onDone?.();
    }),
  );
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

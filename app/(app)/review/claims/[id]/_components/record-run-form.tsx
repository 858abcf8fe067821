"use client";

import { evidenceRunSchema } from "@/lib/validation/review";
import { recordEvidenceAction } from "@/app/(app)/review/actions";
import { FieldError, FormStatus } from "@/app/_components/form-status";
import { useActionForm } from "@/app/_components/use-action-form";
import { formCount, formDecimal } from "@/lib/numbers";

export function RecordRunForm({ claimId, unit, channelValue }: { claimId: string; unit: "bits" | "frames"; channelValue: number }) {
  const { register, formState, submit, result, pending } = useActionForm({
    schema: evidenceRunSchema,
    defaultValues: { channelValue, unit, confidence: 0.95, note: "" },
    send: (values) => recordEvidenceAction(claimId, values),
  });
  const e = formState.errors;
  return (
    <form onSubmit={submit} aria-label="Record a lab run" className="space-y-2" noValidate>
      <h3 className="text-sm font-semibold">Record a lab run</h3>
      <div className="grid grid-cols-2 gap-2">
        <div>
          <label className="label" htmlFor="run-channel">
            Channel condition
          </label>
          <input id="run-channel" className="field" inputMode="decimal" {...register("channelValue", { setValueAs: formDecimal })} />
          <FieldError message={e.channelValue?.message} />
        </div>
        <div>
          <label className="label" htmlFor="run-unit">
            Counted in
          </label>
          <select id="run-unit" className="field" {...register("unit")}>
            <option value="bits">bits</option>
            <option value="frames">frames</option>
          </select>
          <FieldError message={e.unit?.message} />
        </div>
        <div>
          <label className="label" htmlFor="run-trials">
            Sent
          </label>
          <input id="run-trials" className="field" inputMode="numeric" {...register("trials", { setValueAs: formCount })} />
          <FieldError message={e.trials?.message} />
        </div>
        <div>
          <label className="label" htmlFor="run-errors">
            Errors counted
          </label>
          <input id="run-errors" className="field" inputMode="numeric" {...register("errors", { setValueAs: formCount })} />
          <FieldError message={e.errors?.message} />
        </div>
        <div>
          <label className="label" htmlFor="run-confidence">
            Confidence
          </label>
          <select id="run-confidence" className="field" {...register("confidence", { setValueAs: formDecimal })}>
            <option value="0.9">90 %</option>
            <option value="0.95">95 %</option>
            <option value="0.99">99 %</option>
          </select>
        </div>
        <div>
          <label className="label" htmlFor="run-note">
            Note
          </label>
          <input id="run-note" className="field" {...register("note")} />
        </div>
      </div>
      <FormStatus result={result} />
      <button type="submit" className="btn" disabled={pending}>
        {pending ? "Recording…" : "Record run"}
      </button>
    </form>
  );
}

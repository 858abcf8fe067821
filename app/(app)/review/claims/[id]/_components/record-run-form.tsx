"use client";

import { useState, useTransition } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { evidenceRunSchema, type EvidenceRunInput } from "@/lib/validation/review";
import type { FormResult } from "@/lib/server/form-action";
import { recordEvidenceAction } from "@/app/(app)/review/actions";
import { FieldError, FormStatus } from "@/app/_components/form-status";
import { formCount, formDecimal } from "@/lib/numbers";

export function RecordRunForm({ claimId, unit, channelValue }: { claimId: string; unit: "bits" | "frames"; channelValue: number }) {
  const [result, setResult] = useState<FormResult>({});
  const [pending, startTransition] = useTransition();
  const { register, handleSubmit, setError, formState } = useForm<z.input<typeof evidenceRunSchema>, unknown, EvidenceRunInput>({
    resolver: zodResolver(evidenceRunSchema),
    defaultValues: { channelValue, unit, confidence: 0.95, note: "" },
  });
  const submit = handleSubmit((values) =>
    startTransition(async () => {
      const outcome = await recordEvidenceAction(claimId, values);
      setResult(outcome);
      for (const [field, messages] of Object.entries(outcome.fieldErrors ?? {})) setError(field as keyof EvidenceRunInput, { message: messages[0] });
    }),
  );
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

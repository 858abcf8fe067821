"use client";

import { useFieldArray, useFormContext, useWatch } from "react-hook-form";
import { CHANNEL_LABELS } from "@/lib/format";
import { formDecimal } from "@/lib/numbers";
import { CONDITION_RANGES, type TenderFormValues } from "@/lib/validation/tender";
import { errorAt, FieldError } from "./field-error";

/** One row per channel condition the buyer cares about; the unit follows the channel model. */
export function OperatingPointsFields() {
  const { control, register, formState } = useFormContext<TenderFormValues>();
  const { fields, append, remove } = useFieldArray({ control, name: "operatingPoints" });
  const model = useWatch({ control, name: "channelModel" }) ?? "bsc";
  const channel = CHANNEL_LABELS[model];
  const unit = channel.unit ? ` (${channel.unit})` : "";
  const errors = formState.errors;

  return (
    <fieldset className="space-y-2">
      <legend className="label">Operating points</legend>
      <p className="text-xs text-ink-soft">Each point: a name and the {channel.parameter}{unit}; {CONDITION_RANGES[model].words}.</p>
      {fields.map((field, i) => {
        const labelError = errorAt(errors, `operatingPoints.${i}.label`);
        const valueError = errorAt(errors, `operatingPoints.${i}.value`);
        return (
          <div key={field.id} className="grid grid-cols-[1fr_12rem_auto] items-start gap-2" role="group" aria-label={`Operating point ${i + 1}`}>
            <div>
              <label className="sr-only" htmlFor={`op-${i}-label`}>Point {i + 1} name</label>
              <input id={`op-${i}-label`} className="field" placeholder="e.g. Storm fade" aria-invalid={Boolean(labelError)} aria-describedby={`op-${i}-label-error`} {...register(`operatingPoints.${i}.label`)} />
              <FieldError id={`op-${i}-label-error`} message={labelError} />
            </div>
            <div>
              <label className="sr-only" htmlFor={`op-${i}-value`}>Point {i + 1} {channel.parameter}{unit}</label>
              <input id={`op-${i}-value`} className="field tabular-nums" inputMode="decimal" aria-invalid={Boolean(valueError)} aria-describedby={`op-${i}-value-error`} {...register(`operatingPoints.${i}.value`, { setValueAs: formDecimal })} />
              <FieldError id={`op-${i}-value-error`} message={valueError} />
            </div>
            <button type="button" className="btn-quiet" onClick={() => remove(i)} aria-label={`Remove point ${i + 1}`}>Remove</button>
          </div>
        );
      })}
      <FieldError id="op-error" message={errorAt(errors, "operatingPoints")} />
      <button type="button" className="btn-quiet" onClick={() => append({ label: "", value: model === "biawgn" ? 3 : 1e-3 })}>
        Add operating point
      </button>
    </fieldset>
  );
}

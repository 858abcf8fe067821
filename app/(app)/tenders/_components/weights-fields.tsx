"use client";

import { useFormContext, useWatch } from "react-hook-form";
import { WEIGHT_KEYS, type TenderFormValues } from "@/lib/validation/tender";
import { errorAt, FieldError } from "./field-error";
import { formDecimal } from "@/lib/numbers";

const NAMES: Record<(typeof WEIGHT_KEYS)[number], string> = {
  technical: "Technical",
  evidence: "Evidence",
  price: "Price",
  leadTime: "Lead time",
  warranty: "Warranty",
};

/** The five scoring weights, stored as given; the share of each is shown as the buyer types. */
export function WeightsFields() {
  const { control, register, formState } = useFormContext<TenderFormValues>();
  const weights = useWatch({ control, name: "weights" });
  const total = WEIGHT_KEYS.reduce((sum, key) => sum + (Number.isFinite(weights?.[key]) ? Number(weights[key]) : 0), 0);

  return (
    <fieldset>
      <legend className="label">Scoring weights</legend>
      <div className="grid grid-cols-5 gap-2">
        {WEIGHT_KEYS.map((key) => {
          const message = errorAt(formState.errors, `weights.${key}`);
          const share = total > 0 && Number.isFinite(weights?.[key]) ? Math.round((Number(weights[key]) / total) * 100) : 0;
          return (
            <div key={key}>
              <label className="text-xs text-ink-soft" htmlFor={`w-${key}`}>
                {NAMES[key]} weight
              </label>
              <input
                id={`w-${key}`}
                className="field tabular-nums"
                inputMode="decimal"
                aria-invalid={Boolean(message)}
                {...register(`weights.${key}`, { setValueAs: formDecimal })}
              />
              <span className="text-xs text-ink-muted tabular-nums">{share} %</span>
              <FieldError id={`w-${key}-error`} message={message} />
            </div>
          );
        })}
      </div>
      <FieldError id="weights-error" message={errorAt(formState.errors, "weights")} />
      <p className="mt-1 text-xs text-ink-soft">Weights lock when the tender opens.</p>
    </fieldset>
  );
}

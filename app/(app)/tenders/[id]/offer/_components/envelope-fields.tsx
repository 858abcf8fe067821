"use client";

import { useFieldArray, useFormContext } from "react-hook-form";
import { errorAt, FieldError } from "@/app/(app)/tenders/_components/field-error";
import type { OfferFormValues } from "@/lib/validation/offer";
import { formCount, formDecimal } from "@/lib/numbers";

/** The sealed commercial envelope: only the vendor and, once opened, the buyer ever read it. */
export function EnvelopeFields({ currency }: { currency: string }) {
  const { register, control, formState } = useFormContext<OfferFormValues>();
  const { fields, append, remove } = useFieldArray({ control, name: "envelope.priceBreaks" });
  const err = (path: string) => errorAt(formState.errors, `envelope.${path}`);
  const numeric = (path: "unitPrice" | "leadTimeWeeks" | "warrantyMonths", label: string) => (
    <div>
      <label className="label" htmlFor={`env-${path}`}>
        {label}
      </label>
      <input
        id={`env-${path}`}
        className="field tabular-nums"
        inputMode="decimal"
        aria-invalid={Boolean(err(path))}
        aria-describedby={`env-${path}-error`}
        {...register(`envelope.${path}`, { setValueAs: path === "unitPrice" ? formDecimal : formCount })}
      />
      <FieldError id={`env-${path}-error`} message={err(path)} />
    </div>
  );
  return (
    <section className="space-y-3" aria-label="Sealed envelope">
      <h3>Sealed commercial envelope</h3>
      <p className="text-xs text-ink-soft">Engineers never see it; the buyer opens it only after the technical evaluation is signed.</p>
      <div className="grid gap-3 md:grid-cols-4">
        {numeric("unitPrice", "Unit price")}
        <div>
          <span className="label" id="env-currency-label">
            Currency
          </span>
          <p className="py-1.5 text-sm font-medium" aria-labelledby="env-currency-label" data-testid="offer-currency">
            {currency}, set by the tender
          </p>
          <input type="hidden" {...register("envelope.currency")} />
          <FieldError id="env-currency-error" message={err("currency")} />
        </div>
        {numeric("leadTimeWeeks", "Lead time (weeks)")}
        {numeric("warrantyMonths", "Warranty (months)")}
      </div>
      <fieldset className="space-y-2">
        <legend className="label">Price breaks by quantity</legend>
        {fields.map((field, i) => (
          <div
            key={field.id}
            role="group"
            aria-label={`Price break ${i + 1}`}
            className="grid grid-cols-[minmax(0,10rem)_minmax(0,10rem)_auto] items-start gap-2"
          >
            <div>
              <label className="sr-only" htmlFor={`pb-${i}-q`}>
                Break {i + 1} from quantity
              </label>
              <input
                id={`pb-${i}-q`}
                className="field tabular-nums"
                placeholder="from units"
                inputMode="numeric"
                {...register(`envelope.priceBreaks.${i}.minQuantity`, { setValueAs: formCount })}
              />
              <FieldError id={`pb-${i}-q-error`} message={err(`priceBreaks.${i}.minQuantity`)} />
            </div>
            <div>
              <label className="sr-only" htmlFor={`pb-${i}-p`}>
                Break {i + 1} unit price
              </label>
              <input
                id={`pb-${i}-p`}
                className="field tabular-nums"
                placeholder="unit price"
                inputMode="decimal"
                {...register(`envelope.priceBreaks.${i}.unitPrice`, { setValueAs: formDecimal })}
              />
              <FieldError id={`pb-${i}-p-error`} message={err(`priceBreaks.${i}.unitPrice`)} />
            </div>
            <button type="button" className="btn-quiet" onClick={() => remove(i)} aria-label={`Remove price break ${i + 1}`}>
              Remove
            </button>
          </div>
        ))}
        <FieldError id="pb-error" message={err("priceBreaks")} />
        <button
          type="button"
          className="btn-quiet"
          onClick={() => append({ minQuantity: "", unitPrice: "" } as unknown as { minQuantity: number; unitPrice: number })}
        >
          Add price break
        </button>
      </fieldset>
    </section>
  );
}

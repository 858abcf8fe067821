"use client";

import { FormProvider } from "react-hook-form";
import { errorAt, FieldError } from "@/app/(app)/tenders/_components/field-error";
import { FormStatus } from "@/app/_components/form-status";
import { useActionForm } from "@/app/_components/use-action-form";
import type { ChannelModel } from "@/lib/offers";
import { offerSchema, type OfferFormValues } from "@/lib/validation/offer";
import { submitOfferAction } from "../actions";
import { formOptionalCount, formOptionalDecimal } from "@/lib/numbers";
import { ClaimsFields, type OfferPoint } from "./claims-fields";
import { EnvelopeFields } from "./envelope-fields";

interface Props {
  tenderId: string;
  model: ChannelModel;
  points: OfferPoint[];
  defaults: OfferFormValues;
  resubmission: boolean;
}

export function OfferForm({ tenderId, model, points, defaults, resubmission }: Props) {
  const form = useActionForm({ schema: offerSchema, defaultValues: defaults, send: (values) => submitOfferAction(tenderId, values) });
  const { register, formState, submit, result, pending } = form;
  const err = (path: string) => errorAt(formState.errors, path);
  const text = (name: "moduleName" | "partNumber" | "code.family", id: string, label: string) => (
    <div>
      <label className="label" htmlFor={id}>
        {label}
      </label>
      <input id={id} className="field" aria-invalid={Boolean(err(name))} aria-describedby={`${id}-error`} {...register(name)} />
      <FieldError id={`${id}-error`} message={err(name)} />
    </div>
  );
  const codeNumber = (name: "n" | "k" | "rate" | "overhead", label: string) => (
    <div>
      <label className="label" htmlFor={`code-${name}`}>
        {label}
      </label>
      <input
        id={`code-${name}`}
        className="field tabular-nums"
        inputMode="decimal"
        aria-invalid={Boolean(err(`code.${name}`))}
        aria-describedby={`code-${name}-error`}
        {...register(`code.${name}`, { setValueAs: name === "n" || name === "k" ? formOptionalCount : formOptionalDecimal })}
      />
      <FieldError id={`code-${name}-error`} message={err(`code.${name}`)} />
    </div>
  );

  return (
    <FormProvider {...form}>
      <form onSubmit={submit} className="panel space-y-5" aria-label="Offer form" noValidate>
        <FormStatus result={result} />
        <section className="grid gap-3 md:grid-cols-2" aria-label="Module">
          {text("moduleName", "module-name", "Module name")}
          {text("partNumber", "part-number", "Part number")}
        </section>
        <section className="space-y-3" aria-label="Code">
          <h3>Forward error correction</h3>
          <div className="grid gap-3 md:grid-cols-2">
            {text("code.family", "code-family", "Code family (LDPC, BCH, RS, polar, turbo, convolutional…)")}
            <div>
              <label className="label" htmlFor="code-decision">
                Decoder input
              </label>
              <select id="code-decision" className="field" {...register("code.decision")}>
                <option value="hard">Hard decision</option>
                <option value="soft" disabled={model === "bsc"}>
                  Soft decision{model === "bsc" ? " (not on this hard-decision tender)" : ""}
                </option>
              </select>
              <FieldError id="code-decision-error" message={err("code.decision")} />
            </div>
          </div>
          <p className="text-xs text-ink-soft">Give n and k, or a code rate, or an overhead (n/k − 1); n may accompany a rate or an overhead.</p>
          <div className="grid gap-3 md:grid-cols-4">
            {codeNumber("n", "Block length n (bits)")}
            {codeNumber("k", "Information bits k")}
            {codeNumber("rate", "Code rate k/n")}
            {codeNumber("overhead", "Overhead (e.g. 0.07)")}
          </div>
        </section>
        <ClaimsFields model={model} points={points} />
        <EnvelopeFields currency={defaults.envelope.currency} />
        <button type="submit" className="btn" disabled={pending}>
          {pending ? "Submitting…" : resubmission ? "Submit a new version" : "Submit offer"}
        </button>
      </form>
    </FormProvider>
  );
}

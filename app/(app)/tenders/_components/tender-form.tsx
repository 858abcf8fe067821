"use client";

import { FormProvider, useWatch, type Path } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { FormStatus } from "@/app/_components/form-status";
import { useActionForm } from "@/app/_components/use-action-form";
import { CHANNEL_LABELS } from "@/lib/format";
import { formCount, formDecimal, formOptionalCount } from "@/lib/numbers";
import { CHANNEL_MODELS, tenderInputSchema, type TenderFormValues } from "@/lib/validation/tender";
import { createTenderAction, updateTenderAction } from "../actions";
import { errorAt, FieldError } from "./field-error";
import { NoticeFields } from "./notice-fields";
import { OperatingPointsFields } from "./operating-points-fields";
import { WeightsFields } from "./weights-fields";

interface Props {
  /** Present when editing an existing draft. */
  tenderId?: string;
  defaults: TenderFormValues;
  vendors: { id: string; name: string }[];
  zones: string[];
}

// A lone checkbox gives a string or false, not a list: the schema always gets a list.
const asList = (v: unknown): string[] => (Array.isArray(v) ? v : typeof v === "string" ? [v] : []);
const schemaResolver = zodResolver(tenderInputSchema);
const resolver: typeof schemaResolver = (values, context, options) =>
  schemaResolver({ ...values, invitedOrgIds: asList(values.invitedOrgIds) }, context, options);

/** The buyer's draft: the same zod schema checks it here and on the server. */
export function TenderForm({ tenderId, defaults, vendors, zones }: Props) {
  const methods = useActionForm({
    schema: resolver,
    defaultValues: defaults,
    send: (values) => (tenderId ? updateTenderAction(tenderId, values) : createTenderAction(values)),
  });
  const { register, control, formState, submit, result, pending } = methods;
  const rule = useWatch({ control, name: "impossibleRule" });
  const field = (name: Path<TenderFormValues>, label: string, input: React.ReactNode, hint?: string) => (
    <div>
      <label className="label" htmlFor={`t-${name}`}>
        {label}
      </label>
      {input}
      {hint ? <p className="mt-1 text-xs text-ink-muted">{hint}</p> : null}
      <FieldError id={`t-${name}-error`} message={errorAt(formState.errors, name)} />
    </div>
  );
  const invalid = (name: Path<TenderFormValues>) => ({
    id: `t-${name}`,
    "aria-invalid": Boolean(errorAt(formState.errors, name)),
    "aria-describedby": `t-${name}-error`,
  });

  return (
    <FormProvider {...methods}>
      <form onSubmit={submit} className="panel space-y-5" aria-label={tenderId ? "Edit tender" : "New tender"} noValidate>
        <FormStatus result={result} />
        <div className="grid gap-4 md:grid-cols-2">
          {field("title", "Title", <input className="field" {...invalid("title")} {...register("title")} />)}
          {field(
            "channelModel",
            "Channel model",
            <select className="field" {...invalid("channelModel")} {...register("channelModel")}>
              {CHANNEL_MODELS.map((m) => (
                <option key={m} value={m}>
                  {CHANNEL_LABELS[m].name}
                </option>
              ))}
            </select>,
          )}
        </div>
        {field("description", "Description", <textarea rows={3} className="field" {...invalid("description")} {...register("description")} />)}
        <OperatingPointsFields />
        <div className="grid gap-4 md:grid-cols-3">
          {field(
            "targetMetric",
            "Residual error metric",
            <select className="field" {...invalid("targetMetric")} {...register("targetMetric")}>
              <option value="bler">BLER (block error rate)</option>
              <option value="ber">BER (bit error rate, after decoding)</option>
            </select>,
          )}
          {field(
            "targetValue",
            "Residual error at most",
            <input className="field tabular-nums" inputMode="decimal" {...invalid("targetValue")} {...register("targetValue", { setValueAs: formDecimal })} />,
            "A probability, e.g. 1e-4 or 0,0001.",
          )}
          {field(
            "maxFrameBits",
            "Longest frame (bits)",
            <input
              className="field tabular-nums"
              inputMode="numeric"
              {...invalid("maxFrameBits")}
              {...register("maxFrameBits", { setValueAs: formOptionalCount })}
            />,
            "Leave empty for no limit.",
          )}
        </div>
        <div className="grid gap-4 md:grid-cols-3">
          {field(
            "quantity",
            "Quantity (units)",
            <input className="field tabular-nums" inputMode="numeric" {...invalid("quantity")} {...register("quantity", { setValueAs: formCount })} />,
          )}
          {field(
            "currency",
            "Currency",
            <input className="field uppercase" maxLength={3} {...invalid("currency")} {...register("currency")} />,
            "ISO 4217, e.g. EUR.",
          )}
        </div>
        <WeightsFields />
        <fieldset className="grid gap-4 md:grid-cols-3">
          <legend className="label">If a claim is confirmed impossible</legend>
          <label className="inline-flex items-center gap-2 text-sm">
            <input type="radio" value="disqualify" {...register("impossibleRule")} /> Disqualify the offer
          </label>
          <label className="inline-flex items-center gap-2 text-sm">
            <input type="radio" value="penalty" {...register("impossibleRule")} /> Deduct points
          </label>
          {rule === "penalty"
            ? field(
                "impossiblePenalty",
                "Penalty (points)",
                <input
                  className="field tabular-nums"
                  inputMode="decimal"
                  {...invalid("impossiblePenalty")}
                  {...register("impossiblePenalty", { setValueAs: formDecimal })}
                />,
              )
            : null}
        </fieldset>
        <fieldset className="space-y-1">
          <legend className="label">Safety</legend>
          <label className="inline-flex items-center gap-2 text-sm">
            <input type="checkbox" {...register("safetyRelevant")} /> Safety-relevant: these radios serve a safety use
          </label>
          <p className="text-xs text-ink-muted">
            Then every accepted claim needs a lab run that verifies it, two engineers sign the technical evaluation, and the memo and notices carry the stronger
            caution.
          </p>
        </fieldset>
        <div className="grid gap-4 md:grid-cols-2">
          {field(
            "closesLocal",
            "Closing date and time",
            <input className="field tabular-nums" type="datetime-local" {...invalid("closesLocal")} {...register("closesLocal")} />,
            "Local time in the zone beside it.",
          )}
          {field(
            "closesZone",
            "Time zone",
            <select className="field" {...invalid("closesZone")} {...register("closesZone")}>
              {zones.map((z) => (
                <option key={z} value={z}>
                  {z}
                </option>
              ))}
            </select>,
          )}
        </div>
        <NoticeFields />
        <fieldset>
          <legend className="label">Invited vendors</legend>
          <div className="flex flex-wrap gap-4 text-sm">
            {vendors.map((v) => (
              <label key={v.id} className="inline-flex items-center gap-1.5">
                <input type="checkbox" value={v.id} {...register("invitedOrgIds")} /> {v.name}
              </label>
            ))}
            {vendors.length === 0 ? <span className="text-ink-soft">No vendor organisation exists yet.</span> : null}
          </div>
          <FieldError id="t-invited-error" message={errorAt(formState.errors, "invitedOrgIds")} />
        </fieldset>
        <button type="submit" className="btn" disabled={pending}>
          {pending ? "Saving…" : tenderId ? "Save draft" : "Create draft"}
        </button>
      </form>
    </FormProvider>
  );
}

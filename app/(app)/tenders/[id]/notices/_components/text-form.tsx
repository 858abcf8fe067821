"use client";

import type { DefaultValues, FieldValues, Path } from "react-hook-form";
import type { ZodType } from "zod";
import { FieldError, FormStatus } from "@/app/_components/form-status";
import { useActionForm } from "@/app/_components/use-action-form";
import type { FormResult } from "@/lib/server/form-action";

interface Field {
  name: string;
  label: string;
  rows?: number;
}

/**
 * A small form of text fields (and any fixed extra values) sent to one server action; the action's zod schema checks them
 * here first, and the server's field messages show under each field like the schema's own.
 */
export function TextForm<Input extends FieldValues, Output>({
  label,
  fields,
  submit: submitLabel,
  schema,
  send,
  extra = {},
}: {
  label: string;
  fields: Field[];
  submit: string;
  schema: ZodType<Output, Input>;
  send: (values: Output) => Promise<FormResult>;
  extra?: Record<string, string>;
}) {
  const { register, formState, submit, result, pending } = useActionForm({
    schema,
    defaultValues: { ...extra, ...Object.fromEntries(fields.map((f) => [f.name, ""])) } as DefaultValues<Input>,
    send,
    resetOnSuccess: true,
    invalidMessage: "Check the highlighted fields.",
  });
  const errorOf = (name: string) => {
    const message = formState.errors[name]?.message;
    return typeof message === "string" ? message : undefined;
  };
  return (
    <form aria-label={label} className="space-y-2" noValidate onSubmit={submit}>
      {fields.map((f) => (
        <div key={f.name}>
          <label className="label" htmlFor={`n-${f.name}`}>
            {f.label}
          </label>
          {f.rows ? (
            <textarea id={`n-${f.name}`} rows={f.rows} className="field" {...register(f.name as Path<Input>)} />
          ) : (
            <input id={`n-${f.name}`} className="field" {...register(f.name as Path<Input>)} />
          )}
          <FieldError message={errorOf(f.name)} />
        </div>
      ))}
      <FormStatus result={result} />
      <button type="submit" className="btn" disabled={pending}>
        {pending ? "Sending…" : submitLabel}
      </button>
    </form>
  );
}

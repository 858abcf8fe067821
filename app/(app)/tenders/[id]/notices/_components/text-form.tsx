"use client";

import { useState, useTransition } from "react";
import { FormStatus } from "@/app/_components/form-status";
import type { FormResult } from "@/lib/server/form-action";

interface Field {
  name: string;
  label: string;
  rows?: number;
}

/**
 * A small form of text fields (and any fixed extra values) sent to one server action (which parses them with the API's zod
 * schema); the server's field messages show under each field.
 */
export function TextForm({
  label,
  fields,
  submit,
  send,
  extra = {},
}: {
  label: string;
  fields: Field[];
  submit: string;
  send: (values: Record<string, string>) => Promise<FormResult>;
  extra?: Record<string, string>;
}) {
  const [result, setResult] = useState<FormResult>({});
  const [pending, startTransition] = useTransition();
  const onSubmit = (form: HTMLFormElement) =>
    startTransition(async () => {
      const data = new FormData(form);
      const values = { ...extra, ...Object.fromEntries(fields.map((f) => [f.name, String(data.get(f.name) ?? "")])) };
      const outcome = await send(values);
      setResult(outcome);
      if (outcome.ok) form.reset();
    });
  return (
    <form aria-label={label} className="space-y-2" noValidate onSubmit={(e) => (e.preventDefault(), onSubmit(e.currentTarget))}>
      {fields.map((f) => (
        <div key={f.name}>
          <label className="label" htmlFor={`n-${f.name}`}>
            {f.label}
          </label>
          {f.rows ? (
            <textarea id={`n-${f.name}`} name={f.name} rows={f.rows} className="field" />
          ) : (
            <input id={`n-${f.name}`} name={f.name} className="field" />
          )}
          {result.fieldErrors?.[f.name] ? <p className="mt-1 text-xs text-verdict-impossible">{result.fieldErrors[f.name][0]}</p> : null}
        </div>
      ))}
      <FormStatus result={result} />
      <button type="submit" className="btn" disabled={pending}>
        {pending ? "Sending…" : submit}
      </button>
    </form>
  );
}

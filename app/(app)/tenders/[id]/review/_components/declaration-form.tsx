"use client";

import { useWatch } from "react-hook-form";
import { declarationSchema } from "@/lib/validation/review";
import { FieldError, FormStatus } from "@/app/_components/form-status";
import { useActionForm } from "@/app/_components/use-action-form";
import { declareAction } from "../actions";

/** The conflict-of-interest declaration: made once, before the offers can be seen, never changed. */
export function DeclarationForm({ tenderId, vendors }: { tenderId: string; vendors: { id: string; name: string }[] }) {
  const { register, control, formState, submit, result, pending } = useActionForm({
    schema: declarationSchema,
    defaultValues: { conflict: "none", conflictedOrgIds: [], statement: "" },
    send: (values) => declareAction(tenderId, { ...values, conflictedOrgIds: values.conflict === "some" ? values.conflictedOrgIds : [] }),
  });
  const some = useWatch({ control, name: "conflict" }) === "some";
  const e = formState.errors;
  return (
    <form onSubmit={submit} aria-label="Conflict-of-interest declaration" className="space-y-3" noValidate>
      <fieldset>
        <legend className="label">Do you have a conflict of interest with an invited vendor?</legend>
        <div className="flex gap-4 text-sm">
          <label className="inline-flex items-center gap-1">
            <input type="radio" value="none" {...register("conflict")} /> No conflict
          </label>
          <label className="inline-flex items-center gap-1">
            <input type="radio" value="some" {...register("conflict")} /> Conflict with named vendors
          </label>
        </div>
      </fieldset>
      {some ? (
        <fieldset>
          <legend className="label">Vendors you are conflicted with</legend>
          <div className="flex flex-wrap gap-4 text-sm">
            {vendors.map((v) => (
              <label key={v.id} className="inline-flex items-center gap-1">
                <input type="checkbox" value={v.id} {...register("conflictedOrgIds")} /> {v.name}
              </label>
            ))}
          </div>
          <FieldError message={e.conflictedOrgIds?.message} />
        </fieldset>
      ) : null}
      <div>
        <label className="label" htmlFor="declaration-statement">
          Statement
        </label>
        <textarea
          id="declaration-statement"
          rows={3}
          className="field"
          placeholder="For example: I have no financial, family or employment ties to any invited vendor."
          {...register("statement")}
        />
        <FieldError message={e.statement?.message} />
      </div>
      <FormStatus result={result} />
      <p className="text-xs text-ink-soft">A declaration is recorded in the ledger and cannot be changed afterwards.</p>
      <button type="submit" className="btn" disabled={pending}>
        {pending ? "Recording…" : "Declare"}
      </button>
    </form>
  );
}

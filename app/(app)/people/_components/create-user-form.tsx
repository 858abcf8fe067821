"use client";

import { formOptionalDecimal } from "@/lib/numbers";
import { createUserSchema, type CreateUserInput } from "@/lib/validation/people";
import { ROLES as ROLE_NAMES, type OrganisationKind } from "@/policies/vocabulary";
import { FieldError, FormStatus } from "@/app/_components/form-status";
import { useActionForm } from "@/app/_components/use-action-form";
import { createUserAction } from "../actions";

interface Org {
  id: string;
  name: string;
  kind: OrganisationKind;
}

export function CreateUserForm({ organisations }: { organisations: Org[] }) {
  const { register, formState, submit, result, pending } = useActionForm({
    schema: createUserSchema,
    defaultValues: { name: "", email: "", password: "", organisationId: "", roles: [], approvalLimit: null },
    send: createUserAction,
    resetOnSuccess: true,
  });
  const errors = formState.errors;
  const err = (name: keyof CreateUserInput) => <FieldError message={errors[name]?.message} />;

  return (
    <form onSubmit={submit} className="panel space-y-3" aria-label="New account" noValidate>
      <h2>New account</h2>
      <FormStatus result={result} />
      <div>
        <label className="label" htmlFor="nu-name">
          Name
        </label>
        <input id="nu-name" className="field" {...register("name")} />
        {err("name")}
      </div>
      <div>
        <label className="label" htmlFor="nu-email">
          E-mail
        </label>
        <input id="nu-email" type="email" className="field" {...register("email")} />
        {err("email")}
      </div>
      <div>
        <label className="label" htmlFor="nu-password">
          First password
        </label>
        <input id="nu-password" type="password" className="field" autoComplete="new-password" {...register("password")} />
        {err("password")}
      </div>
      <div>
        <label className="label" htmlFor="nu-org">
          Organisation
        </label>
        <select id="nu-org" className="field" {...register("organisationId")}>
          <option value="">Choose…</option>
          {organisations.map((o) => (
            <option key={o.id} value={o.id}>
              {o.name}
            </option>
          ))}
        </select>
        {err("organisationId")}
      </div>
      <fieldset>
        <legend className="label">Roles</legend>
        <div className="flex flex-wrap gap-3 text-sm">
          {ROLE_NAMES.map((role) => (
            <label key={role} className="inline-flex items-center gap-1">
              <input type="checkbox" value={role} {...register("roles")} /> {role}
            </label>
          ))}
        </div>
        {err("roles")}
      </fieldset>
      <div>
        <label className="label" htmlFor="nu-limit">
          Approval limit (approvers)
        </label>
        <input id="nu-limit" inputMode="decimal" className="field" {...register("approvalLimit", { setValueAs: formOptionalDecimal })} />
        {err("approvalLimit")}
      </div>
      <button type="submit" className="btn" disabled={pending}>
        {pending ? "Creating…" : "Create account"}
      </button>
    </form>
  );
}

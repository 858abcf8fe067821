"use client";

import { startTransition, useActionState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { signInSchema, type SignInInput } from "@/lib/validation/auth";
import { signInAction, type SignInState } from "./actions";

export function SignInForm({ next }: { next?: string }) {
  const [state, formAction, pending] = useActionState<SignInState, FormData>(signInAction, {});
  const {
    register,
    formState: { errors },
    handleSubmit,
  } = useForm<SignInInput>({ resolver: zodResolver(signInSchema), defaultValues: { email: state.values?.email ?? "" } });
  const fieldError = (name: keyof SignInInput) => errors[name]?.message ?? state.fieldErrors?.[name]?.[0];

  return (
    <form
      onSubmit={handleSubmit((values) => {
        const data = new FormData();
        data.set("email", values.email);
        data.set("password", values.password);
        data.set("next", next ?? "");
        startTransition(() => formAction(data));
      })}
      className="space-y-4"
      noValidate
    >
      {state.message ? (
        <p role="alert" className="rounded-md border border-verdict-impossible/40 bg-verdict-impossible/5 px-3 py-2 text-sm text-verdict-impossible">
          {state.message}
        </p>
      ) : null}
      <div>
        <label htmlFor="email" className="label">
          E-mail
        </label>
        <input id="email" type="email" autoComplete="username" className="field" {...register("email")} />
        {fieldError("email") ? <p className="mt-1 text-xs text-verdict-impossible">{fieldError("email")}</p> : null}
      </div>
      <div>
        <label htmlFor="password" className="label">
          Password
        </label>
        <input id="password" type="password" autoComplete="current-password" className="field" {...register("password")} />
        {fieldError("password") ? <p className="mt-1 text-xs text-verdict-impossible">{fieldError("password")}</p> : null}
      </div>
      <button type="submit" className="btn w-full justify-center" disabled={pending}>
        {pending ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}

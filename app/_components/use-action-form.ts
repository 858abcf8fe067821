"use client";

import { useState, useTransition, type BaseSyntheticEvent, type ReactNode } from "react";
import { useForm, type DefaultValues, type FieldValues, type Path, type Resolver, type UseFormReturn } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { ZodType } from "zod";
import type { FormResult } from "@/lib/server/form-action";
import { useConfirm, type ConfirmRequest } from "./confirm";

export interface ActionFormOptions<Input extends FieldValues, Output> {
  /** The zod schema the server action parses with (its input is what the fields hold, its output what is sent), or a resolver built on it. */
  schema: ZodType<Output, Input> | Resolver<Input, unknown, Output>;
  defaultValues: DefaultValues<Input>;
  /** Calls the server action with the checked values (and whatever ids it is bound to). */
  send: (values: Output) => Promise<FormResult>;
  /** Empty the fields again once the server took them. */
  resetOnSuccess?: boolean;
  /** After a success: close a dialog, tell the page to reload. */
  onSuccess?: () => void;
  /** Ask before sending (an irreversible step); a function decides from the values, null sends at once. */
  confirm?: ConfirmRequest | ((values: Output) => ConfirmRequest | null);
  /** The status line when the fields fail the schema here; without it only the fields say so. */
  invalidMessage?: string;
}

export type ActionForm<Input extends FieldValues, Output> = UseFormReturn<Input, unknown, Output> & {
  /** The form's onSubmit: checks the schema, asks if asked to, sends, then settles the result on the form. */
  submit: (event?: BaseSyntheticEvent) => Promise<void>;
  /** The server's last answer (or the invalid message), for FormStatus. */
  result: FormResult;
  pending: boolean;
  /** The confirmation dialog; render it inside the form when `confirm` is given. */
  dialog: ReactNode;
};

/**
 * The plumbing every form shares: react-hook-form with the server's zod schema, the server action
 * run in a transition, and its FormResult settled on the form: the server's field messages show
 * under the fields like the schema's own, and a success may reset the form and call onSuccess.
 */
export function useActionForm<Input extends FieldValues, Output>({
  schema,
  defaultValues,
  send,
  resetOnSuccess,
  onSuccess,
  confirm,
  invalidMessage,
}: ActionFormOptions<Input, Output>): ActionForm<Input, Output> {
  const [result, setResult] = useState<FormResult>({});
  const [pending, startTransition] = useTransition();
  const { ask, dialog } = useConfirm();
  const resolver = typeof schema === "function" ? schema : (zodResolver(schema) as Resolver<Input, unknown, Output>);
  const methods = useForm<Input, unknown, Output>({ resolver, defaultValues });
  const { handleSubmit, setError, reset } = methods;

  const run = (values: Output) =>
    startTransition(async () => {
      const outcome = await send(values);
      setResult(outcome);
      for (const [field, messages] of Object.entries(outcome.fieldErrors ?? {})) setError(field as Path<Input>, { message: messages[0] });
      if (!outcome.ok) return;
      if (resetOnSuccess) reset();
      onSuccess?.();
    });
  const submit = handleSubmit(
    (values) => {
      const request = typeof confirm === "function" ? confirm(values) : confirm;
      if (request) ask(request, () => run(values));
      else run(values);
    },
    invalidMessage ? () => setResult({ message: invalidMessage }) : undefined,
  );
  return { ...methods, submit, result, pending, dialog };
}

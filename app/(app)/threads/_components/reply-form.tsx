"use client";

import { useState, useTransition } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { messageSchema, type MessageInput } from "@/lib/validation/review";
import type { FormResult } from "@/lib/server/form-action";
import { FieldError, FormStatus } from "@/app/_components/form-status";
import { postMessageAction } from "../actions";

export function ReplyForm({ threadId, path, subject }: { threadId: string; path: string; subject: string }) {
  const [result, setResult] = useState<FormResult>({});
  const [pending, startTransition] = useTransition();
  const { register, handleSubmit, reset, formState } = useForm<MessageInput>({ resolver: zodResolver(messageSchema), defaultValues: { body: "" } });
  const submit = handleSubmit((values) =>
    startTransition(async () => {
      const outcome = await postMessageAction(threadId, path, values);
      setResult(outcome);
      if (outcome.ok) reset();
    }),
  );
  const id = `reply-${threadId}`;
  return (
    <form onSubmit={submit} aria-label={`Reply: ${subject}`} className="mt-3 space-y-2" noValidate>
      <label className="label" htmlFor={id}>
        Reply
      </label>
      <textarea id={id} rows={2} className="field" {...register("body")} />
      <FieldError message={formState.errors.body?.message} />
      <FormStatus result={result} />
      <button type="submit" className="btn-quiet" disabled={pending}>
        {pending ? "Sending…" : "Send reply"}
      </button>
    </form>
  );
}

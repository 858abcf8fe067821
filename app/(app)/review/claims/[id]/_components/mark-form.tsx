"use client";

import { useWatch } from "react-hook-form";
import { MARKS } from "@/db/schema/evaluation";
import { MARK_LABELS } from "@/lib/review/labels";
import { JUSTIFICATION_MIN } from "@/lib/review/marks";
import type { Verdict } from "@/db/schema/offers";
import { markSchema } from "@/lib/validation/review";
import { markClaimAction } from "@/app/(app)/review/actions";
import { FieldError, FormStatus } from "@/app/_components/form-status";
import { useActionForm } from "@/app/_components/use-action-form";

/** No mark is chosen for the engineer; accepting an impossible claim asks for a justification. */
export function MarkForm({ claimId, verdict }: { claimId: string; verdict: Verdict }) {
  const { register, control, formState, submit, result, pending } = useActionForm({
    schema: markSchema,
    defaultValues: { mark: undefined, comment: "", subject: "" },
    send: (values) => markClaimAction(claimId, values),
    resetOnSuccess: true,
  });
  const chosen = useWatch({ control, name: "mark" });
  const overrides = chosen === "accepted" && verdict === "impossible";
  const errors = formState.errors;
  return (
    <form onSubmit={submit} aria-label="Mark this claim" className="space-y-3 border-t border-ink-faint/20 pt-3" noValidate>
      <fieldset>
        <legend className="label">Mark</legend>
        <div className="flex flex-wrap gap-4 text-sm">
          {MARKS.map((m) => (
            <label key={m} className="inline-flex items-center gap-1">
              <input type="radio" value={m} {...register("mark")} /> {MARK_LABELS[m]}
            </label>
          ))}
        </div>
        <FieldError message={errors.mark?.message} />
      </fieldset>
      {chosen === "clarification-requested" ? (
        <div>
          <label className="label" htmlFor="mark-subject">
            Question subject
          </label>
          <input id="mark-subject" className="field" {...register("subject")} />
          <FieldError message={errors.subject?.message} />
        </div>
      ) : null}
      <div>
        <label className="label" htmlFor="mark-comment">
          {chosen === "clarification-requested" ? "Question to the vendor" : overrides ? "Justification" : "Comment"}
          {chosen === "accepted" && !overrides ? " (optional)" : ""}
        </label>
        {overrides ? (
          <p className="text-xs text-ink-soft" id="mark-comment-help">
            The engine found this claim impossible. Accepting it needs a written justification of at least {JUSTIFICATION_MIN} characters, and is flagged on the
            Comparison, the Sign-off tab and the memo.
          </p>
        ) : null}
        <textarea id="mark-comment" rows={3} className="field" aria-describedby={overrides ? "mark-comment-help" : undefined} {...register("comment")} />
        <FieldError message={errors.comment?.message} />
      </div>
      <FormStatus result={result} />
      <button type="submit" className="btn" disabled={pending}>
        {pending ? "Saving…" : "Record mark"}
      </button>
    </form>
  );
}

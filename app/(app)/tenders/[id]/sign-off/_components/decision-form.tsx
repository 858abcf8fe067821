"use client";

import { FieldError, FormStatus } from "@/app/_components/form-status";
import { useActionForm } from "@/app/_components/use-action-form";
import { decisionSchema } from "@/lib/validation/approvals";
import { decideAction } from "../actions";

/** Approve (after a confirmation saying what follows), or return to the buyer with a comment (required for a return). */
export function DecisionForm({ tenderId, summary, onApprove }: { tenderId: string; summary: string; onApprove: string }) {
  const { register, setValue, formState, submit, result, pending, dialog } = useActionForm({
    schema: decisionSchema,
    defaultValues: { decision: "approve", comment: "" },
    send: (values) => decideAction(tenderId, values),
    confirm: (values) => (values.decision === "approve" ? { title: "Approve this recommendation?", consequences: onApprove, action: "Approve" } : null),
    invalidMessage: "Check the comment.",
  });
  const send = (decision: "approve" | "return") => {
    setValue("decision", decision);
    void submit();
  };
  return (
    <form onSubmit={(e) => e.preventDefault()} aria-label="Decision" className="space-y-3" noValidate>
      <p className="text-sm">{summary}</p>
      <div>
        <label className="label" htmlFor="decision-comment">
          Comment (required to return)
        </label>
        <textarea id="decision-comment" rows={3} className="field" {...register("comment")} />
        <FieldError message={formState.errors.comment?.message} />
      </div>
      <FormStatus result={result} />
      <div className="flex gap-2">
        <button type="button" className="btn" disabled={pending} onClick={() => send("approve")}>
          Approve
        </button>
        <button type="button" className="btn-quiet" disabled={pending} onClick={() => send("return")}>
          Return to the buyer
        </button>
      </div>
      {dialog}
      <p className="text-xs text-ink-soft">Your decision is recorded in the ledger with your name and the time; it cannot be undone.</p>
    </form>
  );
}

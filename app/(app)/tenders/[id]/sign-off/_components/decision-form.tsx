"use client";

import { useState, useTransition } from "react";
import type { FormResult } from "@/lib/server/form-action";
import { useConfirm } from "@/app/_components/confirm";
import { FieldError, FormStatus } from "@/app/_components/form-status";
import { decisionSchema } from "@/lib/validation/approvals";
import { fieldErrorsOf } from "@/lib/validation/messages";
import { decideAction } from "../actions";

/** Approve (after a confirmation saying what follows), or return to the buyer with a comment (required for a return). */
export function DecisionForm({ tenderId, summary, onApprove }: { tenderId: string; summary: string; onApprove: string }) {
  const confirm = useConfirm();
  const [comment, setComment] = useState("");
  const [result, setResult] = useState<FormResult>({});
  const [pending, startTransition] = useTransition();
  const send = (decision: "approve" | "return") => {
    const values = { decision, comment };
    const parsed = decisionSchema.safeParse(values);
    if (!parsed.success) return setResult({ message: "Check the comment.", fieldErrors: fieldErrorsOf(parsed.error) });
    startTransition(async () => setResult(await decideAction(tenderId, values)));
  };
  return (
    <form onSubmit={(e) => e.preventDefault()} aria-label="Decision" className="space-y-3" noValidate>
      <p className="text-sm">{summary}</p>
      <div>
        <label className="label" htmlFor="decision-comment">
          Comment (required to return)
        </label>
        <textarea id="decision-comment" rows={3} className="field" value={comment} onChange={(e) => setComment(e.target.value)} />
        <FieldError message={result.fieldErrors?.comment?.[0]} />
      </div>
      <FormStatus result={result} />
      <div className="flex gap-2">
        <button
          type="button"
          className="btn"
          disabled={pending}
          onClick={() => confirm.ask({ title: "Approve this recommendation?", consequences: onApprove, action: "Approve" }, () => send("approve"))}
        >
          Approve
        </button>
        <button type="button" className="btn-quiet" disabled={pending} onClick={() => send("return")}>
          Return to the buyer
        </button>
      </div>
      {confirm.dialog}
      <p className="text-xs text-ink-soft">Your decision is recorded in the ledger with your name and the time; it cannot be undone.</p>
    </form>
  );
}

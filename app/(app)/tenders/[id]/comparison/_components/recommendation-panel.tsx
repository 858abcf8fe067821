"use client";

import { useEffect } from "react";
import { useWatch } from "react-hook-form";
import { DateTime } from "@/app/_components/date-time";
import { FieldError, FormStatus } from "@/app/_components/form-status";
import { useActionForm } from "@/app/_components/use-action-form";
import { formatMoney } from "@/lib/format";
import { formCount, formDecimal } from "@/lib/numbers";
import { valuesDiffer } from "@/lib/approvals/award-value";
import { totalPriceAt, type ScoreSheet, type ScoringInput } from "@/lib/scoring";
import { recommendationSchema, type RecommendationInput } from "@/lib/validation/comparison";
import type { listRecommendations } from "@/lib/server/recommendations";
import { submitRecommendationAction } from "../actions";

/** The tender's recommendations, newest first, as lib/server/recommendations lists them. */
export type Listed = Awaited<ReturnType<typeof listRecommendations>>[number];

/** The recommendation: the latest one's status and, in commercial evaluation, the buyer's form. */
export function RecommendationPanel({
  history,
  ...props
}: {
  tenderId: string;
  input: ScoringInput;
  sheet: ScoreSheet;
  canRecommend: boolean;
  history: Listed[];
  onSubmitted: () => void;
}) {
  return (
    <section className="panel space-y-3" aria-label="Recommendation">
      <h2>Recommendation</h2>
      {history.length ? (
        <ul className="space-y-2 text-sm" aria-label="Recommendations so far">
          {history.map((r) => (
            <li key={r.id}>
              <span className="font-medium">{r.vendorName}</span>, {r.quantity.toLocaleString("en-GB")} units for {formatMoney(r.value, r.currency)}:{" "}
              <span data-status={r.status}>{r.status}</span> (<DateTime value={r.preparedAt} />)
              {r.returns.map((ret) => (
                <p key={ret.decidedAt.toISOString()} className="text-ink-soft">
                  Returned: {ret.comment}
                </p>
              ))}
              {r.withdrawReason ? <p className="text-ink-soft">Withdrawn: {r.withdrawReason}</p> : null}
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-ink-soft">No recommendation yet.</p>
      )}
      {props.canRecommend ? <RecommendationForm {...props} /> : null}
    </section>
  );
}

function RecommendationForm({ tenderId, input, sheet, onSubmitted }: { tenderId: string; input: ScoringInput; sheet: ScoreSheet; onSubmitted: () => void }) {
  const eligible = sheet.offers.filter((o) => !o.disqualified && !o.needsConversion && o.total !== null);
  const { register, formState, setValue, control, submit, result, pending } = useActionForm({
    schema: recommendationSchema,
    defaultValues: { offerId: eligible[0]?.offerId ?? "", quantity: sheet.quantity, value: eligible[0]?.totalPrice ?? 0, justification: "" },
    send: (values) => submitRecommendationAction(tenderId, values),
    onSuccess: onSubmitted,
  });
  const [offerId, typedQuantity, typedValue] = useWatch({ control, name: ["offerId", "quantity", "value"] });
  // The fields hold what setValueAs read from the text: a number, or nothing yet.
  const quantity = Number(typedQuantity);
  const value = Number(typedValue);
  const envelope = input.offers.find((o) => o.id === offerId)?.envelope;
  const computed = envelope && Number.isInteger(quantity) && quantity > 0 ? totalPriceAt(envelope.unitPrice, envelope.priceBreaks, quantity) : null;
  // The award value follows the chosen offer's price at the chosen quantity; a different value needs a reason.
  useEffect(() => {
    if (computed !== null) setValue("value", computed);
  }, [computed, setValue]);
  const differs = computed !== null && Number.isFinite(value) && valuesDiffer(value, computed);
  const beyond = Number.isFinite(quantity) && quantity > sheet.quantity;

  const err = (name: keyof RecommendationInput) => <FieldError message={formState.errors[name]?.message} />;

  return (
    <form onSubmit={submit} className="space-y-3" aria-label="Recommend an award" noValidate>
      <FormStatus result={result} />
      <div className="grid gap-3 md:grid-cols-3">
        <div>
          <label className="label" htmlFor="rec-offer">
            Offer to award
          </label>
          <select id="rec-offer" className="field" {...register("offerId")}>
            {eligible.map((o) => (
              <option key={o.offerId} value={o.offerId}>
                {o.rank}. {o.vendorName} ({o.total?.toFixed(1)} points)
              </option>
            ))}
          </select>
          {err("offerId")}
        </div>
        <div>
          <label className="label" htmlFor="rec-quantity">
            Quantity (units)
          </label>
          <input id="rec-quantity" inputMode="numeric" className="field tabular-nums" {...register("quantity", { setValueAs: formCount })} />
          {err("quantity")}
        </div>
        <div>
          <label className="label" htmlFor="rec-value">
            Award value ({sheet.currency})
          </label>
          <input id="rec-value" inputMode="decimal" className="field tabular-nums" {...register("value", { setValueAs: formDecimal })} />
          {computed !== null ? (
            <p className="mt-1 text-xs text-ink-soft">The offer&apos;s prices give {formatMoney(computed, sheet.currency)} for this quantity.</p>
          ) : null}
          {err("value")}
        </div>
      </div>
      {beyond ? (
        <div>
          <label className="label" htmlFor="rec-quantity-reason">
            Why more units than the tender&apos;s {sheet.quantity.toLocaleString("en-GB")}
          </label>
          <textarea id="rec-quantity-reason" rows={2} className="field" {...register("quantityReason")} />
          {err("quantityReason")}
        </div>
      ) : null}
      {differs ? (
        <div>
          <label className="label" htmlFor="rec-value-reason">
            Why the award value differs from the offer&apos;s prices
          </label>
          <textarea id="rec-value-reason" rows={2} className="field" {...register("valueReason")} />
          {err("valueReason")}
        </div>
      ) : null}
      <div>
        <label className="label" htmlFor="rec-justification">
          Justification
        </label>
        <textarea id="rec-justification" rows={4} className="field" {...register("justification")} />
        {err("justification")}
      </div>
      <button type="submit" className="btn" disabled={pending || eligible.length === 0}>
        {pending ? "Submitting…" : "Submit recommendation"}
      </button>
    </form>
  );
}

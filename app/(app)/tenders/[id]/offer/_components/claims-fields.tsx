"use client";

import { useFormContext, useWatch } from "react-hook-form";
import { errorAt, FieldError } from "@/app/(app)/tenders/_components/field-error";
import { formatCondition } from "@/lib/format";
import type { ChannelModel } from "@/lib/offers";
import type { OfferFormValues } from "@/lib/validation/offer";
import { formDecimal, formOptionalDecimal } from "@/lib/numbers";
import { SensitivityClaimRow } from "./sensitivity-fields";

/** An operating point as the offer form needs it (a point stated in dBm carries its sensitivity terms). */
export type OfferPoint = { label: string; value: number; sensitivity?: { bitRate: number; payloadBits: number; targetPer: number } | null };

function ClaimRow({ index, label, condition, allowNcg }: { index: number; label: string; condition: string; allowNcg: boolean }) {
  const { register, control, formState } = useFormContext<OfferFormValues>();
  const metric = useWatch({ control, name: `claims.${index}.metric` });
  const err = (field: string) => errorAt(formState.errors, `claims.${index}.${field}`);
  const id = (field: string) => `claim-${index}-${field}`;
  return (
    <fieldset className="grid gap-2 md:grid-cols-[1fr_10rem_10rem_12rem]" aria-label={`Claim at ${label}`}>
      <legend className="sr-only">Claim at {label}</legend>
      <input type="hidden" {...register(`claims.${index}.pointIndex`, { valueAsNumber: true })} />
      <div className="text-sm">
        <div className="font-medium">{label}</div>
        <div className="text-xs text-ink-soft">{condition}</div>
      </div>
      <div>
        <label className="label" htmlFor={id("metric")}>
          Metric
        </label>
        <select id={id("metric")} className="field" {...register(`claims.${index}.metric`)}>
          <option value="bler">BLER (frame error rate)</option>
          <option value="ber">BER (post-decoder)</option>
          {allowNcg ? <option value="ncg">Net coding gain (dB)</option> : null}
        </select>
        <FieldError id={`${id("metric")}-error`} message={err("metric")} />
      </div>
      <div>
        <label className="label" htmlFor={id("value")}>
          {metric === "ncg" ? "Gain (dB)" : "Claimed value"}
        </label>
        <input
          id={id("value")}
          className="field tabular-nums"
          inputMode="decimal"
          aria-invalid={Boolean(err("value"))}
          aria-describedby={`${id("value")}-error`}
          {...register(`claims.${index}.value`, { setValueAs: formDecimal })}
        />
        <FieldError id={`${id("value")}-error`} message={err("value")} />
      </div>
      {metric === "ncg" ? (
        <div>
          <label className="label" htmlFor={id("out")}>
            Output BER of the gain
          </label>
          <input
            id={id("out")}
            className="field tabular-nums"
            inputMode="decimal"
            placeholder="e.g. 1e-15"
            aria-describedby={`${id("out")}-error`}
            {...register(`claims.${index}.ncgOutputBer`, { setValueAs: formOptionalDecimal })}
          />
          <FieldError id={`${id("out")}-error`} message={err("ncgOutputBer")} />
        </div>
      ) : null}
    </fieldset>
  );
}

/** One claim per operating point of the tender: the points are the buyer's, the claims the vendor's. */
export function ClaimsFields({ model, points }: { model: ChannelModel; points: OfferPoint[] }) {
  const { formState } = useFormContext<OfferFormValues>();
  return (
    <section className="space-y-3" aria-label="Claims">
      <h3>Claims, one per operating point</h3>
      <p className="text-xs text-ink-soft">Probabilities in scientific notation are welcome (1e-5). The verdict is computed when you submit.</p>
      {points.map((point, i) =>
        point.sensitivity ? (
          <SensitivityClaimRow key={i} index={i} point={point} />
        ) : (
          <ClaimRow key={i} index={i} label={point.label} condition={formatCondition(model, point.value)} allowNcg={model !== "bec"} />
        ),
      )}
      <FieldError id="claims-error" message={errorAt(formState.errors, "claims")} />
    </section>
  );
}

"use client";

import { useFieldArray, useFormContext, useWatch } from "react-hook-form";
import { CHANNEL_LABELS } from "@/lib/format";
import { formCount, formDecimal } from "@/lib/numbers";
import { CONDITION_RANGES, DEFAULT_ASSUMED_NF_DB, SENSITIVITY_RANGE, type TenderFormValues } from "@/lib/validation/tender";
import { errorAt, FieldError } from "./field-error";

/** A new point stated as an input level: a buyer's typical low-rate telemetry link, to be edited. */
const SENSITIVITY_START = { bitRate: 1200, payloadBits: 160, targetPer: 1e-2 };

/** The three numbers of a point stated as an input level, with their units. */
function SensitivityInputs({ i }: { i: number }) {
  const { register, formState } = useFormContext<TenderFormValues>();
  const input = (name: "bitRate" | "payloadBits" | "targetPer", label: string, setValueAs: (v: unknown) => unknown) => {
    const path = `operatingPoints.${i}.sensitivity.${name}` as const;
    const error = errorAt(formState.errors, path);
    return (
      <div>
        <label className="text-xs text-ink-soft" htmlFor={`op-${i}-${name}`}>
          {label}
        </label>
        <input
          id={`op-${i}-${name}`}
          className="field tabular-nums"
          inputMode="decimal"
          aria-invalid={Boolean(error)}
          aria-describedby={`op-${i}-${name}-error`}
          {...register(path, { setValueAs })}
        />
        <FieldError id={`op-${i}-${name}-error`} message={error} />
      </div>
    );
  };
  return (
    <div className="col-span-full grid gap-2 pl-4 md:grid-cols-3">
      {input("bitRate", "Information bit rate (bit/s)", formDecimal)}
      {input("payloadBits", "Payload (bits per packet)", formCount)}
      {input("targetPer", "Packet error rate at most", formDecimal)}
    </div>
  );
}

/** One row per channel condition the buyer cares about; the unit follows the channel model (or dBm for a sensitivity point). */
export function OperatingPointsFields() {
  const { control, register, formState, setValue } = useFormContext<TenderFormValues>();
  const { fields, append, remove } = useFieldArray({ control, name: "operatingPoints" });
  const model = useWatch({ control, name: "channelModel" }) ?? "bsc";
  const points = useWatch({ control, name: "operatingPoints" }) ?? [];
  const channel = CHANNEL_LABELS[model];
  const unit = channel.unit ? ` (${channel.unit})` : "";
  const errors = formState.errors;
  const soft = model === "biawgn";
  const nfError = errorAt(errors, "assumedNoiseFigureDb");

  return (
    <fieldset className="space-y-2">
      <legend className="label">Operating points</legend>
      <p className="text-xs text-ink-soft">
        Each point: a name and the {channel.parameter}
        {unit}; {CONDITION_RANGES[model].words}.
        {soft
          ? ` Or state a point as a receiver's input level (dBm) at an information bit rate, payload and packet error rate; ${SENSITIVITY_RANGE.words}.`
          : ""}
      </p>
      {fields.map((field, i) => {
        const labelError = errorAt(errors, `operatingPoints.${i}.label`);
        const valueError = errorAt(errors, `operatingPoints.${i}.value`);
        const inDbm = soft && Boolean(points[i]?.sensitivity);
        const valueWords = inDbm ? "input level (dBm)" : `${channel.parameter}${unit}`;
        return (
          <div
            key={field.id}
            className={`grid items-start gap-2 ${soft ? "grid-cols-1 sm:grid-cols-[1fr_11rem_12rem_auto]" : "grid-cols-1 sm:grid-cols-[1fr_12rem_auto]"}`}
            role="group"
            aria-label={`Operating point ${i + 1}`}
          >
            <div>
              <label className="sr-only" htmlFor={`op-${i}-label`}>
                Point {i + 1} name
              </label>
              <input
                id={`op-${i}-label`}
                className="field"
                placeholder="e.g. Storm fade"
                aria-invalid={Boolean(labelError)}
                aria-describedby={`op-${i}-label-error`}
                {...register(`operatingPoints.${i}.label`)}
              />
              <FieldError id={`op-${i}-label-error`} message={labelError} />
            </div>
            {soft ? (
              <div>
                <label className="sr-only" htmlFor={`op-${i}-form`}>
                  Point {i + 1} stated as
                </label>
                <select
                  id={`op-${i}-form`}
                  className="field"
                  value={inDbm ? "dbm" : "ebn0"}
                  onChange={(e) => {
                    const dbm = e.target.value === "dbm";
                    setValue(`operatingPoints.${i}.sensitivity`, dbm ? { ...SENSITIVITY_START } : null, { shouldDirty: true });
                    setValue(`operatingPoints.${i}.value`, dbm ? -120 : 3, { shouldDirty: true });
                  }}
                >
                  <option value="ebn0">Eb/N0 (dB)</option>
                  <option value="dbm">Input level (dBm)</option>
                </select>
              </div>
            ) : null}
            <div>
              <label className="sr-only" htmlFor={`op-${i}-value`}>
                Point {i + 1} {valueWords}
              </label>
              <div className="flex items-center gap-1">
                <input
                  id={`op-${i}-value`}
                  className="field tabular-nums"
                  inputMode="decimal"
                  aria-invalid={Boolean(valueError)}
                  aria-describedby={`op-${i}-value-error`}
                  {...register(`operatingPoints.${i}.value`, { setValueAs: formDecimal })}
                />
                <span className="text-xs text-ink-soft">{inDbm ? "dBm" : (channel.unit ?? "")}</span>
              </div>
              <FieldError id={`op-${i}-value-error`} message={valueError} />
            </div>
            <button type="button" className="btn-quiet" onClick={() => remove(i)} aria-label={`Remove point ${i + 1}`}>
              Remove
            </button>
            {inDbm ? <SensitivityInputs i={i} /> : null}
          </div>
        );
      })}
      <FieldError id="op-error" message={errorAt(errors, "operatingPoints")} />
      <button type="button" className="btn-quiet" onClick={() => append({ label: "", value: model === "biawgn" ? 3 : 1e-3 })}>
        Add operating point
      </button>
      {soft ? (
        <div className="max-w-md">
          <label className="label" htmlFor="t-assumedNoiseFigureDb">
            Assumed receiver noise figure (dB)
          </label>
          <input
            id="t-assumedNoiseFigureDb"
            className="field tabular-nums"
            inputMode="decimal"
            aria-invalid={Boolean(nfError)}
            aria-describedby="t-assumedNoiseFigureDb-error"
            {...register("assumedNoiseFigureDb", { setValueAs: formDecimal })}
          />
          <p className="mt-1 text-xs text-ink-muted">
            Used to judge plausibility where a vendor states no noise figure (e.g. {DEFAULT_ASSUMED_NF_DB} dB); impossibility is always judged at the
            vendor&apos;s stated figure or 0 dB, an ideal receiver.
          </p>
          <FieldError id="t-assumedNoiseFigureDb-error" message={nfError} />
        </div>
      ) : null}
    </fieldset>
  );
}

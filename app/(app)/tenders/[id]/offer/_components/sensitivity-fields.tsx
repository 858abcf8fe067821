"use client";

import { useState } from "react";
import { useFieldArray, useFormContext } from "react-hook-form";
import { errorAt, FieldError } from "@/app/(app)/tenders/_components/field-error";
import { formatSci } from "@/lib/format";
import { formDecimal, formOptionalCount, formOptionalDecimal } from "@/lib/numbers";
import { CURVE_CSV_HELP, CURVE_METRIC_WORDS, CURVE_UNIT_WORDS, MAX_CURVE_POINTS, parseCurveCsv, type CurveCsvReport } from "@/lib/offers/radio";
import type { OfferFormValues } from "@/lib/validation/offer";
import { ScrollBox } from "@/app/_components/scroll-box";

type Point = { label: string; value: number; sensitivity?: { bitRate: number; payloadBits: number; targetPer: number } | null };

/** The vendor's waterfall: typed rows, or a CSV file read in the browser and previewed before it replaces them. */
function CurveFields({ index }: { index: number }) {
  const { control, register, formState } = useFormContext<OfferFormValues>();
  const { fields, append, remove, replace } = useFieldArray({ control, name: `claims.${index}.sensitivity.curve` as `claims.0.sensitivity.curve` });
  const [preview, setPreview] = useState<CurveCsvReport | null>(null);
  const base = `claims.${index}.sensitivity.curve`;
  const id = (j: number, f: string) => `claim-${index}-curve-${j}-${f}`;
  return (
    <fieldset className="col-span-full space-y-2" aria-label="Waterfall curve">
      <legend className="label">Waterfall curve (optional): each point is judged; the worst one counts for the claim</legend>
      {fields.length ? (
        <ScrollBox label="Waterfall curve points">
          <table className="data-table">
            <thead>
              <tr>
                <th>#</th>
                <th>x</th>
                <th>Unit</th>
                <th>Metric</th>
                <th>Error rate</th>
                <th>
                  <span className="sr-only">Remove</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {fields.map((field, j) => (
                <tr key={field.id} data-curve-point={j + 1}>
                  <td className="tabular-nums">{j + 1}</td>
                  <td>
                    <label className="sr-only" htmlFor={id(j, "x")}>
                      Curve point {j + 1} x
                    </label>
                    <input
                      id={id(j, "x")}
                      className="field tabular-nums w-20 sm:w-28"
                      inputMode="decimal"
                      {...register(`${base}.${j}.x` as `claims.0.sensitivity.curve.0.x`, { setValueAs: formDecimal })}
                    />
                    <FieldError id={`${id(j, "x")}-error`} message={errorAt(formState.errors, `${base}.${j}.x`)} />
                  </td>
                  <td>
                    <label className="sr-only" htmlFor={id(j, "unit")}>
                      Curve point {j + 1} unit
                    </label>
                    <select id={id(j, "unit")} className="field" {...register(`${base}.${j}.unit` as `claims.0.sensitivity.curve.0.unit`)}>
                      <option value="dBm">{CURVE_UNIT_WORDS.dBm}</option>
                      <option value="ebn0Db">{CURVE_UNIT_WORDS.ebn0Db}</option>
                    </select>
                  </td>
                  <td>
                    <label className="sr-only" htmlFor={id(j, "metric")}>
                      Curve point {j + 1} metric
                    </label>
                    <select id={id(j, "metric")} className="field" {...register(`${base}.${j}.metric` as `claims.0.sensitivity.curve.0.metric`)}>
                      <option value="per">PER</option>
                      <option value="bler">BLER</option>
                      <option value="ber">BER</option>
                    </select>
                  </td>
                  <td>
                    <label className="sr-only" htmlFor={id(j, "value")}>
                      Curve point {j + 1} error rate
                    </label>
                    <input
                      id={id(j, "value")}
                      className="field tabular-nums w-20 sm:w-28"
                      inputMode="decimal"
                      {...register(`${base}.${j}.value` as `claims.0.sensitivity.curve.0.value`, { setValueAs: formDecimal })}
                    />
                    <FieldError id={`${id(j, "value")}-error`} message={errorAt(formState.errors, `${base}.${j}.value`)} />
                  </td>
                  <td>
                    <button type="button" className="btn-quiet" onClick={() => remove(j)} aria-label={`Remove curve point ${j + 1}`}>
                      Remove
                    </button>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </ScrollBox>
      ) : null}
      <div className="flex flex-wrap items-center gap-3">
        <button
          type="button"
          className="btn-quiet"
          disabled={fields.length >= MAX_CURVE_POINTS}
          onClick={() => append({ x: undefined as unknown as number, unit: "dBm", metric: "per", value: undefined as unknown as number })}
        >
          Add curve point
        </button>
        <label className="text-sm" htmlFor={`claim-${index}-curve-csv`}>
          Or read a CSV file:
        </label>
        <input
          id={`claim-${index}-curve-csv`}
          type="file"
          accept=".csv,text/csv"
          className="text-sm"
          onChange={async (e) => {
            const file = e.target.files?.[0];
            setPreview(file ? parseCurveCsv(await file.text()) : null);
          }}
        />
      </div>
      <p className="text-xs text-ink-muted">{CURVE_CSV_HELP}</p>
      {preview ? (
        <div className="rounded-md border border-rule p-2 text-sm" role="region" aria-label="Curve file preview">
          <p>
            {preview.points.length} point{preview.points.length === 1 ? "" : "s"} read
            {preview.errors.length ? `, ${preview.errors.length} problem${preview.errors.length === 1 ? "" : "s"}` : ""}.
          </p>
          {preview.errors.length ? (
            <ul className="text-xs text-verdict-impossible">
              {preview.errors.map((m) => (
                <li key={m}>{m}</li>
              ))}
            </ul>
          ) : null}
          {preview.points.length ? (
            <table className="data-table">
              <tbody>
                {preview.points.map((p, j) => (
                  <tr key={j}>
                    <td className="tabular-nums">
                      {p.x} {p.unit === "dBm" ? "dBm" : "dB Eb/N0"}
                    </td>
                    <td className="tabular-nums">
                      {CURVE_METRIC_WORDS[p.metric]} {formatSci(p.value)}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : null}
          <div className="mt-2 flex gap-2">
            <button
              type="button"
              className="btn"
              disabled={preview.points.length === 0 || preview.errors.length > 0}
              onClick={() => {
                replace(preview.points);
                setPreview(null);
              }}
            >
              Use these {preview.points.length} points
            </button>
            <button type="button" className="btn-quiet" onClick={() => setPreview(null)}>
              Discard
            </button>
          </div>
        </div>
      ) : null}
    </fieldset>
  );
}

/** A claim at a point stated in dBm: the receiver sensitivity at the point's bit rate and payload, and what the vendor knows of the receiver. */
export function SensitivityClaimRow({ index, point }: { index: number; point: Point }) {
  const { register, formState } = useFormContext<OfferFormValues>();
  const s = point.sensitivity!;
  const err = (field: string) => errorAt(formState.errors, `claims.${index}.${field}`);
  const id = (field: string) => `claim-${index}-${field.replace(/\./g, "-")}`;
  const input = (field: string, label: string, setValueAs: (v: unknown) => unknown, placeholder?: string) => (
    <div>
      <label className="label" htmlFor={id(field)}>
        {label}
      </label>
      <input
        id={id(field)}
        className="field tabular-nums"
        inputMode="decimal"
        placeholder={placeholder}
        aria-invalid={Boolean(err(field))}
        aria-describedby={`${id(field)}-error`}
        {...register(`claims.${index}.${field}` as `claims.0.value`, { setValueAs })}
      />
      <FieldError id={`${id(field)}-error`} message={err(field)} />
    </div>
  );
  return (
    <fieldset className="grid gap-2 md:grid-cols-4" aria-label={`Claim at ${point.label}`}>
      <legend className="sr-only">Claim at {point.label}</legend>
      <input type="hidden" {...register(`claims.${index}.pointIndex`, { valueAsNumber: true })} />
      <input type="hidden" value="bler" {...register(`claims.${index}.metric`)} />
      <div className="col-span-full text-sm">
        <div className="font-medium">{point.label}</div>
        <div className="text-xs text-ink-soft">
          Required: {point.value} dBm or better at {s.bitRate.toLocaleString("en-GB")} bit/s (information rate), {s.payloadBits}-bit payload, PER ≤{" "}
          {formatSci(s.targetPer)}
        </div>
      </div>
      {input("sensitivity.dbm", "Sensitivity (dBm)", formDecimal, "e.g. -133")}
      {input("value", "At PER", formDecimal)}
      {input("sensitivity.noiseFigureDb", "Noise figure (dB, optional)", formOptionalDecimal, "e.g. 4")}
      <div>
        <label className="label" htmlFor={id("sensitivity.modulation")}>
          Modulation
        </label>
        <select
          id={id("sensitivity.modulation")}
          className="field"
          {...register(`claims.${index}.sensitivity.modulation`, { setValueAs: (v) => (v ? v : null) })}
        >
          <option value="">Not stated</option>
          <option value="bpsk">BPSK</option>
          <option value="qpsk">QPSK (Gray)</option>
        </select>
      </div>
      {input("sensitivity.n", "Code n (bits, optional)", formOptionalCount)}
      {input("sensitivity.k", "Code k (bits, optional)", formOptionalCount, String(s.payloadBits))}
      <p className="col-span-2 self-end text-xs text-ink-muted">
        With n and k the 1959 sphere-packing bound applies too; without them, the least energy to send the {s.payloadBits}-bit payload.
      </p>
      <CurveFields index={index} />
    </fieldset>
  );
}

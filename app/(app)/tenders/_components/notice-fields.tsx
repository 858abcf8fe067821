"use client";

import { useFormContext } from "react-hook-form";
import { DISCLOSURE_WORDS, SCORES_REVEAL } from "@/lib/tenders/disclosure";
import type { TenderFormValues } from "@/lib/validation/tender";
import { errorAt, FieldError } from "./field-error";

/** What the award notices tell the vendors, and how long they may object before the award is final. */
export function NoticeFields() {
  const { register, formState } = useFormContext<TenderFormValues>();
  return (
    <fieldset className="space-y-2">
      <legend className="label">Award notices</legend>
      {(["rank", "rank-and-scores"] as const).map((value) => (
        <label key={value} className="flex items-start gap-2 text-sm">
          <input type="radio" className="mt-1" value={value} {...register("noticeDisclosure")} /> {DISCLOSURE_WORDS[value]}
        </label>
      ))}
      <p className="text-xs text-ink-soft">{SCORES_REVEAL}</p>
      <FieldError id="t-noticeDisclosure-error" message={errorAt(formState.errors, "noticeDisclosure")} />
      <div className="max-w-xs">
        <label className="label" htmlFor="t-standstillDays">
          Standstill period (days)
        </label>
        <input
          id="t-standstillDays"
          className="field tabular-nums"
          type="number"
          min={1}
          max={60}
          step={1}
          aria-invalid={Boolean(errorAt(formState.errors, "standstillDays"))}
          aria-describedby="t-standstillDays-error"
          {...register("standstillDays", { valueAsNumber: true })}
        />
        <p className="mt-1 text-xs text-ink-muted">Vendors may object in writing during these days; the award is final when they end.</p>
        <FieldError id="t-standstillDays-error" message={errorAt(formState.errors, "standstillDays")} />
      </div>
    </fieldset>
  );
}

"use client";

import { useRouter, useSearchParams } from "next/navigation";
import { useState, useTransition } from "react";

const FIELDS = [
  ["level", "Input level (dBm)", "w-36"],
  ["ebn0", "or Eb/N0 (dB)", "w-32"],
  ["rb", "Information bit rate (bit/s)", "w-44"],
  ["nf", "Noise figure (dB)", "w-32"],
  ["payload", "Payload k (bits)", "w-32"],
  ["per", "Target PER", "w-28"],
] as const;
type Key = (typeof FIELDS)[number][0];

/** The sensitivity calculator's inputs; applying them writes them into the address beside the explorer's view. */
export function SensitivityForm({ values: initial }: { values: Record<Key, string> }) {
  const router = useRouter();
  const params = useSearchParams();
  const [pending, startTransition] = useTransition();
  const [values, setValues] = useState(initial);
  const apply = () => {
    const next = new URLSearchParams(params.toString());
    for (const [key] of FIELDS) {
      if (values[key].trim() === "") next.delete(key);
      else next.set(key, values[key].trim());
    }
    startTransition(() => router.push(`/explorer?${next.toString()}`, { scroll: false }));
  };
  return (
    <form
      className="flex flex-wrap items-end gap-4"
      aria-label="Sensitivity"
      onSubmit={(e) => {
        e.preventDefault();
        apply();
      }}
    >
      {FIELDS.map(([key, label, width]) => (
        <div key={key} className={width}>
          <label className="label" htmlFor={`sens-${key}`}>
            {label}
          </label>
          <input
            id={`sens-${key}`}
            className="field"
            inputMode="decimal"
            value={values[key]}
            onChange={(e) => setValues({ ...values, [key]: e.target.value, ...(key === "level" ? { ebn0: "" } : key === "ebn0" ? { level: "" } : {}) })}
          />
        </div>
      ))}
      <button type="submit" className="btn" disabled={pending}>
        {pending ? "Computing…" : "Convert"}
      </button>
    </form>
  );
}

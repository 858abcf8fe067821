"use client";

import { useRouter, useSearchParams } from "next/navigation";
import { useState, useTransition } from "react";
import { EXPLORER_DEFAULTS, type CurveMetric, type ExplorerView } from "@/lib/validation/explorer";

/** The form's texts: an invalid view keeps what was typed, so it can be corrected. */
export interface ExplorerFormValues {
  model: ExplorerView["model"];
  x: string;
  n: string;
  k: string;
  target: string;
  /** A vendor curve to overlay (soft decision only): "Eb/N0:rate" pairs, and the rate's metric. */
  curve: string;
  metric: CurveMetric;
}

const PARAMETER = { bsc: "Raw BER p", bec: "Erasure probability e", biawgn: "Eb/N0 (dB)" } as const;

/** The explorer's inputs; applying them writes the view into the address so it can be shared. */
export function ExplorerForm({ view }: { view: ExplorerFormValues }) {
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  const [model, setModel] = useState(view.model);
  const [values, setValues] = useState({ x: view.x, n: view.n, k: view.k, target: view.target, curve: view.curve, metric: view.metric as string });
  const set = (key: keyof typeof values) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setValues({ ...values, [key]: e.target.value });
  const params = useSearchParams();
  // The explorer's own keys are replaced; others (the sensitivity calculator's) stay in the address.
  const apply = (next = values, nextModel = model) => {
    const query = new URLSearchParams(params.toString());
    for (const [key, value] of Object.entries({ model: nextModel, ...next })) {
      // an empty curve leaves the address (and the metric with it): the view stays short to share
      if ((key === "curve" || key === "metric") && (nextModel !== "biawgn" || next.curve.trim() === "")) query.delete(key);
      else query.set(key, value);
    }
    startTransition(() => router.push(`/explorer?${query.toString()}`, { scroll: false }));
  };

  return (
    <form
      className="panel flex flex-wrap items-end gap-4"
      aria-label="Channel and code"
      onSubmit={(e) => {
        e.preventDefault();
        apply();
      }}
    >
      <div>
        <label className="label" htmlFor="ex-model">
          Channel
        </label>
        <select
          id="ex-model"
          className="field"
          value={model}
          onChange={(e) => {
            const next = e.target.value as ExplorerView["model"];
            const d = EXPLORER_DEFAULTS[next];
            const nextValues = { ...values, x: String(d.x), n: String(d.n), k: String(d.k) };
            setModel(next);
            setValues(nextValues);
            apply(nextValues, next);
          }}
        >
          <option value="bsc">Hard decision (BSC)</option>
          <option value="bec">Erasures (BEC)</option>
          <option value="biawgn">Soft decision (BI-AWGN)</option>
        </select>
      </div>
      <div className="w-40">
        <label className="label" htmlFor="ex-x">
          {PARAMETER[model]}
        </label>
        <input id="ex-x" className="field" inputMode="decimal" value={values.x} onChange={set("x")} />
      </div>
      <div className="w-32">
        <label className="label" htmlFor="ex-n">
          n (bits)
        </label>
        <input id="ex-n" className="field" inputMode="numeric" value={values.n} onChange={set("n")} />
      </div>
      <div className="w-32">
        <label className="label" htmlFor="ex-k">
          k (bits)
        </label>
        <input id="ex-k" className="field" inputMode="numeric" value={values.k} onChange={set("k")} />
      </div>
      <div className="w-32">
        <label className="label" htmlFor="ex-target">
          Target BLER
        </label>
        <input id="ex-target" className="field" inputMode="decimal" value={values.target} onChange={set("target")} />
      </div>
      {model === "biawgn" ? (
        <div className="flex w-full flex-wrap items-end gap-4">
          <div className="min-w-0 flex-1 basis-64">
            <label className="label" htmlFor="ex-curve">
              Vendor curve (Eb/N0 dB : error rate, comma between points)
            </label>
            <input id="ex-curve" className="field" placeholder="e.g. 1.5:1e-2, 2:1e-4, 2.5:1e-6" value={values.curve} onChange={set("curve")} />
          </div>
          <div className="w-32">
            <label className="label" htmlFor="ex-metric">
              Curve states
            </label>
            <select id="ex-metric" className="field" value={values.metric} onChange={set("metric")}>
              <option value="bler">BLER</option>
              <option value="ber">BER</option>
              <option value="per">PER</option>
            </select>
          </div>
        </div>
      ) : null}
      <button type="submit" className="btn" disabled={pending}>
        {pending ? "Computing…" : "Show"}
      </button>
    </form>
  );
}

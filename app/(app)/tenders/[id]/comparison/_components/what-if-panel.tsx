"use client";

import { useMemo, useState } from "react";
import { buildScoreSheet, CRITERIA, CRITERION_LABELS, type ScoreSheet, type ScoringInput, type ScoringWeights } from "@/lib/scoring";
import { whatIfWeightsSchema } from "@/lib/validation/comparison";

type Draft = Record<keyof ScoringWeights, string>;
const toDraft = (w: ScoringWeights): Draft => Object.fromEntries(CRITERIA.map((c) => [c, String(w[c])])) as Draft;

/** Other weights, tried in the browser with the same score functions; the tender's frozen weights never change. */
export function WhatIfPanel({ input, sheet }: { input: ScoringInput; sheet: ScoreSheet }) {
  const [draft, setDraft] = useState<Draft>(() => toDraft(input.tender.weights));
  const parsed = whatIfWeightsSchema.safeParse(Object.fromEntries(CRITERIA.map((c) => [c, draft[c].trim() === "" ? NaN : Number(draft[c])])));
  const whatIf = useMemo(() => (parsed.success ? buildScoreSheet(input, parsed.data) : null), [input, parsed.success, parsed.data]);
  const frozenRank = new Map(sheet.offers.map((o) => [o.offerId, o.rank]));

  return (
    <section className="panel space-y-3" aria-label="What-if weights">
      <h2>What-if weights</h2>
      <p className="rounded-md bg-accent-soft px-3 py-2 text-sm font-medium text-accent-strong" role="note">
        What-if only: the frozen weights of the tender do not change.
      </p>
      <div className="flex flex-wrap items-end gap-3">
        {CRITERIA.map((c) => (
          <div key={c} className="w-28">
            <label className="label" htmlFor={`what-if-${c}`}>
              {CRITERION_LABELS[c]} weight
            </label>
            <input
              id={`what-if-${c}`}
              className="field tabular-nums"
              type="number"
              min={0}
              max={1000}
              step={1}
              value={draft[c]}
              onChange={(e) => setDraft({ ...draft, [c]: e.target.value })}
            />
            <span className="text-xs text-ink-soft">frozen: {input.tender.weights[c]}</span>
          </div>
        ))}
        <button type="button" className="btn-quiet" onClick={() => setDraft(toDraft(input.tender.weights))}>
          Reset to the tender&apos;s weights
        </button>
      </div>
      {!parsed.success ? (
        <p role="alert" className="text-sm text-verdict-impossible">
          {parsed.error.issues[0]?.message ?? "Check the weights."}
        </p>
      ) : null}
      {whatIf ? (
        <table className="data-table" aria-label="What-if ranking">
          <thead>
            <tr>
              <th>What-if rank</th>
              <th>Vendor</th>
              <th className="text-right">What-if total</th>
              <th className="text-right">Rank with frozen weights</th>
            </tr>
          </thead>
          <tbody>
            {whatIf.offers.map((o) => (
              <tr key={o.offerId}>
                <td className="tabular-nums">{o.rank ?? "–"}</td>
                <td>{o.vendorName}</td>
                <td className="text-right tabular-nums">{o.total === null ? "–" : o.total.toFixed(2)}</td>
                <td className="text-right tabular-nums">{frozenRank.get(o.offerId) ?? "–"}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
    </section>
  );
}

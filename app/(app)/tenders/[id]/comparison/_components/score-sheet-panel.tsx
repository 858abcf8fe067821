import { VerdictBadge } from "@/app/_components/verdict-badge";
import { CRITERION_LABELS, type OfferScore, type ScoreSheet } from "@/lib/scoring";

const fixed = (v: number | null, digits = 2) => (v === null ? "–" : v.toFixed(digits));

/** One offer's score sheet: every criterion's raw value, 0..100 score, weight and contribution, then the rule. */
export function ScoreSheetPanel({ offer, sheet }: { offer: OfferScore; sheet: ScoreSheet }) {
  return (
    <section className="panel space-y-3" aria-label={`Score sheet of ${offer.vendorName}`}>
      <div className="flex flex-wrap items-baseline gap-3">
        <h2 className="flex-1">Score sheet: {offer.vendorName}</h2>
        <span className="text-sm">
          Total <strong className="tabular-nums">{fixed(offer.total)}</strong> of 100 · Rank {offer.rank ?? "–"}
        </span>
      </div>
      {offer.flags.length ? (
        <ul className="text-sm text-verdict-impossible" aria-label="Flags">
          {offer.flags.map((f) => (
            <li key={f}>{f}</li>
          ))}
          {offer.confirmedImpossible.map((r) => (
            <li key={r} className="text-ink-soft">
              {r}
            </li>
          ))}
        </ul>
      ) : null}
      <table className="data-table">
        <caption className="sr-only">Criteria of {offer.vendorName}</caption>
        <thead>
          <tr>
            <th>Criterion</th>
            <th>Raw value</th>
            <th className="text-right">Score (0..100)</th>
            <th className="text-right">Weight</th>
            <th className="text-right">Contribution (points)</th>
          </tr>
        </thead>
        <tbody>
          {offer.lines.map((line) => (
            <tr key={line.criterion}>
              <td>{CRITERION_LABELS[line.criterion]}</td>
              <td>{line.rawText}</td>
              <td className="text-right tabular-nums">{fixed(line.normalised)}</td>
              <td className="text-right tabular-nums">
                {line.weight} / {sheet.weightSum}
              </td>
              <td className="text-right tabular-nums">{fixed(line.contribution)}</td>
            </tr>
          ))}
          <tr>
            <td colSpan={4}>Subtotal</td>
            <td className="text-right tabular-nums">{fixed(offer.subtotal)}</td>
          </tr>
          {sheet.rule === "penalty" ? (
            <tr>
              <td colSpan={4}>Penalty for a confirmed impossible claim ({sheet.penaltyPoints} points, floor 0)</td>
              <td className="text-right tabular-nums">{offer.confirmedImpossible.length ? `−${fixed(offer.penalty)}` : "0.00"}</td>
            </tr>
          ) : null}
          <tr className="font-semibold">
            <td colSpan={4}>Total</td>
            <td className="text-right tabular-nums">{fixed(offer.total)}</td>
          </tr>
        </tbody>
      </table>
      <table className="data-table">
        <caption className="label text-left">Technical score by operating point</caption>
        <thead>
          <tr>
            <th>Operating point</th>
            <th>Verdict</th>
            <th>Meets the required residual error</th>
            <th className="text-right">Point score</th>
            <th>Why</th>
          </tr>
        </thead>
        <tbody>
          {offer.points.map((p) => (
            <tr key={p.pointIndex}>
              <td>{p.label}</td>
              <td>{p.verdict ? <VerdictBadge verdict={p.verdict} /> : "no claim"}</td>
              <td>{p.meetsRequirement ? "yes" : "no"}</td>
              <td className="text-right tabular-nums">{fixed(p.score)}</td>
              <td className="text-ink-soft">{p.note}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="text-xs text-ink-soft">
        Contribution = weight × score ÷ sum of weights. Price is {sheet.currency} at {sheet.quantity.toLocaleString("en-GB")} units with the offer&apos;s price
        breaks; price, lead time and warranty are scored against the best offer still in the ranking.
      </p>
    </section>
  );
}

import { VerdictBadge } from "@/app/_components/verdict-badge";
import { formatSci } from "@/lib/format";
import { CURVE_METRIC_WORDS, describeSensitivity, describeWorst, formatDb, formatMarginDb, type RadioClaim } from "@/lib/offers/radio";
import { SENSITIVITY_CAUTION } from "@/lib/cautions";

/** The caution that goes wherever a sensitivity figure and its verdict are shown. */
export function SensitivityCaution() {
  return (
    <p role="note" aria-label="Sensitivity caution" className="text-xs leading-relaxed text-ink-soft" data-caution="sensitivity">
      <strong className="mr-1 font-semibold text-ink">Sensitivity.</strong>
      {SENSITIVITY_CAUTION}
    </p>
  );
}

/** The vendor's line and the worst point with its implied Eb/N0, limit and margin in dB. */
export function SensitivityWorst({ radio, per }: { radio: RadioClaim; per: number }) {
  return (
    <div className="text-xs" data-sensitivity-worst={radio.worst.at === "line" ? "line" : radio.worst.at + 1}>
      <div className="tabular-nums">{describeSensitivity(radio, per, formatSci)}</div>
      <div className="tabular-nums">{describeWorst(radio)}</div>
    </div>
  );
}

/** Every point of a vendor's curve with its verdict, limit and margin. */
export function CurveTable({ radio }: { radio: RadioClaim }) {
  if (radio.curve.length === 0) return null;
  return (
    <table className="data-table" aria-label="Curve points">
      <thead>
        <tr>
          <th>#</th>
          <th>Stated</th>
          <th>Implied Eb/N0</th>
          <th>Limit</th>
          <th>Margin</th>
          <th>Verdict</th>
        </tr>
      </thead>
      <tbody>
        {radio.curve.map((p, j) => (
          <tr key={j} data-curve-point={j + 1}>
            <td className="tabular-nums">{j + 1}</td>
            <td className="tabular-nums">
              {p.x} {p.unit === "dBm" ? "dBm" : "dB Eb/N0"}, {CURVE_METRIC_WORDS[p.metric]} {formatSci(p.value)}
            </td>
            <td className="tabular-nums">{formatDb(p.impliedEbn0Db)}</td>
            <td className="tabular-nums">{formatDb(p.limitEbn0Db)}</td>
            <td className="tabular-nums">{formatMarginDb(p.marginDb)}</td>
            <td>
              <VerdictBadge verdict={p.verdict} />
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

import { claimResultSchema, type ClaimResult } from "@/lib/bounds/schema";
import { formatSci } from "@/lib/format";

/** A probability given by its log10, readable even far below the smallest double. */
const fromLog10 = (l: number | null | undefined) => (l == null ? "–" : l < -300 ? `10^${l.toFixed(1)}` : formatSci(10 ** l));
const rate = (x: number | null | undefined) => (x == null ? "–" : `${x.toFixed(4)} bits per channel use`);
const channelValue = (x: number | null, unit: ClaimResult["thresholds"]["unit"]) =>
  x == null ? "–" : unit === "p" ? `p = ${formatSci(x)}` : unit === "e" ? `e = ${formatSci(x)}` : `${unit === "ebn0Db" ? "Eb/N0" : "Es/N0"} ${x.toFixed(2)} dB`;
const margin = (x: number | null, kind: "ratio" | "dB") =>
  x == null ? "–" : kind === "dB" ? `${x >= 0 ? "+" : ""}${x.toFixed(2)} dB` : `× ${x.toPrecision(3)}`;

function parse(result: unknown): ClaimResult | null {
  const parsed = claimResultSchema.safeParse(result);
  return parsed.success ? parsed.data : null;
}

// A claim the engine did not finish in time is stored with its findings only.
const findingsOnly = claimResultSchema.pick({ findings: true });

/** The findings in words, each with the published result behind it. */
export function ClaimFindings({ result }: { result: unknown }) {
  const parsed = findingsOnly.safeParse(result);
  const r = parsed.success ? parsed.data : null;
  return (
    <section className="panel" aria-label="Findings">
      <h2>Findings</h2>
      {!r ? (
        <p className="text-sm text-ink-soft">The stored result could not be read; re-evaluate the claim.</p>
      ) : (
        <ul className="mt-2 space-y-2 text-sm">
          {r.findings.map((f) => (
            <li
              key={f.code}
              data-severity={f.severity}
              className={f.severity === "violation" ? "text-verdict-impossible" : f.severity === "gap" ? "text-verdict-evidence" : ""}
            >
              {f.message} <span className="block text-xs text-ink-soft">{f.source}</span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

/** The numbers behind the verdict: rate, capacity, bounds, normal approximation, thresholds, margins. */
export function ClaimNumbers({ result }: { result: unknown }) {
  const r = parse(result);
  if (!r) return null;
  const t = r.thresholds;
  const kind = r.margins.channelKind;
  const rows: [string, string][] = [
    ["Code rate", rate(r.rate)],
    ["Capacity at the claimed channel", rate(r.capacity)],
    ["Claimed residual error", `${r.target.metric.toUpperCase()} ${formatSci(r.target.value)} (log10 ${r.target.log10.toFixed(2)})`],
    ["Least possible BLER (converse)", r.converse ? `${fromLog10(r.converse.log10Bler)} (log10 ${r.converse.log10Bler.toFixed(2)})` : "–"],
    ["BLER a random code guarantees (achievability)", r.achievable ? `${fromLog10(r.achievable.log10Bler)} (log10 ${r.achievable.log10Bler.toFixed(2)})` : "–"],
    // On BI-AWGN the converse is Shannon's 1959 bound and the guarantee Gallager's random-coding bound.
    ...(r.spherePacking
      ? ([
          [
            "Least possible BLER, equal-energy codewords (1959 sphere packing)",
            `${fromLog10(r.spherePacking.log10Bler)} (log10 ${r.spherePacking.log10Bler.toFixed(2)})`,
          ],
        ] as [string, string][])
      : []),
    ...(r.gallager?.log10Bler != null
      ? ([["BLER Gallager's random-coding bound guarantees", `${fromLog10(r.gallager.log10Bler)} (log10 ${r.gallager.log10Bler.toFixed(2)})`]] as [
          string,
          string,
        ][])
      : []),
    ["Normal approximation", r.normal ? `BLER ${fromLog10(r.normal.log10Bler)}; best rate ${r.normal.rate.toFixed(4)} bits per channel use` : "–"],
    [
      "Rate gap to the normal approximation",
      r.margins.rateGapBits == null
        ? "–"
        : `${r.margins.rateGapBits.toFixed(4)} bits per channel use (${((r.margins.rateGapFraction ?? 0) * 100).toFixed(2)} %)`,
    ],
  ];
  const thresholds: [string, number | null, number | null, ClaimResult["thresholds"]["unit"]?][] = [
    ["Capacity equals the rate", t.capacity, r.margins.channel.capacity],
    ["Shannon limit with the residual error allowed", t.shannon, null],
    ["Worst channel the converse allows", t.converse, r.margins.channel.converse],
    ["Worst channel achievability guarantees", t.achievable, r.margins.channel.achievable],
    ["Normal approximation", t.normal, r.margins.channel.normal],
  ];
  // The radio limits, in Eb/N0 whatever the claim stated; margins against the Eb/N0 the claim amounts to.
  const claimed = r.implied?.ebn0Db ?? null;
  const against = (limit: number | null | undefined) => (limit == null || claimed == null ? null : limit - claimed);
  if (t.spherePacking != null) thresholds.push(["Least Eb/N0 the 1959 bound allows", t.spherePacking, against(t.spherePacking), "ebn0Db"]);
  if (r.energy?.converseEbn0Db != null)
    thresholds.push(["Least energy per bit for k bits, any modulation", r.energy.converseEbn0Db, against(r.energy.converseEbn0Db), "ebn0Db"]);
  if (r.energy?.achievableEbn0Db != null)
    thresholds.push(["Reached by orthogonal signalling", r.energy.achievableEbn0Db, against(r.energy.achievableEbn0Db), "ebn0Db"]);
  return (
    <section className="panel space-y-3" aria-label="Numbers">
      <h2>The numbers</h2>
      <table className="data-table">
        <tbody>
          {rows.map(([k, v]) => (
            <tr key={k}>
              <th scope="row">{k}</th>
              <td className="tabular-nums">{v}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <table className="data-table" aria-label="Channel thresholds">
        <thead>
          <tr>
            <th>Threshold</th>
            <th>Channel</th>
            <th>Margin against the claimed channel</th>
          </tr>
        </thead>
        <tbody>
          {thresholds.map(([k, v, m, unit]) => (
            <tr key={k}>
              <td>{k}</td>
              <td className="tabular-nums">{channelValue(v, unit ?? t.unit)}</td>
              <td className="tabular-nums">{margin(m, kind)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="text-xs text-ink-soft">
        {kind === "dB" ? "Margins in dB: threshold minus claimed Eb/N0." : "Margins as ratios: threshold over the claimed channel value (above 1 leaves room)."}
      </p>
    </section>
  );
}

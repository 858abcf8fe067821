import type { ClaimResult } from "@/lib/bounds";
import { formatSci } from "@/lib/format";

const unitLabel = { p: "p", e: "e", ebn0Db: "Eb/N0 dB", esn0Db: "Es/N0 dB" } as const;

function threshold(value: number | null, unit: ClaimResult["thresholds"]["unit"]) {
  if (value == null || !Number.isFinite(value)) return "none";
  return unit === "p" || unit === "e" ? `${unit} = ${formatSci(value, 3)}` : `${value.toFixed(3)} dB`;
}

const bler = (b: { log10Bler: number } | null) => (b ? formatSci(10 ** b.log10Bler, 3) : "not computed");

/** The numbers behind a verdict: bounds at n, k and the channel thresholds. */
export function BoundNumbers({ result }: { result: ClaimResult }) {
  const unit = result.thresholds.unit;
  return (
    <section className="panel" aria-label="The numbers">
      <h2>The numbers</h2>
      <table className="data-table mt-2 max-w-3xl">
        <tbody>
          <tr><th>Least possible BLER at n, k (converse)</th><td>{bler(result.converse)}</td></tr>
          <tr><th>Random-coding BLER at n, k (achievable)</th><td>{bler(result.achievable)}</td></tr>
          <tr><th>Normal approximation: BLER at n, k</th><td>{bler(result.normal)}</td></tr>
          <tr><th>Normal approximation: best rate at n and the target</th><td>{result.normal ? `${result.normal.rate.toFixed(4)} bits per channel use` : "—"}</td></tr>
          <tr><th>Worst channel at capacity ({unitLabel[unit]})</th><td>{threshold(result.thresholds.capacity, unit)}</td></tr>
          <tr><th>Worst channel the converse still allows</th><td>{threshold(result.thresholds.converse, unit)}</td></tr>
          <tr><th>Worst channel random coding still guarantees</th><td>{threshold(result.thresholds.achievable, unit)}</td></tr>
          <tr><th>Rate gap to the normal approximation</th><td>{result.margins.rateGapBits == null ? "—" : `${result.margins.rateGapBits.toFixed(4)} bits per channel use (${((result.margins.rateGapFraction ?? 0) * 100).toFixed(1)} %)`}</td></tr>
          <tr><th>Engine version</th><td>{result.engineVersion}</td></tr>
        </tbody>
      </table>
    </section>
  );
}

import { ChannelChart, RateChart, type ChartRun, type VendorCurvePoint } from "@/app/_components/bound-charts";
import { claimResultSchema } from "@/lib/bounds";
import { boundViewOfResult } from "@/lib/explorer";
import { boundCharts } from "@/lib/server/engine";

/**
 * The claim against the bounds at its own n and k, with the same charts as the Bound explorer, its
 * lab runs (upper bounds) where the viewer reads them, and, for a claim that is one point of a
 * vendor's waterfall, the whole curve with each point's stored verdict.
 */
export async function ClaimCharts({ result, runs = [], vendorCurve = [] }: { result: unknown; runs?: ChartRun[]; vendorCurve?: VendorCurvePoint[] }) {
  const parsed = claimResultSchema.safeParse(result);
  const view = parsed.success ? boundViewOfResult(parsed.data) : null;
  if (!view) {
    return (
      <section className="panel" aria-label="Charts">
        <h2>The claim against the bounds</h2>
        <p className="mt-2 text-sm text-ink-soft">
          The offer states a rate without a block length n, so only the asymptotic checks apply and there is no finite-length chart.
        </p>
      </section>
    );
  }
  const { charts, refusal } = await boundCharts(view);
  const query = new URLSearchParams({ model: view.model, x: String(view.x), n: String(view.n), k: String(view.k), target: String(view.target) });
  return (
    <section className="panel space-y-3" aria-label="Charts">
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <h2>The claim against the bounds</h2>
        <a href={`/explorer?${query}`} className="text-sm">
          Open in the Bound explorer
        </a>
      </div>
      {charts ? (
        <div className="grid gap-5 lg:grid-cols-2">
          <ChannelChart charts={charts} runs={runs} vendorCurve={vendorCurve} />
          <RateChart charts={charts} />
        </div>
      ) : (
        <p role="alert" className="text-sm text-verdict-impossible">
          {refusal}
        </p>
      )}
    </section>
  );
}

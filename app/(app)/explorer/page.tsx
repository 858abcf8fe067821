import type { Metadata } from "next";
import { Cautions } from "@/app/_components/cautions";
import { ChannelChart, RateChart } from "@/app/_components/bound-charts";
import { VerdictBadge } from "@/app/_components/verdict-badge";
import { formatSci } from "@/lib/format";
import { CHANNEL_MODELS } from "@/lib/bounds/vocabulary";
import { boundCharts } from "@/lib/server/engine";
import { pageViewer, orPage } from "@/lib/server/pages";
import { authorize } from "@/lib/server/session";
import { CURVE_METRICS, EXPLORER_DEFAULTS, explorerIssues, explorerSchema, paramText, type SearchParams } from "@/lib/validation/explorer";
import { ExplorerForm, type ExplorerFormValues } from "./_components/explorer-form";
import { InputIssues } from "./_components/input-issues";
import { SensitivityPanel } from "./_components/sensitivity-panel";
import { ClaimFindings, ClaimNumbers } from "@/app/_components/claim-numbers";

export const metadata: Metadata = { title: "Bound explorer" };

/** The form keeps what was typed; empty fields show the channel's defaults. */
function formValues(raw: SearchParams): ExplorerFormValues {
  const model = CHANNEL_MODELS.find((m) => m === paramText(raw.model)) ?? "bsc";
  const d = EXPLORER_DEFAULTS[model];
  const or = (v: string, fallback: number) => (v === "" ? String(fallback) : v);
  const metric = CURVE_METRICS.find((m) => m === paramText(raw.metric)) ?? "bler";
  return {
    model,
    x: or(paramText(raw.x), d.x),
    n: or(paramText(raw.n), d.n),
    k: or(paramText(raw.k), d.k),
    target: or(paramText(raw.target), 1e-4),
    curve: paramText(raw.curve),
    metric,
  };
}

export default async function ExplorerPage({ searchParams }: { searchParams: Promise<SearchParams> }) {
  const viewer = await pageViewer();
  await orPage(Promise.resolve().then(() => authorize(viewer, "use", "Bounds")));
  const raw = await searchParams;
  const parsed = explorerSchema.safeParse(raw);
  const view = parsed.success ? parsed.data : null;
  const { charts, refusal } = view ? await boundCharts(view) : { charts: undefined, refusal: undefined };
  return (
    <div className="space-y-5">
      <div>
        <h1>Bound explorer</h1>
        <p className="text-sm text-ink-soft">
          What any code of length n carrying k bits can do on a channel: the least possible block error rate, what a random code is guaranteed to reach, and the
          normal approximation. The view lives in the address: copy it to share.
        </p>
      </div>
      <ExplorerForm view={formValues(raw)} />
      {!parsed.success ? <InputIssues lead="This view cannot be judged until these are corrected:" issues={explorerIssues(parsed.error)} /> : null}
      {refusal !== undefined ? (
        <p role="alert" className="rounded-md border border-verdict-impossible/40 px-3 py-2 text-sm text-verdict-impossible">
          {refusal}
        </p>
      ) : null}
      {charts && view ? (
        <>
          <section className="panel space-y-2" aria-label="Verdict for this point">
            <div className="flex flex-wrap items-center gap-3">
              <VerdictBadge verdict={charts.result.verdict} />
              <span className="text-sm">
                Rate {charts.result.rate?.toFixed(4) ?? "–"} bits per channel use, capacity {charts.result.capacity?.toFixed(4) ?? "–"}; BLER{" "}
                {formatSci(view.target)} at n = {view.n.toLocaleString("en-GB")}.
              </span>
            </div>
          </section>
          <ClaimFindings result={charts.result} />
          <div className="grid gap-5 lg:grid-cols-2">
            <section className="panel space-y-2">
              <h2>Block error rate against the channel</h2>
              <ChannelChart charts={charts} vendorCurve={charts.vendorCurve} />
              {charts.vendorCurve.length > 0 ? (
                <p className="text-xs text-ink-soft">
                  Each vendor point is judged as a claim of this code (n = {view.n.toLocaleString("en-GB")}, k = {view.k.toLocaleString("en-GB")}); a PER counts
                  as a block error rate (one packet, one codeword). The verdict judges only the physical limit.
                </p>
              ) : null}
            </section>
            <section className="panel space-y-2">
              <h2>Best rate against block length at BLER {formatSci(view.target)}</h2>
              <RateChart charts={charts} />
            </section>
          </div>
          <ClaimNumbers result={charts.result} />
        </>
      ) : null}
      <SensitivityPanel raw={raw} />
      <Cautions />
    </div>
  );
}

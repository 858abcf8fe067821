"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { useConfirm } from "@/app/_components/confirm";
import type { Comparison } from "@/lib/server/comparison";
import type { FormResult } from "@/lib/server/form-action";
import { openEnvelopesAction } from "../actions";
import { ComparisonGrid } from "./comparison-grid";
import { RecommendationPanel, type Listed } from "./recommendation-panel";
import { ScoreSheetPanel } from "./score-sheet-panel";
import { WhatIfPanel } from "./what-if-panel";

/**
 * The Comparison tab's body. The page reads the comparison on the server (lib/server/comparison)
 * and passes it here; after a change the page is refreshed, so the data flow is the same as on
 * every other tab. GET /api/v1/tenders/[id]/comparison serves the same object to API clients.
 */
export function ComparisonView({
  tenderId,
  reference,
  data,
  recommendations,
}: {
  tenderId: string;
  reference: string;
  data: Comparison;
  recommendations: Listed[];
}) {
  const router = useRouter();
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const [result, setResult] = useState<FormResult>({});
  const [pending, startTransition] = useTransition();
  const reload = () => router.refresh();

  const confirm = useConfirm();
  const openEnvelopes = () =>
    confirm.ask(
      {
        title: "Open the price envelopes?",
        consequences:
          "Every offer's prices, lead times and warranties become readable to the buying team and are scored. Envelopes cannot be sealed again; the opening goes into the ledger.",
        action: "Open the envelopes",
      },
      () =>
        startTransition(async () => {
          const outcome = await openEnvelopesAction(tenderId);
          setResult(outcome);
          reload();
        }),
    );

  const selected = data.sheet.offers.find((o) => o.offerId === selectedId) ?? null;
  return (
    <div className="space-y-4">
      <section className="panel flex flex-wrap items-center gap-3" aria-label="Envelopes">
        <div className="flex-1 text-sm">
          {data.envelopesOpened ? (
            <p>Envelopes opened. Scores use the weights frozen when the tender opened, recomputed at every load.</p>
          ) : (
            <p>
              Envelopes sealed: prices, lead times and warranties are hidden, so there are no totals or ranks yet.
              {data.tender.technicalSignedAt ? " The technical evaluation is signed." : " They can be opened once an engineer signs the technical evaluation."}
            </p>
          )}
          {result.message ? (
            <p role={result.ok ? "status" : "alert"} className={result.ok ? "text-verdict-plausible" : "text-verdict-impossible"}>
              {result.message}
            </p>
          ) : null}
        </div>
        {data.can.openEnvelopes ? (
          <button type="button" className="btn" onClick={openEnvelopes} disabled={pending}>
            {pending ? "Opening…" : "Open envelopes"}
          </button>
        ) : null}
        <button type="button" className="btn-quiet" onClick={() => startTransition(reload)} disabled={pending}>
          Recompute
        </button>
        {confirm.dialog}
      </section>

      <ComparisonGrid input={data.input} sheet={data.sheet} reference={reference} canExport={data.can.export} onSelect={setSelectedId} />

      {selected ? (
        <ScoreSheetPanel offer={selected} sheet={data.sheet} />
      ) : (
        <p className="text-sm text-ink-soft">Select an offer in the grid to see its score sheet.</p>
      )}

      {data.envelopesOpened ? <WhatIfPanel input={data.input} sheet={data.sheet} /> : null}

      <RecommendationPanel
        tenderId={tenderId}
        input={data.input}
        sheet={data.sheet}
        canRecommend={data.can.recommend}
        history={recommendations}
        onSubmitted={reload}
      />
    </div>
  );
}

import type { Metadata } from "next";
import { forbidden } from "next/navigation";
import { Cautions } from "@/app/_components/cautions";
import { DateTime } from "@/app/_components/date-time";
import { submissionRefusal } from "@/lib/offers";
import { getOffer, getOwnOffer, type OfferView } from "@/lib/server/offers";
import { orPage, pageViewer, pageTender } from "@/lib/server/pages";
import type { TenderWithInvites } from "@/lib/server/tenders";
import type { OfferFormValues } from "@/lib/validation/offer";
import { ClaimVerdicts } from "../offers/_components/claim-verdicts";
import { CodeSummary, DocumentList } from "../offers/_components/offer-card";
import { DocumentUpload } from "./_components/document-upload";
import { OfferForm } from "./_components/offer-form";
import { WithdrawButton } from "./_components/withdraw-button";

export const metadata: Metadata = { title: "Offer form" };

/** The form starts from the current version, or from the tender's own requirement for each point. */
function defaultsFor(tender: TenderWithInvites, current: OfferView | null): OfferFormValues {
  const claimAt = (i: number) => current?.claims.find((c) => c.pointIndex === i);
  return {
    moduleName: current?.moduleName ?? "",
    partNumber: current?.partNumber ?? "",
    code: {
      family: current?.codeFamily ?? "",
      decision: current?.decision ?? (tender.channelModel === "biawgn" ? "soft" : "hard"),
      n: current?.n ?? null,
      k: current?.k ?? null,
      rate: current?.rate ?? null,
      overhead: current?.overhead ?? null,
    },
    claims: tender.operatingPoints.map((point, i) => {
      if (point.sensitivity) {
        const radio = claimAt(i)?.radio;
        return {
          pointIndex: i,
          metric: "bler" as const,
          value: claimAt(i)?.value ?? point.sensitivity.targetPer,
          ncgOutputBer: null,
          sensitivity: radio
            ? {
                dbm: radio.sensitivityDbm,
                noiseFigureDb: radio.noiseFigureDb,
                modulation: radio.modulation,
                n: radio.n,
                k: radio.k,
                curve: radio.curve.map(({ x, unit, metric, value }) => ({ x, unit, metric, value })),
              }
            : { dbm: point.value, noiseFigureDb: null, modulation: null, n: null, k: null, curve: [] },
        };
      }
      return {
        pointIndex: i,
        metric: claimAt(i)?.metric ?? tender.targetMetric,
        value: claimAt(i)?.value ?? tender.targetValue,
        ncgOutputBer: claimAt(i)?.ncgOutputBer ?? null,
      };
    }),
    envelope: {
      unitPrice: current?.unitPrice as number,
      // The tender fixes the currency: the form shows it and sends it.
      currency: tender.currency,
      leadTimeWeeks: current?.leadTimeWeeks as number,
      warrantyMonths: current?.warrantyMonths as number,
      priceBreaks: current?.priceBreaks ?? [],
    },
  };
}

export default async function OfferFormPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await pageViewer();
  // Hiding only: the action and the API authorise every submission themselves.
  if (!viewer.ability.can("submit", "Offer")) forbidden();
  const tender = await pageTender(id);
  const current = await orPage(getOwnOffer(viewer, id));
  const versions = current ? (await orPage(getOffer(viewer, current.id))).versions : [];
  const refusal = submissionRefusal(tender, new Date());
  const live = current?.status === "submitted";

  return (
    <div className="space-y-5">
      <h2>Your offer</h2>
      {refusal ? (
        <p className="panel text-sm" role="note" aria-label="Submissions">
          {refusal}
        </p>
      ) : null}
      {current ? (
        <section className="panel space-y-3" aria-label="Verdicts">
          <div className="flex flex-wrap items-baseline gap-3">
            <h3 className="flex-1">
              Version {current.version}: {current.moduleName}
              {current.status === "withdrawn" ? " (withdrawn)" : ""}
            </h3>
            {live && !refusal ? <WithdrawButton tenderId={id} offerId={current.id} /> : null}
          </div>
          <p className="text-sm">
            <CodeSummary offer={current as OfferView & { codeFamily: string; decision: "hard" | "soft" }} />
          </p>
          <ClaimVerdicts claims={current.claims} model={tender.channelModel} detail />
          <div className="space-y-2">
            <h3 className="label">Documents (kept for every later version)</h3>
            <DocumentList documents={current.documents} />
            {live && !refusal ? <DocumentUpload offerId={current.id} /> : null}
          </div>
          {versions.length > 1 ? (
            <details className="text-sm">
              <summary>Earlier versions</summary>
              <ul>
                {versions
                  .filter((v) => v.id !== current.id)
                  .map((v) => (
                    <li key={v.id}>
                      Version {v.version}, {v.status}, submitted <DateTime value={v.submittedAt} />
                    </li>
                  ))}
              </ul>
            </details>
          ) : null}
        </section>
      ) : null}
      {refusal ? null : (
        <OfferForm
          tenderId={id}
          model={tender.channelModel}
          points={tender.operatingPoints}
          defaults={defaultsFor(tender, current)}
          resubmission={current !== null}
        />
      )}
      <Cautions />
    </div>
  );
}

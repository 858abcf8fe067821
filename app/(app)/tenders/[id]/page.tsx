import type { Metadata } from "next";
import { DISCLOSURE_WORDS } from "@/lib/tenders/disclosure";
import Link from "next/link";
import { DateTime } from "@/app/_components/date-time";
import { CHANNEL_LABELS, formatPoint, formatSci } from "@/lib/format";
import { orPage, pageViewer } from "@/lib/server/pages";
import { getTenderView, tenderSubject } from "@/lib/server/tenders";
import { openingProblems } from "@/lib/tenders/states";
import { WEIGHT_KEYS } from "@/lib/validation/tender";
import { CancelTenderForm, OpenTenderButton } from "./_components/tender-actions";

export const metadata: Metadata = { title: "Tender" };

const WEIGHT_NAMES = { technical: "Technical", evidence: "Evidence", price: "Price", leadTime: "Lead time", warranty: "Warranty" } as const;

export default async function TenderRequirementsPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await pageViewer();
  const tender = await orPage(getTenderView(viewer, id));
  // The buttons follow the abilities on the full record; the server checks again on each action.
  const subject = tenderSubject(tender);
  const canEdit = viewer.ability.can("update", subject);
  const canOpen = viewer.ability.can("open", subject);
  const canCancel = viewer.ability.can("cancel", subject);
  const problems = canOpen ? openingProblems(tender, new Date()) : [];
  const totalWeight = WEIGHT_KEYS.reduce((sum, k) => sum + tender.weights[k], 0);

  return (
    <div className="space-y-5">
      {tender.state === "cancelled" && tender.cancelReason ? (
        <p role="note" className="panel text-sm">
          <strong>Cancelled.</strong> {tender.cancelReason}
        </p>
      ) : null}
      <section className="panel space-y-3" aria-label="Requirements">
        <h2>Requirements</h2>
        {tender.description ? <p className="text-sm">{tender.description}</p> : null}
        <dl className="grid grid-cols-2 gap-x-6 gap-y-2 text-sm md:grid-cols-4">
          <div>
            <dt className="label">Channel</dt>
            <dd>{CHANNEL_LABELS[tender.channelModel].name}</dd>
          </div>
          <div>
            <dt className="label">Residual error required</dt>
            <dd>
              {tender.targetMetric.toUpperCase()} ≤ {formatSci(tender.targetValue)}
            </dd>
          </div>
          <div>
            <dt className="label">Longest frame</dt>
            <dd>{tender.maxFrameBits ? `${tender.maxFrameBits.toLocaleString("en-GB")} bits` : "no limit"}</dd>
          </div>
          {tender.channelModel === "biawgn" ? (
            <div>
              <dt className="label">Assumed receiver noise figure</dt>
              <dd className="tabular-nums">
                {tender.assumedNoiseFigureDb} dB (for plausibility where a vendor states none; impossibility at the vendor&apos;s figure or 0 dB)
              </dd>
            </div>
          ) : null}
          <div>
            <dt className="label">Quantity</dt>
            <dd className="tabular-nums">
              {tender.quantity.toLocaleString("en-GB")} units, priced in {tender.currency}
            </dd>
          </div>
          <div>
            <dt className="label">Closes</dt>
            <dd>
              <DateTime value={tender.closesAt} zone={tender.closesZone} />
            </dd>
          </div>
          {tender.openedAt ? (
            <div>
              <dt className="label">Opened</dt>
              <dd>
                <DateTime value={tender.openedAt} zone={tender.closesZone} />
              </dd>
            </div>
          ) : null}
          <div>
            <dt className="label">If a claim is impossible</dt>
            <dd>{tender.impossibleRule === "disqualify" ? "offer disqualified" : `penalty of ${tender.impossiblePenalty} points`}</dd>
          </div>
          <div>
            <dt className="label">Safety-relevant</dt>
            <dd>{tender.safetyRelevant ? "yes: verifying lab runs and two engineers' sign-off" : "no"}</dd>
          </div>
          <div>
            <dt className="label">Award notices tell each vendor</dt>
            <dd>
              {DISCLOSURE_WORDS[tender.noticeDisclosure]}; standstill of {tender.standstillDays} days before the award is final
            </dd>
          </div>
        </dl>
        <div>
          <h3 className="label mt-2">Operating points</h3>
          {tender.operatingPoints.length === 0 ? <p className="text-sm text-ink-soft">None yet.</p> : null}
          <ul className="text-sm">
            {tender.operatingPoints.map((point) => (
              <li key={point.label}>
                {point.label}: {formatPoint(tender.channelModel, point)}
              </li>
            ))}
          </ul>
        </div>
        <div>
          <h3 className="label mt-2">Scoring weights{tender.state === "draft" ? "" : " (locked)"}</h3>
          <table className="data-table max-w-md">
            <tbody>
              {WEIGHT_KEYS.map((k) => (
                <tr key={k}>
                  <td>{WEIGHT_NAMES[k]}</td>
                  <td className="text-right tabular-nums">{tender.weights[k]}</td>
                  <td className="text-right tabular-nums text-ink-soft">{totalWeight > 0 ? Math.round((tender.weights[k] / totalWeight) * 100) : 0} %</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        {tender.invited.length > 0 ? (
          <div>
            <h3 className="label mt-2">Invited vendors</h3>
            <ul className="text-sm">
              {tender.invited.map((o) => (
                <li key={o.id}>{o.name}</li>
              ))}
            </ul>
          </div>
        ) : null}
      </section>

      {canEdit || canOpen || canCancel ? (
        <section className="panel space-y-4" aria-label="Buyer actions">
          <h2>Actions</h2>
          {canEdit ? (
            <p>
              <Link href={`/tenders/${tender.id}/edit`} className="btn-quiet no-underline">
                Edit
              </Link>
            </p>
          ) : null}
          {canOpen ? (
            <div className="space-y-2">
              {problems.length > 0 ? (
                <ul className="list-disc pl-5 text-sm text-ink-soft" aria-label="Before opening">
                  {problems.map((p) => (
                    <li key={p}>{p}</li>
                  ))}
                </ul>
              ) : (
                <p className="text-sm text-ink-soft">Opening locks the requirements and weights and e-mails the invited vendors.</p>
              )}
              <OpenTenderButton tenderId={tender.id} />
            </div>
          ) : null}
          {canCancel ? <CancelTenderForm tenderId={tender.id} /> : null}
        </section>
      ) : null}
    </div>
  );
}

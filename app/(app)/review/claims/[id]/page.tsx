import type { Metadata } from "next";
import Link from "next/link";
import { Cautions } from "@/app/_components/cautions";
import { DateTime } from "@/app/_components/date-time";
import { VerdictBadge } from "@/app/_components/verdict-badge";
import { formatCondition, formatSci } from "@/lib/format";
import { EVIDENCE_LABELS, MARK_LABELS } from "@/lib/review/labels";
import { acceptedAgainstImpossible, latestMarks } from "@/lib/review/marks";
import { listEvidence } from "@/lib/server/evidence";
import { orPage, pageViewer } from "@/lib/server/pages";
import { getClaimDetail } from "@/lib/server/review";
import { listThreads } from "@/lib/server/threads";
import { ThreadList } from "@/app/(app)/threads/_components/thread-list";
import { ClaimNumbers, ClaimFindings } from "@/app/_components/claim-numbers";
import { ClaimCharts } from "./_components/claim-charts";
import { CurveTable, SensitivityCaution, SensitivityWorst } from "@/app/_components/sensitivity-summary";
import { describeSensitivity, formatDb, formatMarginDb, vendorCurvePoints, type RadioClaim } from "@/lib/offers/radio";
import { EvidencePanel } from "./_components/evidence-panel";
import { MarkForm } from "./_components/mark-form";
import { OpenThreadForm } from "./_components/open-thread-form";

export const metadata: Metadata = { title: "Claim" };

export default async function ClaimPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await pageViewer();
  const detail = await orPage(getClaimDetail(viewer, id));
  const { claim, tender, offer } = detail;
  const runs = detail.evidenceStatus === null ? null : await orPage(listEvidence(viewer, id));
  const threads = viewer.ability.can("list", "Thread") ? await orPage(listThreads(viewer, { claimId: id })) : [];
  const current = latestMarks(detail.marks).get(claim.id);
  const radio = claim.radio as RadioClaim | null;
  const claimed = radio
    ? describeSensitivity(radio, claim.value, formatSci)
    : claim.metric === "ncg"
      ? `net coding gain ${claim.value} dB`
      : `${claim.metric.toUpperCase()} ${formatSci(claim.value)}`;
  return (
    <div className="space-y-5">
      <header className="space-y-1">
        <p className="text-sm text-ink-soft">
          <Link href="/review">Review bench</Link> · <Link href={`/tenders/${tender.id}/review`}>{tender.reference}</Link> {tender.title}
        </p>
        <div className="flex flex-wrap items-center gap-3">
          <h1 className="flex-1">
            {detail.vendorName}: {offer.moduleName}
          </h1>
          <VerdictBadge verdict={claim.verdict} />
        </div>
        <dl className="grid grid-cols-1 gap-x-6 gap-y-1 text-sm sm:grid-cols-2 md:grid-cols-4">
          <div>
            <dt className="label">Operating point</dt>
            <dd>
              {claim.pointLabel}:{" "}
              {radio
                ? `${radio.requiredDbm} dBm required; the line amounts to ${formatCondition(tender.channelModel, claim.channelValue)}`
                : formatCondition(tender.channelModel, claim.channelValue)}
            </dd>
          </div>
          <div>
            <dt className="label">Claimed</dt>
            <dd className="tabular-nums">{claimed}</dd>
          </div>
          <div>
            <dt className="label">Code</dt>
            <dd className="tabular-nums">
              {offer.codeFamily}, {offer.decision} decision{offer.n ? `, n = ${offer.n}` : ""}
              {offer.k ? `, k = ${offer.k}` : ""}
            </dd>
          </div>
          <div>
            <dt className="label">Current mark</dt>
            <dd data-testid="current-mark">
              {current ? MARK_LABELS[current.mark] : "Not marked"}
              {current && acceptedAgainstImpossible({ verdict: claim.verdict, mark: current.mark }) ? (
                <span className="ml-1 font-medium text-verdict-impossible">(against the engine&apos;s verdict)</span>
              ) : null}
            </dd>
          </div>
          {detail.evidenceStatus ? (
            <div>
              <dt className="label">Lab evidence</dt>
              <dd>{EVIDENCE_LABELS[detail.evidenceStatus]}</dd>
            </div>
          ) : null}
          <div>
            <dt className="label">Engine</dt>
            <dd className="text-ink-soft">
              {claim.engineVersion}, <DateTime value={claim.evaluatedAt} />
            </dd>
          </div>
        </dl>
      </header>

      {radio ? (
        <section className="panel space-y-2" aria-label="Sensitivity">
          <h2>Sensitivity and curve</h2>
          <p className="text-sm">
            Required at {claim.pointLabel}: {radio.requiredDbm} dBm at {radio.bitRate.toLocaleString("en-GB")} bit/s (information rate), {radio.payloadBits}-bit
            payload, PER ≤ {formatSci(radio.targetPer)}; the tender assumes a {radio.assumedNoiseFigureDb} dB noise figure where none is stated.
          </p>
          <SensitivityWorst radio={radio} per={claim.value} />
          <p className="text-xs tabular-nums">
            The line alone: implied Eb/N0 {formatDb(radio.line.impliedEbn0Db)}, limit {formatDb(radio.line.limitEbn0Db)}, margin{" "}
            {formatMarginDb(radio.line.marginDb)}. The claim&apos;s verdict is the worst of the line and its curve points; the findings and numbers below are
            the line&apos;s.
          </p>
          <CurveTable radio={radio} />
          <SensitivityCaution />
        </section>
      ) : null}
      <ClaimFindings result={claim.result} />
      <ClaimNumbers result={claim.result} />
      <ClaimCharts
        result={claim.result}
        runs={(runs ?? []).map((r) => ({ x: r.channelValue, upper: r.upper, label: `lab: ${EVIDENCE_LABELS[r.status].toLowerCase()}` }))}
        vendorCurve={radio ? vendorCurvePoints(radio) : undefined}
      />

      <section className="panel" aria-label="Documents">
        <h2>Documents</h2>
        {detail.documents.length === 0 ? (
          <p className="text-sm text-ink-soft">No document attached to this offer.</p>
        ) : (
          <ul className="mt-2 text-sm">
            {detail.documents.map((d) => (
              <li key={d.id} className="flex gap-3 py-0.5">
                <a href={`/api/v1/documents/${d.id}`}>{d.fileName}</a>
                <span className="text-ink-soft">
                  {d.kind === "datasheet" ? "datasheet" : "test report"}, {(d.size / 1024).toFixed(0)} KiB
                </span>
              </li>
            ))}
          </ul>
        )}
      </section>

      <section className="panel space-y-3" aria-label="Marks">
        <h2>Marks</h2>
        {detail.marks.length === 0 ? (
          <p className="text-sm text-ink-soft">No mark yet.</p>
        ) : (
          <table className="data-table">
            <thead>
              <tr>
                <th>When</th>
                <th>Mark</th>
                <th>Comment</th>
              </tr>
            </thead>
            <tbody>
              {detail.marks.map((m) => (
                <tr key={m.id}>
                  <td>
                    <DateTime value={m.markedAt} />
                  </td>
                  <td>{MARK_LABELS[m.mark]}</td>
                  <td>{m.comment}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
        {detail.may.mark ? <MarkForm claimId={claim.id} verdict={claim.verdict} /> : null}
      </section>

      {runs ? <EvidencePanel claim={claim} model={tender.channelModel} runs={runs} mayRecord={detail.may.record} /> : null}

      <section className="panel space-y-3" aria-label="Clarification threads">
        <h2>Clarification threads</h2>
        <ThreadList threads={threads} path={`/review/claims/${claim.id}`} empty="No question asked about this claim." />
        {detail.may.openThread ? <OpenThreadForm claimId={claim.id} /> : null}
      </section>
      <Cautions safety={tender.safetyRelevant} />
    </div>
  );
}

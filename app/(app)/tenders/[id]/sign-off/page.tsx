import type { Metadata } from "next";
import Link from "next/link";
import { Cautions } from "@/app/_components/cautions";
import { DateTime } from "@/app/_components/date-time";
import { TablePanel } from "@/app/_components/table-panel";
import { formatMoney } from "@/lib/format";
import { formatScore } from "@/lib/approvals/score-sheet";
import { getAwardSignOff } from "@/lib/server/award-sign-off";
import { listDeclarableVendors } from "@/lib/server/declarations";
import { orPage, pageViewer } from "@/lib/server/pages";
import { DeclarationForm } from "../review/_components/declaration-form";
import { DecisionForm } from "./_components/decision-form";
import { DecisionsList, STATUS_WORDS } from "./_components/decisions-list";
import { WithdrawForm } from "./_components/withdraw-form";
import { VerdictSummary } from "./_components/verdict-summary";

export const metadata: Metadata = { title: "Sign-off" };

/** The approvers' tab: the recommendation, its scores and verdicts, the memo preview, and the decision. */
export default async function SignOffPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await pageViewer();
  const view = await orPage(getAwardSignOff(viewer, id));
  const zone = view.tender.zone;
  if (!view.recommendation) {
    return (
      <div className="space-y-4">
        {view.canDeclare ? (
          <section className="panel space-y-2" aria-label="Declaration">
            <h2>Declare before you decide</h2>
            <p className="text-sm text-ink-soft">Approvers declare any conflict of interest on a tender before they see its recommendation and offers.</p>
            <DeclarationForm tenderId={id} vendors={await listDeclarableVendors(viewer, id)} />
          </section>
        ) : (
          <p className="panel text-sm text-ink-soft">There is no award recommendation here for you to see{view.declared ? " yet" : ""}.</p>
        )}
        <Cautions safety={view.tender.safetyRelevant} />
      </div>
    );
  }
  const rec = view.recommendation;
  const money = (v: number) => formatMoney(v, rec.currency);
  return (
    <div className="space-y-4">
      <section className="panel space-y-2" aria-label="Recommendation">
        <div className="flex items-baseline justify-between gap-3">
          <h2>Recommendation</h2>
          <span className="text-sm font-medium" data-status={rec.status}>
            {STATUS_WORDS[rec.status]}
          </span>
        </div>
        <p className="text-sm">
          Award to <strong>{rec.vendorName}</strong>, {rec.moduleName}:{" "}
          <span className="tabular-nums">
            {rec.quantity.toLocaleString("en-GB")} units for {money(rec.value)}
          </span>
          .
        </p>
        {rec.deviations.length ? (
          <ul className="space-y-1 text-sm text-verdict-evidence" aria-label="Departures from the offer">
            {rec.deviations.map((d) => (
              <li key={d}>{d}</li>
            ))}
          </ul>
        ) : rec.computedValue !== null ? (
          <p className="text-xs text-ink-soft">The value is the offer&apos;s price for this quantity, price breaks applied.</p>
        ) : null}
        <p className="whitespace-pre-line text-sm">{rec.justification}</p>
        {rec.withdrawReason ? <p className="text-sm">Withdrawn: {rec.withdrawReason}</p> : null}
        <p className="text-xs text-ink-soft">
          Prepared by {rec.preparedBy}, <DateTime value={rec.preparedAt} zone={zone} />
        </p>
        <p className="text-sm" aria-label="Approval rule">
          {rec.rule
            ? `This value needs ${rec.rule.approvalsNeeded} approval${rec.rule.approvalsNeeded > 1 ? "s" : ""} from approvers with a limit of at least ${money(Math.max(rec.rule.minApproverLimit, rec.governingValue))}; ${rec.approvalsGiven} given.`
            : "No approval band covers this value: an admin must add one before anyone can approve."}
        </p>
        {rec.status === "pending" ? (
          <p className="text-xs text-ink-soft">Routed to: {view.routedTo.join(", ") || "no approver holds a limit that covers it"}.</p>
        ) : null}
        {view.stuck ? (
          <p className="text-sm text-verdict-impossible" role="alert" aria-label="Cannot be approved">
            This recommendation cannot be approved as things stand. {view.stuck}
          </p>
        ) : null}
      </section>

      {view.canWithdraw ? (
        <section className="panel print:hidden" aria-label="Withdraw">
          <h2>Withdraw from approval</h2>
          <WithdrawForm tenderId={id} />
        </section>
      ) : null}

      {view.me.allowed ? (
        <section className="panel print:hidden" aria-label="Your decision">
          <h2>Your decision</h2>
          <DecisionForm
            tenderId={id}
            summary={`Approve the award of ${money(rec.value)} to ${rec.vendorName}, or return it to the buyer with a comment.`}
            onApprove={
              view.me.awardsIfApproved
                ? `Yours is the last approval needed: the tender is awarded to ${rec.vendorName} for ${money(rec.value)}, the award memo is issued with its fingerprint, and every vendor is told. This cannot be undone.`
                : `Your approval of ${money(rec.value)} to ${rec.vendorName} is recorded with your name and the time, and counts towards the ${rec.rule?.approvalsNeeded ?? ""} approvals it needs. It cannot be undone.`
            }
          />
        </section>
      ) : view.me.reason && rec.status === "pending" ? (
        <p className="panel text-sm" role="note" aria-label="Why you cannot decide">
          {view.me.reason}
        </p>
      ) : null}

      {view.memo ? (
        <section className="panel space-y-1" aria-label="Award memo">
          <h2>Award memo {view.memo.identifier}</h2>
          <p className="text-sm">
            Issued <DateTime value={view.memo.createdAt} zone={zone} />; {view.memo.size.toLocaleString("en-GB")} bytes.
          </p>
          <p className="text-sm">
            SHA-256 fingerprint:{" "}
            <code className="break-all font-mono text-xs" data-testid="memo-fingerprint">
              {view.memo.sha256}
            </code>
          </p>
          <p className="flex gap-4 text-sm">
            <a href={`/api/v1/tenders/${id}/memo`} download>
              Download the memo (PDF)
            </a>
            <Link href="/memo-check">Check a memo on Memo check</Link>
          </p>
        </section>
      ) : view.canPreview ? (
        <section className="panel space-y-2 print:hidden" aria-label="Memo preview">
          <div className="flex items-baseline justify-between">
            <h2>Memo preview</h2>
            <a href={`/api/v1/tenders/${id}/memo/preview`} target="_blank" rel="noreferrer" className="text-sm">
              Open the preview (PDF)
            </a>
          </div>
          <iframe title="Memo preview" src={`/api/v1/tenders/${id}/memo/preview`} className="h-[32rem] w-full rounded border border-ink-faint/30 bg-white" />
        </section>
      ) : null}

      <TablePanel
        label="Scores"
        title="Scores at the time of the recommendation"
        columns={["Rank", "Vendor", { label: "Total", className: "text-right" }, "Note"]}
        empty="No score sheet was recorded."
        isEmpty={rec.standings.length === 0}
      >
        {rec.standings.map((s) => (
          <tr key={s.vendorName}>
            <td className="tabular-nums">{s.rank ?? "–"}</td>
            <td>{s.vendorName}</td>
            <td className="text-right tabular-nums">{formatScore(s.total)}</td>
            <td className="text-xs text-ink-soft">{s.flags.join("; ")}</td>
          </tr>
        ))}
      </TablePanel>

      <VerdictSummary offers={view.offers ?? []} />

      <DecisionsList decisions={view.decisions ?? []} earlier={view.earlier ?? []} zone={zone} />
      <Cautions safety={view.tender.safetyRelevant} />
    </div>
  );
}

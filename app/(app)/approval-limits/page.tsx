import type { Metadata } from "next";
import { formatMoney } from "@/lib/format";
import { listApprovalBands } from "@/lib/server/approval-bands";
import { orPage, pageViewer } from "@/lib/server/pages";
import { BandForm } from "./_components/band-form";
import { BandsTable } from "./_components/bands-table";

export const metadata: Metadata = { title: "Approval limits" };

/** Value bands: how many approvals an award needs and the least limit each approver must hold. */
export default async function ApprovalLimitsPage() {
  const viewer = await pageViewer();
  const { bands, gaps, warnings } = await orPage(listApprovalBands(viewer));
  const editable = viewer.ability.can("create", "ApprovalLimit");
  return (
    <div className="space-y-5">
      <h1>Approval limits</h1>
      <p className="max-w-3xl text-sm text-ink-soft">
        An award goes to the approvers whose own limit covers its value and reaches the band&apos;s least limit; it needs the band&apos;s number of approvals,
        each from a different person. A recommendation keeps the rule in force when it entered approval: changing a band never changes one already in approval.
        Each approver&apos;s own limit is set on the People page.
      </p>
      <BandsTable bands={bands} editable={editable} />
      {gaps.length ? (
        <p className="text-sm text-verdict-evidence" role="note">
          Not covered: {gaps.map((g) => `${formatMoney(g.from, g.currency)} to ${g.to === null ? "any value" : formatMoney(g.to, g.currency)}`).join("; ")}.
          Awards in a gap cannot be approved.
        </p>
      ) : null}
      {warnings.length ? (
        <div className="space-y-1 text-sm text-verdict-evidence" role="note" aria-label="Bands the approvers cannot meet">
          {warnings.map((w) => (
            <p key={w}>{w}</p>
          ))}
          <p>A recommendation in such a band is refused when the buyer submits it. Raise an approver&apos;s limit or add an approver on the People page.</p>
        </div>
      ) : null}
      {editable ? (
        <section className="panel" aria-label="New band">
          <h2>New band</h2>
          <BandForm />
        </section>
      ) : null}
    </div>
  );
}

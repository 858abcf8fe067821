import { DateTime } from "@/app/_components/date-time";
import type { AwardSignOff } from "@/lib/server/award-sign-off";

type Decision = NonNullable<AwardSignOff["decisions"]>[number];
type Earlier = NonNullable<AwardSignOff["earlier"]>[number];

export const STATUS_WORDS = {
  pending: "Awaiting approval",
  returned: "Returned to the buyer",
  approved: "Approved",
  superseded: "Superseded",
  withdrawn: "Withdrawn by the buyer",
} as const;

function Decisions({ list, zone }: { list: Decision[]; zone: string }) {
  return (
    <ul className="mt-1 space-y-1 text-sm">
      {list.map((d) => (
        <li key={d.id}>
          <strong>{d.name}</strong> {d.decision === "approved" ? "approved" : "returned it"} on <DateTime value={d.decidedAt} zone={zone} />
          {d.comment ? <span className="text-ink-soft">: {d.comment}</span> : null}
        </li>
      ))}
      {list.length === 0 ? <li className="text-ink-soft">No decision yet.</li> : null}
    </ul>
  );
}

/** Decisions grouped by recommendation: those on this one, then each earlier one's under its own heading. */
export function DecisionsList({ decisions, earlier, zone }: { decisions: Decision[]; earlier: Earlier[]; zone: string }) {
  return (
    <section className="panel space-y-3" aria-label="Decisions">
      <div>
        <h2>Decisions on this recommendation</h2>
        <Decisions list={decisions} zone={zone} />
      </div>
      {earlier.length ? (
        <div aria-label="Earlier recommendations" role="group">
          <h3 className="text-sm font-medium">Earlier recommendations (their decisions do not count for this one)</h3>
          {earlier.map((r) => (
            <div key={r.id} className="mt-2 border-l-2 border-ink-faint/30 pl-3 text-ink-soft">
              <p className="text-xs">
                Prepared <DateTime value={r.preparedAt} zone={zone} />: {STATUS_WORDS[r.status]}
                {r.withdrawReason ? ` (${r.withdrawReason})` : ""}
              </p>
              <Decisions list={r.decisions} zone={zone} />
            </div>
          ))}
        </div>
      ) : null}
    </section>
  );
}

import { DateTime } from "@/app/_components/date-time";
import type { getSignoffState } from "@/lib/server/signoff";
import { SAFETY_CAUTION } from "@/lib/cautions";
import { SignoffForm } from "./signoff-form";

type SignoffState = Awaited<ReturnType<typeof getSignoffState>>;

/** The technical sign-off: who signed, when, with their statement; what is still missing; the form when this viewer may sign. */
export function SignoffCard({ tenderId, state }: { tenderId: string; state: SignoffState }) {
  const { check, signatures } = state;
  return (
    <section className="panel space-y-2" aria-label="Technical sign-off">
      <h2>Technical sign-off</h2>
      {state.safetyRelevant ? (
        <p className="text-sm font-medium" role="note" aria-label="Safety-relevant tender">
          {SAFETY_CAUTION}
        </p>
      ) : null}
      {signatures.length > 0 ? (
        <ul className="space-y-1 text-sm" aria-label="Signatures">
          {signatures.map((s) => (
            <li key={s.signedBy}>
              Signed by <strong>{s.name}</strong> on <DateTime value={s.signedAt} />: “{s.statement}”
            </li>
          ))}
        </ul>
      ) : null}
      {state.complete ? null : (
        <>
          <p className="text-sm">
            {check.final} of {check.total} claims have a final mark;{" "}
            {check.openThreads === 0
              ? "no question is waiting"
              : `${check.openThreads} question${check.openThreads === 1 ? " waits" : "s wait"} for an answer or closing`}
            {state.safetyRelevant ? `; ${check.signaturesGiven} of ${check.signaturesNeeded} engineers have signed` : ""}.
          </p>
          {check.reason ? (
            <p className="text-sm" role="alert" aria-label="Why it cannot be signed yet">
              {check.reason}
            </p>
          ) : null}
          {state.maySign && check.ok ? <SignoffForm tenderId={tenderId} /> : null}
          {!state.maySign ? <p className="text-xs text-ink-soft">Only an engineer who declared no conflict on this tender signs it.</p> : null}
        </>
      )}
    </section>
  );
}

import { VerdictBadge } from "@/app/_components/verdict-badge";
import { claimWords, reviewWords } from "@/lib/approvals/memo-content";
import { acceptedAgainstImpossible } from "@/lib/review/marks";
import type { AwardSignOff } from "@/lib/server/award-sign-off";

type Offers = NonNullable<AwardSignOff["offers"]>;

/** Every current offer's claims with the engine's verdict and the engineers' current mark. */
export function VerdictSummary({ offers }: { offers: Offers }) {
  return (
    <section className="panel overflow-x-auto" aria-label="Verdicts per offer">
      <h2>Verdicts per offer</h2>
      <table className="data-table mt-2">
        <thead>
          <tr>
            <th>Vendor</th>
            <th>Module</th>
            <th>Operating point</th>
            <th>Claim</th>
            <th>Verdict</th>
            <th>Mark</th>
          </tr>
        </thead>
        <tbody>
          {offers.flatMap((o) =>
            o.claims.map((c, i) => (
              <tr key={c.id}>
                <td>{i === 0 ? o.vendorName : ""}</td>
                <td>{i === 0 ? o.moduleName : ""}</td>
                <td>{c.point}</td>
                <td className="tabular-nums">{claimWords(c)}</td>
                <td>
                  <VerdictBadge verdict={c.verdict} />
                </td>
                <td
                  className={acceptedAgainstImpossible(c) ? "font-medium text-verdict-impossible" : "text-ink-soft"}
                  data-flag={acceptedAgainstImpossible(c) || undefined}
                >
                  {reviewWords(c)}
                </td>
              </tr>
            )),
          )}
          {offers.length === 0 ? (
            <tr>
              <td colSpan={6} className="text-ink-soft">
                No offer you may see.
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
    </section>
  );
}

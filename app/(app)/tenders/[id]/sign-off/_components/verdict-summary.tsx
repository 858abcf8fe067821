import { TablePanel } from "@/app/_components/table-panel";
import { VerdictBadge } from "@/app/_components/verdict-badge";
import { claimWords, reviewWords } from "@/lib/approvals/memo-content";
import { acceptedAgainstImpossible } from "@/lib/review/marks";
import type { AwardSignOff } from "@/lib/server/award-sign-off";

type Offers = NonNullable<AwardSignOff["offers"]>;

/** Every current offer's claims with the engine's verdict and the engineers' current mark. */
export function VerdictSummary({ offers }: { offers: Offers }) {
  return (
    <TablePanel
      label="Verdicts per offer"
      title="Verdicts per offer"
      columns={["Vendor", "Module", "Operating point", "Claim", "Verdict", "Mark"]}
      empty="No offer you may see."
      isEmpty={offers.length === 0}
    >
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
    </TablePanel>
  );
}

import { CurveTable, SensitivityCaution, SensitivityWorst } from "@/app/_components/sensitivity-summary";
import { VerdictBadge } from "@/app/_components/verdict-badge";
import type { RadioClaim } from "@/lib/offers/radio";
import { formatCondition, formatSci } from "@/lib/format";
import type { ChannelModel } from "@/lib/offers";
import type { OfferView } from "@/lib/server/offers";
import { ScrollBox } from "@/app/_components/scroll-box";

type ClaimView = OfferView["claims"][number];
interface Finding {
  code: string;
  severity: string;
  message: string;
  source: string;
}

/** A claim as the trade states it: "BLER 1e-5", or a net coding gain with its output BER. */
export function describeClaim(claim: Pick<ClaimView, "metric" | "value" | "ncgOutputBer">): string {
  if (claim.metric === "ncg") return `NCG ${claim.value} dB at output BER ${formatSci(claim.ncgOutputBer ?? Number.NaN)}`;
  return `${claim.metric.toUpperCase()} ${formatSci(claim.value)}`;
}

/**
 * Each operating point's claim with its verdict and the finding that decided it; with `detail`,
 * every finding and the published result behind it (what a vendor reads to correct a typo).
 */
export function ClaimVerdicts({ claims, model, detail = false }: { claims: ClaimView[]; model: ChannelModel; detail?: boolean }) {
  if (claims.length === 0) return <p className="text-sm text-ink-soft">No claims to show.</p>;
  const radios = claims.some((c) => c.radio);
  return (
    <>
      <ScrollBox label="Verdicts by operating point">
        <table className="data-table min-w-[36rem]">
          <thead>
            <tr>
              <th>Operating point</th>
              <th>Claim</th>
              <th>Verdict</th>
              <th>{detail ? "Findings" : "Key finding"}</th>
            </tr>
          </thead>
          <tbody>
            {claims.map((claim) => {
              const findings = (claim.result as { findings?: Finding[] }).findings ?? [];
              const shown = detail ? findings : claim.keyFinding ? [claim.keyFinding] : [];
              return (
                <tr key={claim.id} data-claim={claim.pointLabel}>
                  <td>
                    {claim.pointLabel}
                    <div className="text-xs text-ink-soft">{formatCondition(model, claim.channelValue)}</div>
                  </td>
                  <td className="tabular-nums">
                    {claim.radio ? (
                      <SensitivityWorst radio={claim.radio as RadioClaim} per={claim.value} />
                    ) : (
                      <span className="whitespace-nowrap">{describeClaim(claim)}</span>
                    )}
                    {claim.radio && detail ? (
                      <details className="mt-1 text-xs">
                        <summary>Curve, {(claim.radio as RadioClaim).curve.length} points</summary>
                        <CurveTable radio={claim.radio as RadioClaim} />
                      </details>
                    ) : null}
                  </td>
                  <td>
                    <VerdictBadge verdict={claim.verdict} />
                  </td>
                  <td className="text-xs">
                    <ul className="space-y-1">
                      {shown.map((f) => (
                        <li key={f.code}>
                          {f.message}
                          {detail ? <span className="block text-ink-muted">{f.source}</span> : null}
                        </li>
                      ))}
                    </ul>
                    <span className="text-ink-muted">Engine {claim.engineVersion}</span>
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </ScrollBox>
      {radios ? <SensitivityCaution /> : null}
    </>
  );
}

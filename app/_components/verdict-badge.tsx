import type { Verdict } from "@/lib/bounds/vocabulary";

export type { Verdict };

// Each verdict has its own shape as well as its own colour, so the badges read in grey-scale print.
const LOOK: Record<Verdict, { label: string; glyph: string; className: string }> = {
  impossible: { label: "Impossible", glyph: "✕", className: "border-verdict-impossible text-verdict-impossible" },
  "needs-evidence": { label: "Needs evidence", glyph: "◆", className: "border-verdict-evidence text-verdict-evidence border-dashed" },
  plausible: { label: "Plausible", glyph: "●", className: "border-verdict-plausible text-verdict-plausible" },
};

export function VerdictBadge({ verdict }: { verdict: Verdict }) {
  const look = LOOK[verdict];
  return (
    <span data-verdict={verdict} className={`inline-flex items-center gap-1 rounded-sm border-2 px-1.5 py-0.5 text-xs font-semibold ${look.className}`}>
      <span aria-hidden>{look.glyph}</span>
      <span>{look.label}</span>
    </span>
  );
}

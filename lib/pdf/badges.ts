import { rgb, type PDFPage, type RGB } from "pdf-lib";

import type { Verdict } from "@/lib/bounds/vocabulary";
export type { Verdict };

// Shapes carry the meaning in grey-scale print; the colours only repeat it on screen.
const COLOURS: Record<Verdict, RGB> = {
  impossible: rgb(0.64, 0.12, 0.12),
  "needs-evidence": rgb(0.6, 0.4, 0.05),
  plausible: rgb(0.1, 0.42, 0.24),
};

export const VERDICT_WORDS: Record<Verdict, string> = {
  impossible: "Impossible",
  "needs-evidence": "Needs evidence",
  plausible: "Plausible",
};

/**
 * Draws the verdict's shape centred at (x, y) with the given radius: a cross for impossible,
 * an outlined diamond for needs evidence, a filled circle for plausible.
 */
export function drawVerdictShape(page: PDFPage, verdict: Verdict, x: number, y: number, r = 3.6): void {
  const color = COLOURS[verdict];
  if (verdict === "plausible") {
    page.drawCircle({ x, y, size: r, color });
  } else if (verdict === "needs-evidence") {
    page.drawSvgPath(`M 0 ${-r} L ${r} 0 L 0 ${r} L ${-r} 0 Z`, { x, y, borderColor: color, borderWidth: 1.2 });
  } else {
    const d = r * 0.9;
    page.drawLine({ start: { x: x - d, y: y - d }, end: { x: x + d, y: y + d }, thickness: 1.6, color });
    page.drawLine({ start: { x: x - d, y: y + d }, end: { x: x + d, y: y - d }, thickness: 1.6, color });
  }
}

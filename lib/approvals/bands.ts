/**
 * Approval bands: a value range in one currency (minValue inclusive, maxValue exclusive or
 * open), the number of approvals it needs and the least approval limit each approver holds.
 */
export interface BandRule {
  approvalsNeeded: number;
  minApproverLimit: number;
}

export interface Band extends BandRule {
  id?: string;
  currency: string;
  minValue: number;
  maxValue: number | null;
}

export function bandCovers(band: Band, value: number, currency: string): boolean {
  return band.currency === currency && value >= band.minValue && (band.maxValue === null || value < band.maxValue);
}

/** The band a value falls in, or null when no band covers it. */
export function bandFor<B extends Band>(bands: readonly B[], value: number, currency: string): B | null {
  return bands.find((band) => bandCovers(band, value, currency)) ?? null;
}

/** "[50,000, 250,000) EUR" for messages and the ledger. */
export function describeBand(band: Pick<Band, "currency" | "minValue" | "maxValue">): string {
  const n = (v: number) => v.toLocaleString("en-GB");
  return `[${n(band.minValue)}, ${band.maxValue === null ? "∞" : n(band.maxValue)}) ${band.currency}`;
}

function overlap(a: Band, b: Band): boolean {
  if (a.currency !== b.currency) return false;
  const aEnd = a.maxValue ?? Infinity;
  const bEnd = b.maxValue ?? Infinity;
  return a.minValue < bEnd && b.minValue < aEnd;
}

/**
 * Why a set of bands is not acceptable (empty when it is): each band's range must be
 * non-empty, and no two bands of one currency may share a value.
 */
export function bandProblems(bands: readonly Band[]): string[] {
  const problems: string[] = [];
  for (const band of bands) {
    if (band.maxValue !== null && band.maxValue <= band.minValue) {
      problems.push(`The band ${describeBand(band)} is empty: its upper value must be above its lower value.`);
    }
  }
  for (let i = 0; i < bands.length; i++) {
    for (let j = i + 1; j < bands.length; j++) {
      if (overlap(bands[i], bands[j])) {
        problems.push(`The bands ${describeBand(bands[i])} and ${describeBand(bands[j])} overlap.`);
      }
    }
  }
  return problems;
}

/** Values in a currency that no band covers, between the lowest band and the open top. */
export function bandGaps(bands: readonly Band[], currency: string): { from: number; to: number | null }[] {
  const sorted = bands.filter((b) => b.currency === currency).sort((a, b) => a.minValue - b.minValue);
  const gaps: { from: number; to: number | null }[] = [];
  let reached = 0;
  for (const band of sorted) {
    if (band.minValue > reached) gaps.push({ from: reached, to: band.minValue });
    if (band.maxValue === null) return gaps;
    reached = Math.max(reached, band.maxValue);
  }
  gaps.push({ from: reached, to: null });
  return gaps;
}

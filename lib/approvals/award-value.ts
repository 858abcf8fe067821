// The award value and quantity of a recommendation against the offer's own prices.
import { formatMoney } from "@/lib/format";

export interface AwardValueFacts {
  quantity: number;
  /** The award value the buyer states. */
  value: number;
  /** The offer's price at that quantity, price breaks applied. */
  computedValue: number;
  tenderQuantity: number;
  currency: string;
  valueReason?: string | null;
  quantityReason?: string | null;
}

/** Two amounts differ when they are a cent or more apart. */
export const valuesDiffer = (a: number, b: number) => Math.abs(a - b) >= 0.005;

const units = (n: number) => `${n.toLocaleString("en-GB")} unit${n === 1 ? "" : "s"}`;

/**
 * Field errors (empty when none): a value other than the offer's price at the quantity needs a
 * stated reason, and so does a quantity above the tender's.
 */
export function awardValueProblems(f: AwardValueFacts): Record<string, string[]> {
  const problems: Record<string, string[]> = {};
  if (valuesDiffer(f.value, f.computedValue) && !f.valueReason?.trim()) {
    problems.valueReason = [
      `The offer's prices give ${formatMoney(f.computedValue, f.currency)} for ${units(f.quantity)}. Use that value, or state why the award value differs.`,
    ];
  }
  if (f.quantity > f.tenderQuantity && !f.quantityReason?.trim()) {
    problems.quantityReason = [`The tender asks for ${units(f.tenderQuantity)}. State why the award is for more, or lower the quantity.`];
  }
  return problems;
}

/** The reasons worth keeping: each only when its deviation exists. */
export function keptReasons(f: AwardValueFacts): { valueReason: string | null; quantityReason: string | null } {
  return {
    valueReason: valuesDiffer(f.value, f.computedValue) ? f.valueReason?.trim() || null : null,
    quantityReason: f.quantity > f.tenderQuantity ? f.quantityReason?.trim() || null : null,
  };
}

/**
 * The value that decides the approval band and the limits: the larger of the stated and the
 * computed value, so a low stated value never lets a large award through a small limit.
 */
export function governingValue(r: { value: number; computedValue: number | null }): number {
  return r.computedValue === null ? r.value : Math.max(r.value, r.computedValue);
}

/** Sentences for the Sign-off tab and the memo: each deviation beside the computed figure, with its reason. */
export function deviationWords(r: {
  value: number;
  computedValue: number | null;
  quantity: number;
  tenderQuantity: number;
  currency: string;
  valueReason: string | null;
  quantityReason: string | null;
}): string[] {
  const lines: string[] = [];
  if (r.computedValue !== null && valuesDiffer(r.value, r.computedValue)) {
    lines.push(
      `Stated value ${formatMoney(r.value, r.currency)}; the offer's prices give ${formatMoney(r.computedValue, r.currency)} for ${units(r.quantity)}. Reason: ${r.valueReason ?? "none recorded"}`,
    );
  }
  if (r.quantity > r.tenderQuantity) {
    lines.push(`Quantity ${units(r.quantity)}, above the tender's ${units(r.tenderQuantity)}. Reason: ${r.quantityReason ?? "none recorded"}`);
  }
  return lines;
}

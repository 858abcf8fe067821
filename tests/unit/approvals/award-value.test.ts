import { describe, expect, it } from "vitest";
import { awardValueProblems, deviationWords, governingValue, keptReasons, valuesDiffer } from "@/lib/approvals/award-value";

const facts = { quantity: 4000, value: 143_600, computedValue: 143_600, tenderQuantity: 4000, currency: "EUR" };

describe("the award value against the offer", () => {
  it("accepts the offer's own price at the quantity with no reason", () => {
    expect(awardValueProblems(facts)).toEqual({});
    expect(valuesDiffer(143_600, 143_600.004)).toBe(false);
    expect(valuesDiffer(143_600, 143_600.01)).toBe(true);
  });

  it("needs a stated reason for another value, naming the computed one", () => {
    expect(awardValueProblems({ ...facts, value: 300_000 })).toEqual({
      valueReason: ["The offer's prices give €143,600.00 for 4,000 units. Use that value, or state why the award value differs."],
    });
    expect(awardValueProblems({ ...facts, value: 300_000, valueReason: "   " })).toHaveProperty("valueReason");
    expect(awardValueProblems({ ...facts, value: 300_000, valueReason: "Installation and five years of support." })).toEqual({});
  });

  it("needs a stated reason for more units than the tender's", () => {
    const many = { ...facts, quantity: 100_000_000, value: 1000, computedValue: 3_590_000_000 };
    expect(awardValueProblems(many)).toEqual({
      valueReason: expect.any(Array),
      quantityReason: ["The tender asks for 4,000 units. State why the award is for more, or lower the quantity."],
    });
    expect(awardValueProblems({ ...facts, quantity: 3000, computedValue: 107_700, value: 107_700 })).toEqual({});
  });

  it("lets the larger of the stated and computed values set the band", () => {
    // The case seen in production: 100,000,000 units stated at 1,000 EUR.
    expect(governingValue({ value: 1000, computedValue: 3_590_000_000 })).toBe(3_590_000_000);
    expect(governingValue({ value: 300_000, computedValue: 143_600 })).toBe(300_000);
    expect(governingValue({ value: 250_000, computedValue: null })).toBe(250_000);
  });

  it("keeps a reason only where its deviation exists, and words each beside the computed figure", () => {
    expect(keptReasons({ ...facts, valueReason: "Not needed.", quantityReason: "Nor this." })).toEqual({ valueReason: null, quantityReason: null });
    const rec = { ...facts, value: 300_000, valueReason: "Installation included.", quantityReason: null };
    expect(deviationWords(rec)).toEqual(["Stated value €300,000.00; the offer's prices give €143,600.00 for 4,000 units. Reason: Installation included."]);
    expect(deviationWords({ ...rec, value: 143_600, quantity: 5000, computedValue: 143_600, quantityReason: "Spares." })).toEqual([
      "Quantity 5,000 units, above the tender's 4,000 units. Reason: Spares.",
    ]);
    expect(deviationWords({ ...rec, computedValue: null })).toEqual([]);
  });
});

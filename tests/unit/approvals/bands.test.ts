import { describe, expect, it } from "vitest";
import { bandFor, bandGaps, bandProblems, describeBand, type Band } from "@/lib/approvals/bands";
import { DEMO_APPROVAL_BANDS } from "@/db/seed-approvals";

const demo: Band[] = DEMO_APPROVAL_BANDS;

describe("value bands", () => {
  it("finds the band with the lower value inclusive and the upper exclusive", () => {
    expect(bandFor(demo, 0, "EUR")?.maxValue).toBe(50_000);
    expect(bandFor(demo, 49_999.99, "EUR")?.maxValue).toBe(50_000);
    expect(bandFor(demo, 50_000, "EUR")?.minValue).toBe(50_000);
    expect(bandFor(demo, 250_000, "EUR")).toMatchObject({ approvalsNeeded: 2, minApproverLimit: 250_000 });
    expect(bandFor(demo, 9e9, "EUR")?.maxValue).toBeNull();
  });

  it("covers no other currency", () => {
    expect(bandFor(demo, 1000, "GBP")).toBeNull();
  });

  it("accepts the demo bands and names overlapping or empty ones", () => {
    expect(bandProblems(demo)).toEqual([]);
    const overlapping = [...demo, { currency: "EUR", minValue: 200_000, maxValue: 300_000, approvalsNeeded: 1, minApproverLimit: 0 }];
    expect(bandProblems(overlapping)).toEqual([
      "The bands [50,000, 250,000) EUR and [200,000, 300,000) EUR overlap.",
      "The bands [250,000, ∞) EUR and [200,000, 300,000) EUR overlap.",
    ]);
    expect(bandProblems([{ currency: "EUR", minValue: 10, maxValue: 10, approvalsNeeded: 1, minApproverLimit: 0 }])[0]).toMatch(/is empty/);
    // Touching bands do not overlap; the same range in two currencies does not either.
    expect(bandProblems([...demo, { ...demo[0], currency: "GBP" }])).toEqual([]);
  });

  it("reports the values a currency leaves uncovered", () => {
    expect(bandGaps(demo, "EUR")).toEqual([]);
    expect(bandGaps([demo[1]], "EUR")).toEqual([
      { from: 0, to: 50_000 },
      { from: 250_000, to: null },
    ]);
    expect(describeBand(demo[2])).toBe("[250,000, ∞) EUR");
  });
});

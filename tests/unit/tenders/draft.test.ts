import { describe, expect, it } from "vitest";
import { blankDraftInput, changedFields, draftInput, draftValues } from "@/lib/tenders/draft";
import { nextReference } from "@/lib/tenders/reference";
import { tenderInputSchema } from "@/lib/validation/tender";

describe("reference numbers", () => {
  it("continue the highest sequence of the year, and start at 001 in a new year", () => {
    expect(nextReference(["RC-2027-001", "RC-2027-003", "RC-2026-009"], 2027)).toBe("RC-2027-004");
    expect(nextReference(["RC-2027-001"], 2028)).toBe("RC-2028-001");
    expect(nextReference([], 2027)).toBe("RC-2027-001");
    expect(nextReference(["RC-2027-999"], 2027)).toBe("RC-2027-1000");
  });
});

describe("draft values", () => {
  const input = tenderInputSchema.parse({
    ...blankDraftInput(new Date("2027-03-20T08:00:00Z")),
    title: "Sluice radios",
    operatingPoints: [{ label: "Clear", value: 2e-3 }],
    invitedOrgIds: ["b", "a"],
  });

  it("store the closing time as the UTC instant of the local time in its zone", () => {
    // A week after 20 March 2027; London's clocks go forward on the 28th, so 3 April is summer time.
    expect(input.closesLocal).toBe("2027-03-27T12:00");
    expect(draftValues({ ...input, closesLocal: "2027-04-03T12:00" }).closesAt.toISOString()).toBe("2027-04-03T11:00:00.000Z");
  });

  it("round-trip through the form's values", () => {
    const values = draftValues(input);
    expect(draftInput({ ...values, invitedOrgIds: input.invitedOrgIds })).toEqual(input);
  });

  it("name only the fields that changed, ignoring key and invitation order", () => {
    const before = { ...input, weights: { warranty: 5, leadTime: 10, price: 30, evidence: 15, technical: 40 } };
    const after = { ...input, invitedOrgIds: ["a", "b"], quantity: 50 };
    expect(changedFields(before, after)).toEqual({ quantity: { from: 1, to: 50 } });
  });
});

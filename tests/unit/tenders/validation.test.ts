import { describe, expect, it } from "vitest";
import { fieldErrorsOf } from "@/lib/validation/messages";
import { cancelTenderSchema, tenderInputSchema, tenderPatchSchema, weightsSchema } from "@/lib/validation/tender";
import { tenderInput } from "../../support/tender-input";

const valid = tenderInput({
  description: "",
  currency: "eur",
  impossiblePenalty: 0,
  closesZone: "Europe/London",
  invitedOrgIds: ["a", "b"],
});

const errorsOf = (value: unknown) => {
  const parsed = tenderInputSchema.safeParse(value);
  return parsed.success ? {} : fieldErrorsOf(parsed.error);
};

describe("scoring weights", () => {
  it("accepts non-negative weights with a positive sum, as given", () => {
    const w = { technical: 0, evidence: 0, price: 3, leadTime: 0, warranty: 0 };
    expect(weightsSchema.parse(w)).toEqual(w);
  });

  it("refuses a negative weight and weights that are all zero", () => {
    expect(weightsSchema.safeParse({ technical: -1, evidence: 0, price: 3, leadTime: 0, warranty: 0 }).success).toBe(false);
    const zero = weightsSchema.safeParse({ technical: 0, evidence: 0, price: 0, leadTime: 0, warranty: 0 });
    expect(zero.success).toBe(false);
    expect(zero.error?.issues[0].message).toMatch(/above zero/);
  });

  it("refuses a missing weight", () => {
    expect(weightsSchema.safeParse({ technical: 1, evidence: 0, price: 3, leadTime: 0 }).success).toBe(false);
  });
});

describe("a draft tender", () => {
  it("accepts a complete draft and upper-cases the currency", () => {
    const parsed = tenderInputSchema.parse(valid);
    expect(parsed.currency).toBe("EUR");
  });

  it("fills the optional parts for API clients", () => {
    const { description, maxFrameBits, impossibleRule, impossiblePenalty, invitedOrgIds, ...required } = valid;
    void [description, maxFrameBits, impossibleRule, impossiblePenalty, invitedOrgIds];
    const parsed = tenderInputSchema.parse(required);
    expect(parsed).toMatchObject({ description: "", maxFrameBits: null, impossibleRule: "disqualify", impossiblePenalty: 0, invitedOrgIds: [] });
  });

  it("checks each operating point against its channel model", () => {
    expect(errorsOf({ ...valid, operatingPoints: [{ label: "Bad", value: 0.6 }] })).toHaveProperty(["operatingPoints.0.value"]);
    expect(errorsOf({ ...valid, operatingPoints: [{ label: "Zero", value: 0 }] })).toHaveProperty(["operatingPoints.0.value"]);
    expect(errorsOf({ ...valid, operatingPoints: [{ label: "Half", value: 0.5 }] })).toEqual({});
    expect(errorsOf({ ...valid, channelModel: "bec", operatingPoints: [{ label: "One", value: 1 }] })).toHaveProperty(["operatingPoints.0.value"]);
    expect(
      errorsOf({
        ...valid,
        channelModel: "biawgn",
        operatingPoints: [
          { label: "Low", value: -5 },
          { label: "High", value: 20 },
        ],
      }),
    ).toEqual({});
    expect(errorsOf({ ...valid, channelModel: "biawgn", operatingPoints: [{ label: "Hot", value: 21 }] })).toHaveProperty(["operatingPoints.0.value"]);
  });

  it("wants distinct point names, a residual error in (0, 1) and a three-letter currency", () => {
    const errors = errorsOf({
      ...valid,
      operatingPoints: [
        { label: "A", value: 1e-3 },
        { label: "a", value: 2e-3 },
      ],
      targetValue: 1,
      currency: "EURO",
    });
    expect(Object.keys(errors).sort()).toEqual(["currency", "operatingPoints.1.label", "targetValue"]);
  });

  it("needs points for a penalty and a closing time that exists", () => {
    expect(errorsOf({ ...valid, impossibleRule: "penalty", impossiblePenalty: 0 })).toHaveProperty(["impossiblePenalty"]);
    expect(errorsOf({ ...valid, closesLocal: "2027-03-28T01:30" })["closesLocal"]?.[0]).toMatch(/does not exist/);
    expect(errorsOf({ ...valid, closesZone: "Nowhere/Else" })).toHaveProperty(["closesZone"]);
  });

  it("lets a PATCH send one field, and refuses an empty one", () => {
    expect(tenderPatchSchema.parse({ quantity: 10 })).toEqual({ quantity: 10 });
    expect(tenderPatchSchema.safeParse({}).success).toBe(false);
  });

  it("wants a reason of at least ten characters to cancel", () => {
    expect(cancelTenderSchema.safeParse({ reason: "   too short " }).success).toBe(false);
    expect(cancelTenderSchema.parse({ reason: "Budget withdrawn by the board." }).reason).toBe("Budget withdrawn by the board.");
  });
});

// The recommendation, approval band, approval limit and explorer forms read numbers as people
// type them, as the offer and evidence forms do: "0,00001" and "1 250,5" are numbers, on the
// client (setValueAs) and in the schemas the actions and routes parse with.
import { describe, expect, it } from "vitest";
import { formCount, formDecimal, formOptionalDecimal } from "@/lib/numbers";
import { approvalBandSchema } from "@/lib/validation/approvals";
import { recommendationSchema } from "@/lib/validation/comparison";
import { explorerSchema, sensitivitySchema } from "@/lib/validation/explorer";
import { createUserSchema, setApprovalLimitSchema, updateUserSchema } from "@/lib/validation/people";

const recommendation = { offerId: "offer-1", justification: "Best total score with plausible claims." };

describe("numbers typed with a decimal comma", () => {
  it("are read by the recommendation, on the server as in the form", () => {
    expect(recommendationSchema.parse({ ...recommendation, quantity: "4 000", value: "143 600,50" })).toMatchObject({ quantity: 4000, value: 143_600.5 });
    expect(recommendationSchema.parse({ ...recommendation, quantity: formCount("4 000"), value: formDecimal("1 250,5") })).toMatchObject({
      quantity: 4000,
      value: 1250.5,
    });
    const bad = recommendationSchema.safeParse({ ...recommendation, quantity: "four", value: "" });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues.map((i) => i.message)).toEqual(["Enter the quantity as a number.", "Enter the award value as a number."]);
  });

  it("are read by the approval band", () => {
    const band = approvalBandSchema.parse({ currency: "eur", minValue: "1 250,5", maxValue: "250 000", approvalsNeeded: "2", minApproverLimit: "0,5" });
    expect(band).toEqual({ currency: "EUR", minValue: 1250.5, maxValue: 250_000, approvalsNeeded: 2, minApproverLimit: 0.5 });
    expect(approvalBandSchema.parse({ currency: "EUR", minValue: "0", maxValue: "", approvalsNeeded: 1, minApproverLimit: 0 }).maxValue).toBeNull();
    expect(
      approvalBandSchema.parse({
        currency: "EUR",
        minValue: formDecimal("1 000,25"),
        maxValue: formOptionalDecimal(""),
        approvalsNeeded: formCount("1"),
        minApproverLimit: 0,
      }).minValue,
    ).toBe(1000.25);
    const bad = approvalBandSchema.safeParse({ currency: "EUR", minValue: "lots", maxValue: null, approvalsNeeded: 1, minApproverLimit: 0 });
    expect(bad.error?.issues[0].message).toBe("The lower value must be a number.");
  });

  it("are read as a person's approval limit, and an empty field is no limit", () => {
    expect(setApprovalLimitSchema.parse({ approvalLimit: "250 000,5" }).approvalLimit).toBe(250_000.5);
    expect(setApprovalLimitSchema.parse({ approvalLimit: "" }).approvalLimit).toBeNull();
    expect(updateUserSchema.parse({ approvalLimit: "0,5" }).approvalLimit).toBe(0.5);
    const person = { name: "Ada Ferreira", email: "ada@tarnwell.example", password: "long enough", organisationId: "org", roles: ["approver"] };
    expect(createUserSchema.parse({ ...person, approvalLimit: formOptionalDecimal("1 250,5") }).approvalLimit).toBe(1250.5);
    expect(setApprovalLimitSchema.safeParse({ approvalLimit: "a lot" }).error?.issues[0].message).toBe(
      "Enter the approval limit as a number, or leave it empty.",
    );
  });

  it("are read by the explorer and the sensitivity calculator, counts with grouped thousands", () => {
    expect(explorerSchema.parse({ model: "bsc", x: "0,00001", n: "2 048", k: "1,640", target: "0,0001" })).toMatchObject({
      model: "bsc",
      x: 1e-5,
      n: 2048,
      k: 1640,
      target: 1e-4,
    });
    expect(sensitivitySchema.parse({ level: "-120,5", rb: "1 200", nf: "3,5", payload: "160", per: "0,01" })).toMatchObject({
      level: -120.5,
      rb: 1200,
      nf: 3.5,
      payload: 160,
      per: 0.01,
    });
    expect(explorerSchema.safeParse({ model: "bsc", x: "some" }).error?.issues[0].message).toBe("the channel value must be a number");
  });
});

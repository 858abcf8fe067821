import { describe, expect, it } from "vitest";
import { approvalRefusal, decisionProblem, isFullyApproved, limitCovers, memoIdentifier, type ApprovalFacts } from "@/lib/approvals/routing";

const high = { approvalsNeeded: 2, minApproverLimit: 250_000 };
const facts = (over: Partial<ApprovalFacts> = {}): ApprovalFacts => ({
  approverId: "helen",
  roles: ["approver"],
  approvalLimit: 250_000,
  declared: true,
  conflicted: false,
  tenderCreatedBy: "ines",
  preparedBy: "ines",
  value: 250_000,
  currency: "EUR",
  rule: high,
  ...over,
});

describe("who may approve", () => {
  it("lets a declared, clean approver whose limit covers value and band", () => {
    expect(approvalRefusal(facts())).toBeNull();
    expect(limitCovers(250_000, 250_000, high)).toBe(true);
  });

  it("names the rule that refuses, in words", () => {
    expect(approvalRefusal(facts({ roles: ["buyer"] }))).toBe("Only approvers approve or return a recommendation.");
    expect(approvalRefusal(facts({ preparedBy: "helen" }))).toBe("No one approves a recommendation they prepared.");
    expect(approvalRefusal(facts({ tenderCreatedBy: "helen" }))).toBe("No one approves the award of a tender they created.");
    expect(approvalRefusal(facts({ declared: false }))).toMatch(/^Declare any conflict of interest/);
    expect(approvalRefusal(facts({ conflicted: true }))).toMatch(/declared a conflict of interest/);
    expect(approvalRefusal(facts({ approvalLimit: null }))).toMatch(/no approval limit/);
    expect(approvalRefusal(facts({ value: 300_000 }))).toBe("Your approval limit of €250,000.00 does not cover this award of €300,000.00.");
    expect(approvalRefusal(facts({ value: 60_000, approvalLimit: 100_000 }))).toBe(
      "Awards of this value need approvers with a limit of at least €250,000.00; yours is €100,000.00.",
    );
    expect(limitCovers(100_000, 60_000, high)).toBe(false);
  });

  it("puts segregation of duties before limits", () => {
    expect(approvalRefusal(facts({ preparedBy: "helen", value: 9e9 }))).toBe("No one approves a recommendation they prepared.");
  });
});

describe("when a decision can be taken", () => {
  const state = { tenderState: "approval" as const, pending: true, approverId: "helen", approvedBy: [] as string[] };
  it("only on a pending recommendation of a tender in approval, once per person", () => {
    expect(decisionProblem(state)).toBeNull();
    expect(decisionProblem({ ...state, tenderState: "commercial" })).toMatch(/no recommendation awaiting approval/);
    expect(decisionProblem({ ...state, pending: false })).toMatch(/no recommendation awaiting approval/);
    expect(decisionProblem({ ...state, tenderState: "awarded" })).toMatch(/already awarded/);
    expect(decisionProblem({ ...state, approvedBy: ["helen"] })).toMatch(/same person cannot give two/);
  });

  it("is fully approved once the band's count is reached", () => {
    expect(isFullyApproved(1, high)).toBe(false);
    expect(isFullyApproved(2, high)).toBe(true);
    expect(memoIdentifier("RC-2027-001")).toBe("RC-2027-001-M1");
  });
});

import { describe, expect, it } from "vitest";
import { bandReach, bandWarning, coverage, pendingShortfall, submissionShortfall, type CoverageFacts } from "@/lib/approvals/coverage";

// The demo people: Helen (limit 250,000) and Tomas (2,000,000); the top demo band needs two approvals.
const helen = { id: "helen", name: "Helen Strand", approvalLimit: 250_000 };
const tomas = { id: "tomas", name: "Tomas Veld", approvalLimit: 2_000_000 };
const top = { currency: "EUR", minValue: 250_000, maxValue: null, approvalsNeeded: 2, minApproverLimit: 250_000 };
const facts = (over: Partial<CoverageFacts> = {}): CoverageFacts => ({
  value: 250_000,
  currency: "EUR",
  rule: { approvalsNeeded: 2, minApproverLimit: 250_000 },
  excluded: new Set(["ines"]),
  approvedBy: [],
  ...over,
});

describe("enough distinct eligible approvers", () => {
  it("counts those whose limit covers the value, leaving out the excluded", () => {
    expect(coverage([helen, tomas], facts())).toMatchObject({ missing: 2, shortfall: 0 });
    expect(coverage([helen, tomas], facts({ excluded: new Set(["helen"]) }))).toMatchObject({ eligible: [tomas], shortfall: 1 });
  });

  it("refuses 300,000 EUR when only one approver's limit reaches it, naming who can", () => {
    const f = facts({ value: 300_000 });
    const c = coverage([helen, tomas], f);
    expect(c.shortfall).toBe(1);
    expect(submissionShortfall(c, f)).toBe(
      "This award of €300,000.00 needs 2 approvals from different approvers with a limit of at least €300,000.00, who neither prepared it nor created the tender nor declared a conflict on it; " +
        "only 1 approver can give one (Tomas Veld). Nothing was submitted: ask an admin to raise an approver's limit or add an approver on the People page, or recommend an award those approvers can cover.",
    );
    expect(submissionShortfall(coverage([helen, tomas], facts()), facts())).toBeNull();
  });

  it("sees a pending one stuck once those who approved cannot approve again", () => {
    const c = coverage([tomas], facts({ value: 300_000, approvedBy: ["tomas"] }));
    expect(c).toMatchObject({ missing: 1, remaining: [], shortfall: 1 });
    expect(pendingShortfall(c)).toMatch(/^It still needs 1 approval, and no approver who has not yet approved can give one\. The buyer can withdraw it/);
    expect(pendingShortfall(coverage([helen, tomas], facts({ approvedBy: ["tomas"] })))).toBeNull();
  });
});

describe("bands today's approvers cannot meet", () => {
  it("finds the highest value a band can approve: its n-th largest qualifying limit", () => {
    expect(bandReach(top, [250_000, 2_000_000])).toBe(250_000);
    expect(bandReach(top, [2_000_000])).toBeNull();
    expect(bandReach({ ...top, minValue: 0, maxValue: 50_000, approvalsNeeded: 1, minApproverLimit: 50_000 }, [250_000, null])).toBe(250_000);
  });

  it("warns in words, or says nothing when the whole band can be met", () => {
    expect(bandWarning(top, [250_000, 2_000_000])).toBe(
      "Awards above €250,000.00 in the band [250,000, ∞) EUR cannot be approved today: the band needs 2 approvals from different approvers, and only 1 approver holds a limit above €250,000.00.",
    );
    expect(bandWarning(top, [2_000_000, null])).toBe(
      "No award in the band [250,000, ∞) EUR can be approved today: it needs 2 approvals from different approvers with a limit of at least €250,000.00, and only 1 approver holds one.",
    );
    expect(bandWarning({ ...top, maxValue: 1_000_000 }, [1_500_000, 2_000_000])).toBeNull();
  });
});

import { describe, expect, it } from "vitest";
import { allows, defineAbilityFor, ForbiddenError, assertAllowed, type Actor, type Role } from "@/policies";
import { actorFor, LIMIT, make, T1, T2, VENDOR_A, VENDOR_B } from "./fixtures";

const conflictedOnB = (role: Role, over: Partial<Actor> = {}) =>
  actorFor(role, { declarations: [{ tenderId: T1, conflictedVendorOrgIds: [VENDOR_B] }], ...over });

describe("an engineer before declaring", () => {
  const ability = defineAbilityFor(actorFor("engineer", { declarations: [] }));

  it("sees the tender and may declare on it", () => {
    expect(allows(ability, "read", "Tender", make.Tender())).toBe(true);
    expect(allows(ability, "declare", "Tender", make.Tender({ state: "technical" }))).toBe(true);
  });

  it.each(["Offer", "Claim", "Document", "Mark", "Thread", "EvidenceRun"] as const)("sees no %s of the tender", (subject) => {
    expect(ability.can("read", subject)).toBe(false);
    expect(allows(ability, "read", subject, make[subject]() as never)).toBe(false);
  });

  it("may not mark, record, post or sign", () => {
    expect(allows(ability, "mark", "Claim", make.Claim())).toBe(false);
    expect(allows(ability, "record", "EvidenceRun", make.EvidenceRun())).toBe(false);
    expect(allows(ability, "post", "Thread", make.Thread())).toBe(false);
    expect(allows(ability, "sign", "TechnicalSignoff", make.TechnicalSignoff())).toBe(false);
  });
});

describe("an engineer with a conflict on vendor B", () => {
  const ability = defineAbilityFor(conflictedOnB("engineer"));
  const vendorRecords = ["Offer", "Claim", "Document", "Mark", "Thread", "EvidenceRun"] as const;

  it.each(vendorRecords)("reads vendor A's %s", (subject) => {
    expect(allows(ability, "read", subject, make[subject]() as never)).toBe(true);
  });

  it.each(vendorRecords)("does not read vendor B's %s", (subject) => {
    expect(allows(ability, "read", subject, make[subject]({ vendorOrgId: VENDOR_B }) as never)).toBe(false);
  });

  it("marks A's claims but not B's, records and posts for A only", () => {
    expect(allows(ability, "mark", "Claim", make.Claim())).toBe(true);
    expect(allows(ability, "mark", "Claim", make.Claim({ vendorOrgId: VENDOR_B }))).toBe(false);
    expect(allows(ability, "record", "EvidenceRun", make.EvidenceRun({ vendorOrgId: VENDOR_B }))).toBe(false);
    expect(allows(ability, "post", "Thread", make.Thread({ vendorOrgId: VENDOR_B }))).toBe(false);
    expect(allows(ability, "post", "Thread", make.Thread())).toBe(true);
  });

  it("may not sign the technical evaluation of that tender, and says why", () => {
    expect(allows(ability, "sign", "TechnicalSignoff", make.TechnicalSignoff())).toBe(false);
    expect(() => assertAllowed(ability, "sign", "TechnicalSignoff", make.TechnicalSignoff())).toThrow(/conflict of interest/);
  });

  it("keeps the conflict to its tender: vendor B on another declared tender is visible", () => {
    const both = defineAbilityFor(
      conflictedOnB("engineer", {
        declarations: [
          { tenderId: T1, conflictedVendorOrgIds: [VENDOR_B] },
          { tenderId: T2, conflictedVendorOrgIds: [] },
        ],
      }),
    );
    expect(allows(both, "read", "Offer", make.Offer({ tenderId: T2, vendorOrgId: VENDOR_B }))).toBe(true);
    expect(allows(both, "sign", "TechnicalSignoff", make.TechnicalSignoff({ tenderId: T2 }))).toBe(true);
    expect(allows(both, "read", "Offer", make.Offer({ vendorOrgId: VENDOR_B }))).toBe(false);
  });

  it("merges two declarations on one tender: a later clean one does not lift the conflict", () => {
    const twice = defineAbilityFor(
      actorFor("engineer", {
        declarations: [
          { tenderId: T1, conflictedVendorOrgIds: [VENDOR_B] },
          { tenderId: T1, conflictedVendorOrgIds: [] },
        ],
      }),
    );
    expect(allows(twice, "read", "Claim", make.Claim({ vendorOrgId: VENDOR_B }))).toBe(false);
    expect(allows(twice, "sign", "TechnicalSignoff", make.TechnicalSignoff())).toBe(false);
  });
});

describe("an approver", () => {
  const approval = make.Approval;

  it.each([
    ["below the limit", approval({ value: LIMIT - 1 }), true],
    ["at the limit", approval({ value: LIMIT }), true],
    ["above the limit", approval({ value: LIMIT + 1 }), false],
  ] as const)("approves an award %s: %s", (_, record, expected) => {
    const ability = defineAbilityFor(actorFor("approver"));
    expect(allows(ability, "approve", "Approval", record)).toBe(expected);
    expect(allows(ability, "return", "Approval", record)).toBe(expected);
  });

  it("with no limit approves nothing", () => {
    const ability = defineAbilityFor(actorFor("approver", { approvalLimit: null }));
    expect(ability.can("approve", "Approval")).toBe(false);
    expect(allows(ability, "approve", "Approval", approval({ value: 1 }))).toBe(false);
  });

  it("never approves a recommendation they prepared, even holding the buyer role", () => {
    const me = actorFor(["buyer", "approver"]);
    const ability = defineAbilityFor(me);
    const own = approval({ recommendationPreparedBy: me.id, value: 10 });
    expect(allows(ability, "approve", "Approval", own)).toBe(false);
    expect(() => assertAllowed(ability, "approve", "Approval", own)).toThrow(ForbiddenError);
    expect(() => assertAllowed(ability, "approve", "Approval", own)).toThrow(/prepared/);
    expect(allows(ability, "approve", "Approval", approval({ value: 10 }))).toBe(true);
  });

  it("never approves the award of a tender they created", () => {
    const me = actorFor("approver");
    const ability = defineAbilityFor(me);
    expect(allows(ability, "approve", "Approval", approval({ tenderCreatedBy: me.id }))).toBe(false);
  });

  it("with any conflict on the tender approves nothing there, and does not see the conflicted vendor", () => {
    const ability = defineAbilityFor(conflictedOnB("approver"));
    expect(allows(ability, "approve", "Approval", approval())).toBe(false);
    expect(allows(ability, "return", "Approval", approval())).toBe(false);
    expect(allows(ability, "read", "Offer", make.Offer({ vendorOrgId: VENDOR_B }))).toBe(false);
    expect(allows(ability, "read", "Envelope", make.Envelope({ vendorOrgId: VENDOR_B }))).toBe(false);
    expect(allows(ability, "read", "Offer", make.Offer({ vendorOrgId: VENDOR_A }))).toBe(true);
    expect(allows(ability, "read", "Score", make.Score())).toBe(true);
  });

  it("without a declaration on the tender approves nothing there", () => {
    const ability = defineAbilityFor(actorFor("approver", { declarations: [] }));
    expect(allows(ability, "approve", "Approval", approval())).toBe(false);
    expect(allows(ability, "read", "Recommendation", make.Recommendation())).toBe(false);
    expect(allows(ability, "read", "Tender", make.Tender({ id: T1 }))).toBe(true);
  });
});

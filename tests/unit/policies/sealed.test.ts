import { describe, expect, it } from "vitest";
import { allows, cancelKeepsSeal, defineAbilityFor, offersSealed, recordTenderState, type Role, type SubjectRecords } from "@/policies";
import { actorFor, make } from "./fixtures";

const PARTS = ["Offer", "Envelope", "Claim", "Document", "Mark", "Thread", "EvidenceRun"] as const;
const INTERNAL: (Role | Role[])[] = ["buyer", "engineer", "approver", "admin", ["engineer", "buyer"], ["approver", "buyer"]];
type Part = (typeof PARTS)[number];
const record = <S extends Part>(subject: S, tenderState: string) =>
  (make[subject] as (o: object) => SubjectRecords[S])({ tenderState, opened: true, envelopeOpened: true });

describe("offers are sealed to the buying side until the tender closes", () => {
  describe.each(INTERNAL)("%s", (roles) => {
    const ability = defineAbilityFor(actorFor(roles));

    it.each(PARTS)("reads no %s while the tender is draft or open, nor once cancelled before closing", (subject) => {
      for (const state of ["draft", "open", "cancelled-sealed"]) {
        expect(allows(ability, "read", subject, record(subject, state))).toBe(false);
        expect(allows(ability, "list", subject, record(subject, state))).toBe(false);
      }
    });

    it("says why", () => {
      const rule = ability.relevantRuleFor("read", { ...record("Offer", "open"), __caslSubjectType__: "Offer" } as never);
      expect(rule?.reason).toMatch(/sealed to the buying side until the tender closes/);
    });
  });

  it("lets the buyer and a declared engineer read the technical offer once closed", () => {
    for (const roles of ["buyer", "engineer"] as const) {
      const ability = defineAbilityFor(actorFor(roles));
      expect(allows(ability, "read", "Offer", record("Offer", "technical")), roles).toBe(true);
      expect(allows(ability, "read", "Claim", record("Claim", "technical")), roles).toBe(true);
    }
  });

  it("keeps what closing unsealed when the tender is cancelled after it", () => {
    expect(recordTenderState({ state: "cancelled", cancelledSealed: false })).toBe("cancelled");
    expect(recordTenderState({ state: "cancelled", cancelledSealed: true })).toBe("cancelled-sealed");
    expect(offersSealed({ state: "cancelled", cancelledSealed: true })).toBe(true);
    expect(offersSealed({ state: "open", cancelledSealed: false })).toBe(true);
    expect(offersSealed({ state: "cancelled", cancelledSealed: false })).toBe(false);
    expect([cancelKeepsSeal("open"), cancelKeepsSeal("draft"), cancelKeepsSeal("technical")]).toEqual([true, true, false]);
    expect(allows(defineAbilityFor(actorFor("buyer")), "read", "Offer", record("Offer", "cancelled")), "cancelled after closing").toBe(true);
  });

  it("never lets a vendor write to a tender cancelled before closing", () => {
    const ability = defineAbilityFor(actorFor("vendor"));
    expect(allows(ability, "update", "Offer", record("Offer", "cancelled-sealed"))).toBe(false);
    expect(allows(ability, "read", "Offer", record("Offer", "cancelled-sealed"))).toBe(true);
  });

  it("leaves the vendor its own offer while open", () => {
    const ability = defineAbilityFor(actorFor("vendor"));
    for (const subject of PARTS.filter((s) => s !== "EvidenceRun")) {
      expect(allows(ability, "read", subject, record(subject, "open")), subject).toBe(true);
    }
  });
});

import { describe, expect, it } from "vitest";
import { allows, defineAbilityFor, ENVELOPE_FIELDS, permittedFields, pickPermitted } from "@/policies";
import { actorFor, make, VENDOR_B } from "./fixtures";

const sealed = make.Offer({ envelopeOpened: false });
const opened = make.Offer({ envelopeOpened: true, tenderState: "commercial" });
const technicalFields = ["id", "tenderId", "vendorOrgId", "tenderState", "envelopeOpened", "module"];
const priceless = (offer: object) => Object.fromEntries(Object.entries(offer).filter(([f]) => technicalFields.includes(f)));

describe("a buyer and the sealed envelope", () => {
  const ability = defineAbilityFor(actorFor("buyer"));

  it("does not read an Envelope before it is opened, and does after", () => {
    expect(allows(ability, "read", "Envelope", make.Envelope({ opened: false }))).toBe(false);
    expect(allows(ability, "read", "Envelope", make.Envelope({ opened: true }))).toBe(true);
  });

  it.each(ENVELOPE_FIELDS)("does not read an offer's %s before opening, and does after", (field) => {
    expect(allows(ability, "read", "Offer", sealed, field)).toBe(false);
    expect(allows(ability, "read", "Offer", opened, field)).toBe(true);
  });

  it("gets a sealed offer stripped of its envelope fields, and an opened one whole", () => {
    expect(pickPermitted(ability, "read", "Offer", sealed)).toEqual(priceless(sealed));
    expect(pickPermitted(ability, "list", "Offer", sealed)).toEqual(priceless(sealed));
    expect(pickPermitted(ability, "read", "Offer", opened)).toEqual(opened);
  });
});

describe("an engineer never reads a price", () => {
  const ability = defineAbilityFor(actorFor("engineer"));

  it.each([
    ["sealed", sealed],
    ["opened", opened],
  ])("the %s offer comes back without its envelope fields", (_, offer) => {
    expect(allows(ability, "read", "Offer", offer)).toBe(true);
    expect(pickPermitted(ability, "read", "Offer", offer)).toEqual(priceless(offer));
    for (const field of ENVELOPE_FIELDS) expect(permittedFields(ability, "read", "Offer", offer)).not.toContain(field);
  });

  it("reads no Envelope, Score or Recommendation at all", () => {
    for (const subject of ["Envelope", "Score", "Recommendation", "Memo"] as const) {
      expect(ability.can("read", subject), subject).toBe(false);
    }
    expect(pickPermitted(ability, "read", "Envelope", make.Envelope())).toEqual({});
  });
});

describe("an approver reads envelopes only once opened", () => {
  const ability = defineAbilityFor(actorFor("approver"));

  it("strips a sealed offer and keeps an opened one", () => {
    expect(pickPermitted(ability, "read", "Offer", sealed)).toEqual(priceless(sealed));
    expect(pickPermitted(ability, "read", "Offer", opened)).toEqual(opened);
  });
});

describe("a vendor and its own envelope", () => {
  const ability = defineAbilityFor(actorFor("vendor"));

  it("reads every field of its own offer, sealed or not", () => {
    expect(pickPermitted(ability, "read", "Offer", sealed)).toEqual(sealed);
    expect(pickPermitted(ability, "read", "Envelope", make.Envelope({ opened: false }))).toEqual(make.Envelope({ opened: false }));
  });

  it("gets nothing of another vendor's offer", () => {
    expect(pickPermitted(ability, "read", "Offer", make.Offer({ vendorOrgId: VENDOR_B }))).toEqual({});
  });
});

describe("an admin reads no envelope", () => {
  it("neither the Envelope nor an offer", () => {
    const ability = defineAbilityFor(actorFor("admin"));
    expect(ability.can("read", "Envelope")).toBe(false);
    expect(pickPermitted(ability, "read", "Offer", opened)).toEqual({});
  });
});

describe("one person holding the engineer role and a commercial role", () => {
  it.each([["buyer"], ["approver"]] as const)("as %s reads prices only after opening", (other) => {
    const ability = defineAbilityFor(actorFor(["engineer", other]));
    expect(pickPermitted(ability, "read", "Offer", sealed)).toEqual(priceless(sealed));
    expect(pickPermitted(ability, "read", "Offer", opened)).toEqual(opened);
    expect(allows(ability, "read", "Envelope", make.Envelope({ opened: false }))).toBe(false);
  });

  it("with a conflict on vendor B does not see B's offer even as buyer", () => {
    const ability = defineAbilityFor(actorFor(["engineer", "buyer"], { declarations: [{ tenderId: opened.tenderId, conflictedVendorOrgIds: [VENDOR_B] }] }));
    const offerOfB = make.Offer({ vendorOrgId: VENDOR_B, envelopeOpened: true });
    expect(allows(ability, "read", "Offer", offerOfB)).toBe(false);
    expect(allows(ability, "read", "Envelope", make.Envelope({ vendorOrgId: VENDOR_B }))).toBe(false);
    expect(pickPermitted(ability, "read", "Offer", offerOfB)).toEqual({});
  });
});

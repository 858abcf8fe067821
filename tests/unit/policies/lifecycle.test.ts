import { describe, expect, it } from "vitest";
import { ACTIONS, ROLES, SUBJECTS, abilityFromRules, allows, asSubject, defineAbilityFor, effectiveRoles, serializeRules, type AppAbility } from "@/policies";
import { actorFor, make, VENDOR_A } from "./fixtures";
import { cellKey, expectedFor, resolve } from "./table";

const everyCell = SUBJECTS.flatMap((subject) => ACTIONS.map((action) => ({ action, subject })));
const granted = (ability: AppAbility) =>
  everyCell.filter(({ action, subject }) => ability.can(action, subject)).map(({ action, subject }) => cellKey(action, subject));

describe("a deactivated user", () => {
  it.each(ROLES)("holding %s is denied everything", (role) => {
    const ability = defineAbilityFor(actorFor(role, { active: false }));
    expect(granted(ability)).toEqual([]);
    expect(ability.rules).toEqual([]);
  });

  it("holding every internal role is denied everything", () => {
    const ability = defineAbilityFor(actorFor(["admin", "buyer", "engineer", "approver"], { active: false }));
    expect(granted(ability)).toEqual([]);
  });
});

describe("a signed-out visitor", () => {
  const ability = defineAbilityFor(null);

  it("may only verify a memo", () => {
    expect(granted(ability)).toEqual([cellKey("verify", "MemoCheck")]);
    expect(allows(ability, "verify", "MemoCheck", make.MemoCheck())).toBe(true);
  });
});

describe("roles that do not fit the organisation", () => {
  it("a vendor-organisation user with internal roles keeps only the vendor role", () => {
    const me = actorFor(["vendor", "admin", "buyer"]);
    expect(effectiveRoles(me)).toEqual(["vendor"]);
    expect(granted(defineAbilityFor(me))).toEqual(granted(defineAbilityFor(actorFor("vendor"))));
  });

  it("a vendor-organisation user without the vendor role gets only what everyone gets", () => {
    const ability = defineAbilityFor(actorFor("vendor", { roles: ["buyer"] }));
    expect(ability.can("read", "Tender")).toBe(false);
    expect(ability.can("use", "Bounds")).toBe(true);
  });

  it("an internal user holding the vendor role does not act as a vendor", () => {
    const ability = defineAbilityFor(actorFor(["engineer", "vendor"], { organisationId: VENDOR_A, organisationKind: "buyer" }));
    expect(allows(ability, "submit", "Offer", make.Offer())).toBe(false);
  });
});

describe("the admin", () => {
  const me = actorFor("admin");
  const ability = defineAbilityFor(me);

  it("deletes no user or organisation, and says why", () => {
    expect(ability.can("delete", "User")).toBe(false);
    expect(ability.relevantRuleFor("delete", "Organisation")?.reason).toMatch(/deactivate/);
  });

  it("does not change their own roles or deactivate themselves", () => {
    expect(allows(ability, "assignRoles", "User", make.User({ id: me.id }))).toBe(false);
    expect(allows(ability, "deactivate", "User", make.User({ id: me.id }))).toBe(false);
    expect(allows(ability, "update", "User", make.User({ id: me.id }))).toBe(true);
  });
});

describe("rules shipped to the client", () => {
  it.each(ROLES)("decide every cell of the %s table as on the server", (role) => {
    const me = actorFor(role);
    const server = defineAbilityFor(me);
    const client = abilityFromRules(JSON.parse(JSON.stringify(serializeRules(server))));
    expect(granted(client)).toEqual(granted(server));
    for (const [cell, grant] of expectedFor(role)) {
      const [action, subject] = cell.split(" ") as [never, never];
      for (const given of [...grant.allowed, ...grant.denied]) {
        const record = resolve(given, me) as never;
        expect(allows(client, action, subject, record), cell).toBe(allows(server, action, subject, record));
      }
    }
  });
});

describe("asSubject", () => {
  it("leaves the caller's record untagged so it can be checked as another subject later", () => {
    const record = { tenderId: "tender-1" };
    asSubject("Score", record);
    expect(() => asSubject("Memo", record)).not.toThrow();
    expect(Object.getOwnPropertyNames(record)).toEqual(["tenderId"]);
  });
});

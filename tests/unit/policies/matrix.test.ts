import { describe, expect, it } from "vitest";
import { ACTIONS, ROLES, SUBJECTS, allows, defineAbilityFor, type Action, type SubjectRecords, type SubjectType } from "@/policies";
import { actorFor, make } from "./fixtures";
import { cellKey, expectedFor, resolve, type Grant } from "./table";

interface Cell {
  label: string;
  action: Action;
  subject: SubjectType;
  grant: Grant | undefined;
}

function cellsOf(grants: Map<string, Grant>): Cell[] {
  return SUBJECTS.flatMap((subject) =>
    ACTIONS.map((action) => {
      const grant = grants.get(cellKey(action, subject));
      return { label: `${grant ? "may" : "may not"} ${action} ${subject}`, action, subject, grant };
    }),
  );
}

describe.each(ROLES)("%s", (role) => {
  const me = actorFor(role);
  const ability = defineAbilityFor(me);
  const check = (action: Action, subject: SubjectType, record: object) => allows(ability, action, subject, record as SubjectRecords[typeof subject]);

  it.each(cellsOf(expectedFor(role)))("$label", ({ action, subject, grant }) => {
    if (grant) {
      expect(ability.can(action, subject), "offered to the client for this subject type").toBe(true);
      for (const given of grant.allowed) {
        const record = resolve(given, me);
        expect(check(action, subject, record), `reaches ${JSON.stringify(record)}`).toBe(true);
      }
      for (const given of grant.denied) {
        const record = resolve(given, me);
        expect(check(action, subject, record), `stops at ${JSON.stringify(record)}`).toBe(false);
      }
    } else {
      expect(ability.can(action, subject), "no rule grants this cell").toBe(false);
      const record = (make[subject] as () => object)();
      expect(check(action, subject, record), JSON.stringify(record)).toBe(false);
    }
  });
});

describe("the table itself", () => {
  it("lists only records that exist and at least one allowed record per granted cell", () => {
    for (const role of ROLES) {
      for (const [cell, grant] of expectedFor(role)) {
        expect(grant.allowed.length, `${role}: ${cell}`).toBeGreaterThan(0);
      }
    }
  });
});

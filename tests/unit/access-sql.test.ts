import { describe, expect, it } from "vitest";
import { PgDialect } from "drizzle-orm/pg-core";
import { tenders } from "@/db/schema";
import { defineAbilityFor, type Actor } from "@/policies";
import { accessibleWhere, containing } from "@/lib/server/access-sql";

const dialect = new PgDialect();
const actor = (roles: Actor["roles"], organisationKind: Actor["organisationKind"] = "buyer"): Actor => ({
  id: "u1",
  organisationId: "o1",
  organisationKind,
  roles,
  active: true,
  approvalLimit: null,
  declarations: [],
});
const sqlOf = (roles: Actor["roles"], fields: Parameters<typeof accessibleWhere>[3], kind?: Actor["organisationKind"]) =>
  dialect.sqlToQuery(accessibleWhere(defineAbilityFor(actor(roles, kind)), "read", "Tender", fields));

describe("policies as SQL", () => {
  it("allows everything where a rule has no condition, and nothing where no rule grants", () => {
    expect(sqlOf(["buyer"], { state: tenders.state }).sql).toBe("true");
    expect(sqlOf([], { state: tenders.state }).sql).toBe("false");
  });

  it("turns a condition into SQL on the mapped column", () => {
    const q = sqlOf(["engineer"], { state: tenders.state });
    expect(q.sql).toBe('"tenders"."state" <> $1');
    expect(q.params).toEqual(["draft"]);
  });

  it("refuses a field it has no SQL for rather than allowing it", () => {
    expect(() => sqlOf(["vendor"], { state: tenders.state }, "vendor")).toThrow(/invitedOrgIds/);
  });

  it("takes the pattern characters of a search text literally", () => {
    expect(containing("50%_a\\b")).toBe("%50\\%\\_a\\\\b%");
  });
});

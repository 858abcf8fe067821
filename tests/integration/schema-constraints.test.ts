import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq, sql } from "drizzle-orm";
import { claims, organisations, tenders, userRoles, users } from "@/db/schema";
import type { Db } from "@/db/client";
import { closeDb, freshDatabase } from "../support/app";

let db: Db;
beforeAll(async () => {
  db = await freshDatabase();
});
afterAll(closeDb);

/** The database itself refuses a value outside the list, whatever code writes it. */
async function refuses(write: () => Promise<unknown>, constraint: string) {
  await expect(write()).rejects.toSatisfy((error: unknown) => {
    const cause = (error as { cause?: { message?: string } }).cause;
    return `${(error as Error).message} ${cause?.message ?? ""}`.includes(constraint);
  });
}

describe("state, verdict and role columns", () => {
  it("accept only their listed values", async () => {
    const [tender] = await db.select().from(tenders).limit(1);
    await refuses(
      () =>
        db
          .update(tenders)
          .set({ state: "paused" as never })
          .where(eq(tenders.id, tender.id)),
      "tenders_state_check",
    );
    const [claim] = await db.select().from(claims).limit(1);
    await refuses(
      () =>
        db
          .update(claims)
          .set({ verdict: "probably" as never })
          .where(eq(claims.id, claim.id)),
      "claims_verdict_check",
    );
    const [user] = await db.select().from(users).limit(1);
    await refuses(() => db.insert(userRoles).values({ userId: user.id, role: "superuser" as never }), "user_roles_role_check");
    await refuses(() => db.execute(sql`update ${organisations} set kind = 'neither'`), "organisations_kind_check");
    expect((await db.select().from(tenders).where(eq(tenders.id, tender.id)))[0].state).toBe(tender.state);
  });
});

// Numbers typed with a decimal comma reach the server as text and are read as numbers by the
// routes (and the actions, which parse with the same schemas): the recommendation, an approval
// band and a person's approval limit.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { approvalBands, recommendations, users } from "@/db/schema";
import { POST as bandsPost } from "@/app/api/v1/approval-bands/route";
import { POST as recommendationPost } from "@/app/api/v1/tenders/[id]/recommendation/route";
import { PATCH as userPatch } from "@/app/api/v1/users/[id]/route";
import { closeDb, freshDatabase, params, request, signInAs } from "../support/app";
import { idsByEmail } from "../support/approval-fixtures";
import { createCommercialTender, honest } from "../support/comparison-fixtures";

let db: Db;
let directorId = "";
const as = { admin: new Headers(), buyer: new Headers() };
beforeAll(async () => {
  db = await freshDatabase();
  directorId = (await idsByEmail(db)).director;
  as.admin = await signInAs("admin@tarnwell.example");
  as.buyer = await signInAs("buyer@tarnwell.example");
});
afterAll(closeDb);

describe("decimal commas at the server", () => {
  it("read an approval band's values", async () => {
    const body = { currency: "USD", minValue: "0", maxValue: "1 250 000,5", approvalsNeeded: "1", minApproverLimit: "0,5" };
    const response = await bandsPost(request("/api/v1/approval-bands", { method: "POST", headers: as.admin, body }), undefined);
    expect(response.status).toBe(201);
    const { id } = await response.json();
    const [row] = await db.select().from(approvalBands).where(eq(approvalBands.id, id));
    expect([row.maxValue, row.minApproverLimit]).toEqual([1_250_000.5, 0.5]);
    const bad = await bandsPost(request("/api/v1/approval-bands", { method: "POST", headers: as.admin, body: { ...body, minValue: "nothing" } }), undefined);
    expect(bad.status).toBe(400);
    expect((await bad.json()).fieldErrors.minValue[0]).toBe("The lower value must be a number.");
  });

  it("read a person's approval limit", async () => {
    const response = await userPatch(
      request(`/api/v1/users/${directorId}`, { method: "PATCH", headers: as.admin, body: { approvalLimit: "2 500 000,5" } }),
      params({ id: directorId }),
    );
    expect(response.status).toBe(200);
    const [row] = await db.select({ limit: users.approvalLimit }).from(users).where(eq(users.id, directorId));
    expect(row.limit).toBe(2_500_000.5);
  });

  it("read the recommendation's quantity and value", async () => {
    // Alder's 35.90 EUR a unit gives 143,600.00 EUR for the tender's 4,000 units.
    const fx = await createCommercialTender(db, { opened: true, offers: [honest("Alder", 35.9, 10, 24), honest("Birch", 41, 12, 24)] });
    const body = {
      offerId: fx.offerIds[0],
      quantity: "4 000",
      value: "143 600,00",
      justification: "Best total score with plausible claims at both operating points.",
    };
    const response = await recommendationPost(
      request(`/api/v1/tenders/${fx.tenderId}/recommendation`, { method: "POST", headers: as.buyer, body }),
      params({ id: fx.tenderId }),
    );
    expect(response.status).toBe(201);
    const [row] = await db.select().from(recommendations).where(eq(recommendations.tenderId, fx.tenderId));
    expect([row.quantity, row.value]).toEqual([4000, 143_600]);
  });
});

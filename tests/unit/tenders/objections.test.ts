import { describe, expect, it } from "vitest";
import { objectionWaits } from "@/lib/tenders/disclosure";

const DAY = 86_400_000;
const awardedAt = new Date("2027-03-01T09:00:00Z");
const awarded = { state: "awarded", awardedAt, standstillDays: 10 };

describe("an objection waits for the buying team", () => {
  it("while unanswered and within the standstill period", () => {
    expect(objectionWaits({ answeredAt: null }, awarded, new Date(awardedAt.getTime() + 9 * DAY))).toBe(true);
  });

  it("no longer once answered, once the standstill period ends, or without an award", () => {
    expect(objectionWaits({ answeredAt: new Date(awardedAt.getTime() + DAY) }, awarded, new Date(awardedAt.getTime() + 2 * DAY))).toBe(false);
    expect(objectionWaits({ answeredAt: null }, awarded, new Date(awardedAt.getTime() + 10 * DAY))).toBe(false);
    expect(objectionWaits({ answeredAt: null }, { ...awarded, state: "cancelled" }, new Date(awardedAt.getTime() + DAY))).toBe(false);
  });
});

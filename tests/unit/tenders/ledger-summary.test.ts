import { describe, expect, it } from "vitest";
import { summariseLedgerData } from "@/lib/tenders/ledger-summary";

describe("ledger summaries", () => {
  it("read a cancellation as its reason and former state", () => {
    expect(summariseLedgerData({ reference: "RC-2027-004", from: "open", reason: "Budget withdrawn." })).toBe("from: open; reason: Budget withdrawn.");
  });

  it("name invited organisations, leaving their ids to the stored entry", () => {
    expect(summariseLedgerData({ invited: ["Kestrelink Radio", "Oxbow Wireless"], invitedOrgIds: ["a", "b"] })).toBe("invited: Kestrelink Radio, Oxbow Wireless");
  });

  it("read an edit as the changed values", () => {
    const data = { fields: ["quantity", "title"], changes: { quantity: { from: 250, to: 300 }, title: { from: "A", to: "B" } } };
    expect(summariseLedgerData(data)).toBe("fields: quantity, title; changes: quantity 250 → 300, title A → B");
  });

  it("show small objects by their values and cut long lines", () => {
    expect(summariseLedgerData({ weights: { technical: 40, price: 60 } })).toBe("weights: technical 40, price 60");
    const line = summariseLedgerData({ reason: "x".repeat(400) });
    expect(line.length).toBe(160);
    expect(line.endsWith("…")).toBe(true);
  });
});

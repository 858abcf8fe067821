import { describe, expect, it } from "vitest";
import { ledgerDetails } from "@/lib/tenders/ledger-summary";

const lines = (data: Record<string, unknown>) => ledgerDetails(data).map((d) => `${d.key}: ${d.text}`);

describe("ledger details", () => {
  it("read a cancellation as its reason and former state", () => {
    expect(lines({ reference: "RC-2027-004", from: "open", reason: "Budget withdrawn." })).toEqual(["from: open", "reason: Budget withdrawn."]);
  });

  it("name invited organisations, leaving their ids to the stored entry", () => {
    expect(lines({ invited: ["Kestrelink Radio", "Oxbow Wireless"], invitedOrgIds: ["a", "b"], vendorOrgId: "c" })).toEqual([
      "invited: Kestrelink Radio, Oxbow Wireless",
    ]);
  });

  it("read an edit as the changed values", () => {
    const data = { fields: ["quantity", "title"], changes: { quantity: { from: 250, to: 300 }, title: { from: "A", to: "B" } } };
    expect(lines(data)).toEqual(["fields: quantity, title", "changes: quantity 250 → 300, title A → B"]);
  });

  it("show small objects by their values and cut long values", () => {
    expect(lines({ weights: { technical: 40, price: 60 } })).toEqual(["weights: technical 40, price 60"]);
    const [line] = ledgerDetails({ reason: "x".repeat(400) });
    expect(line.text.length).toBe(160);
    expect(line.text.endsWith("…")).toBe(true);
  });
});

import { describe, expect, it } from "vitest";
import { awardNotice, regretNotice } from "@/lib/approvals/notices";
import { standingsOf } from "@/lib/approvals/score-sheet";

const tender = { id: "t1", reference: "RC-2099-007", title: "Harbour buoy radios" };
const sheet = {
  offers: [
    {
      offerId: "a",
      vendorName: "Alder Links",
      total: 80.25,
      rank: 1,
      disqualified: false,
      flags: [],
      lines: [{ criterion: "price", normalised: 100, weight: 30, rawText: "€400,000.00 (4,000 × €100.00)" }],
    },
    {
      offerId: "b",
      vendorName: "Birch Radio",
      total: 61,
      rank: 2,
      disqualified: false,
      flags: [],
      lines: [
        { criterion: "price", normalised: 80, weight: 30, rawText: "€500,000.00 (4,000 × €125.00)" },
        { criterion: "technical", normalised: 55.56, weight: 40 },
      ],
    },
    { offerId: "c", vendorName: "Cedar RF", total: null, rank: null, disqualified: true, flags: ["Disqualified: confirmed impossible claim"], lines: [] },
  ],
};

describe("notices to vendors", () => {
  const standings = standingsOf(sheet);

  it("reads the score-sheet snapshot defensively", () => {
    expect(standings.map((s) => [s.vendorName, s.rank])).toEqual([
      ["Alder Links", 1],
      ["Birch Radio", 2],
      ["Cedar RF", null],
    ]);
    expect(standingsOf(null)).toEqual([]);
    expect(standingsOf({ offers: [7, { vendorName: 3 }] })).toEqual([
      { offerId: "", vendorName: "3", total: null, rank: null, disqualified: false, flags: [], criteria: [] },
    ]);
  });

  const ends = new Date("2099-03-11T12:00:00Z");
  const disclosure = (mode: "rank" | "rank-and-scores") =>
    ({ mode, winnerName: "Alder Links", winnerTotal: 80.25, standstillDays: 10, standstillEnds: ends, zone: "Europe/London" }) as const;

  it("tells the runner-up, by default, the winner's name and its own rank, and no score at all", () => {
    const { subject, text } = regretNotice(tender, "Birch Radio", standings[1], 2, disclosure("rank"));
    expect(subject).toBe("Outcome of tender RC-2099-007 Harbour buoy radios");
    expect(text).toContain("The tender is awarded to Alder Links.");
    expect(text).toContain("Your offer ranked 2 of 2.");
    // A price score of 80 and one's own price of 125 give the winner's 100: no score goes out by default.
    expect(text).not.toMatch(/score|80\.0|55\.6|61\.0|of 100/);
    expect(text).not.toMatch(/Cedar|€|400,000|500,000|100\.00|125\.00/);
  });

  it("adds its own scores and the winner's total only when the tender discloses scores", () => {
    const { text } = regretNotice(tender, "Birch Radio", standings[1], 2, disclosure("rank-and-scores"));
    expect(text).toContain("Your offer ranked 2 of 2, with a total score of 61.0 out of 100.");
    expect(text).toContain("The winning offer's total score is 80.3 out of 100.");
    expect(text).toContain("- Technical (weight 40): 55.6 of 100");
    expect(text).toContain("- Price (weight 30): 80.0 of 100");
    expect(text).not.toMatch(/Cedar|€|400,000|500,000|100\.00|125\.00/);
  });

  it("gives every vendor the standstill period, its end in the tender's zone, and where to object", () => {
    const { text } = regretNotice(tender, "Birch Radio", standings[1], 2, disclosure("rank"));
    expect(text).toContain("standstill period of 10 days, on Wednesday 11 March 2099, 12:00 (Europe/London)");
    expect(text).toContain("you may object to it in writing: /tenders/t1/notices");
  });

  it("tells a disqualified vendor why, without a rank", () => {
    const { text } = regretNotice(tender, "Cedar RF", standings[2], 2, disclosure("rank"));
    expect(text).toContain("Your offer was not ranked");
    expect(text).toContain("Disqualified: confirmed impossible claim");
    expect(text).not.toMatch(/Birch/);
  });

  it("gives the winner its own award", () => {
    const { subject, text } = awardNotice(
      tender,
      { vendorName: "Alder Links", moduleName: "AL-9", quantity: 4000, value: 400_000, currency: "EUR" },
      "RC-2099-007-M1",
      disclosure("rank"),
    );
    expect(subject).toBe("Award notice: RC-2099-007 Harbour buoy radios");
    expect(text).toContain("4,000 units for €400,000.00");
    expect(text).toContain("RC-2099-007-M1");
    expect(text).toContain("The award becomes final at the end of a standstill period of 10 days");
  });
});

import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  buildScoreSheet,
  csvCell,
  evidenceScore,
  leadTimeScore,
  pointScore,
  priceScore,
  residualInTargetMetric,
  scoringMargins,
  technicalScore,
  unitPriceAt,
  warrantyScore,
  type ScoringClaim,
  type ScoringInput,
  type ScoringOffer,
} from "@/lib/scoring";

const target = { targetMetric: "bler" as const, targetValue: 1e-4 };
const claim = (over: Partial<ScoringClaim> = {}): ScoringClaim => ({
  id: "c",
  pointIndex: 0,
  metric: "bler",
  value: 1e-5,
  ncgOutputBer: null,
  verdict: "plausible",
  k: 1620,
  rateGapFraction: 0.1,
  channelMargin: 10,
  channelKind: "ratio",
  mark: "accepted",
  evidence: "none",
  ...over,
});

describe("technical score of a point", () => {
  it("maps the margins as documented: sRate 0.5 + 0.5 g / 0.25, sChannel 0.5 + 0.5 log10(ratio)", () => {
    // g = 0.1 -> 0.7; ratio 10 -> 1; mean 0.85 -> 85 for a plausible claim, half for needs evidence.
    expect(pointScore(claim(), target).score).toBeCloseTo(85, 12);
    expect(pointScore(claim({ verdict: "needs-evidence" }), target).score).toBeCloseTo(42.5, 12);
    // dB margins: +1.5 dB -> 0.5 + 0.5 * 1.5 / 3 = 0.75; with g = -0.05 -> 0.4; mean 0.575.
    expect(pointScore(claim({ channelKind: "dB", channelMargin: 1.5, rateGapFraction: -0.05 }), target).score).toBeCloseTo(57.5, 12);
    // No margins computed at all: 50 %.
    expect(pointScore(claim({ rateGapFraction: null, channelMargin: null }), target).score).toBe(50);
  });

  it("scores 0 for an impossible claim, a missing claim, or one worse than required", () => {
    expect(pointScore(claim({ verdict: "impossible" }), target).score).toBe(0);
    expect(pointScore(undefined, target).score).toBe(0);
    const worse = pointScore(claim({ value: 2e-4 }), target);
    expect(worse).toMatchObject({ score: 0, meets: false });
  });

  it("compares a BER claim with a BLER requirement through k (BLER <= k BER)", () => {
    expect(residualInTargetMetric({ metric: "ber", value: 1e-8, ncgOutputBer: null, k: 1000 }, "bler")).toBeCloseTo(1e-5, 18);
    expect(residualInTargetMetric({ metric: "ber", value: 1e-8, ncgOutputBer: null, k: null }, "bler")).toBeNull();
    expect(residualInTargetMetric({ metric: "bler", value: 1e-5, ncgOutputBer: null, k: null }, "ber")).toBe(1e-5);
    expect(residualInTargetMetric({ metric: "ncg", value: 8.5, ncgOutputBer: 1e-12, k: null }, "ber")).toBe(1e-12);
  });

  it("never falls when a margin grows (monotone)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -2, max: 2, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 1e-3, max: 1e3, noNaN: true }),
        fc.double({ min: 0, max: 10, noNaN: true }),
        (g, dg, ratio, factor) => {
          const a = pointScore(claim({ rateGapFraction: g, channelMargin: ratio }), target).score;
          const b = pointScore(claim({ rateGapFraction: g + dg, channelMargin: ratio * (1 + factor) }), target).score;
          return b >= a - 1e-12 && a >= 0 && b <= 100;
        },
      ),
    );
  });

  it("averages over the operating points", () => {
    expect(technicalScore([85, 0])).toBe(42.5);
    expect(technicalScore([])).toBe(0);
  });

  it("reads the margins from the engine's stored result", () => {
    expect(scoringMargins({ rateGapFraction: 0.08, channelKind: "ratio", channel: { normal: 2.6, capacity: 4.9 } })).toEqual({
      rateGapFraction: 0.08,
      channelMargin: 2.6,
      channelKind: "ratio",
    });
    expect(scoringMargins({ rateGapFraction: null, channelKind: "dB", channel: { normal: null, capacity: 1.2 } }).channelMargin).toBe(1.2);
    expect(scoringMargins(null)).toEqual({ rateGapFraction: null, channelMargin: null, channelKind: "ratio" });
  });
});

describe("evidence score", () => {
  it("is 50 + 50 (verified - contradicted) / claims, a rejected-impossible mark counting as contradicted", () => {
    const claims = [
      { evidence: "verified" as const, mark: "accepted" as const },
      { evidence: "verified" as const, mark: "accepted" as const },
      { evidence: "none" as const, mark: "rejected-impossible" as const },
      { evidence: "inconclusive" as const, mark: null },
    ];
    expect(evidenceScore(claims)).toEqual({ score: 62.5, verified: 2, contradicted: 1 });
    // A verified run on a claim an engineer rejected does not count as verified.
    expect(evidenceScore([{ evidence: "verified", mark: "rejected-impossible" }]).score).toBe(0);
    expect(
      evidenceScore([
        { evidence: "contradicted", mark: "accepted" },
        { evidence: "contradicted", mark: null },
      ]).score,
    ).toBe(0);
    expect(evidenceScore([]).score).toBe(50);
  });
});

describe("relative criteria", () => {
  it("price, lead time and warranty follow their ratio forms", () => {
    expect(priceScore(200, 150)).toBe(75);
    expect(priceScore(0, 0)).toBe(100);
    expect(leadTimeScore(12, 8)).toBeCloseTo(200 / 3, 12);
    expect(leadTimeScore(0, 0)).toBe(100);
    expect(leadTimeScore(4, 0)).toBe(0);
    expect(warrantyScore(18, 36)).toBe(50);
    expect(warrantyScore(0, 0)).toBe(0);
  });

  it("takes the largest price break at or below the quantity", () => {
    const breaks = [
      { minQuantity: 5000, unitPrice: 9 },
      { minQuantity: 1000, unitPrice: 11 },
      { minQuantity: 2500, unitPrice: 10 },
    ];
    expect(unitPriceAt(12, breaks, 999)).toBe(12);
    expect(unitPriceAt(12, breaks, 2500)).toBe(10);
    expect(unitPriceAt(12, breaks, 4999)).toBe(10);
    expect(unitPriceAt(12, breaks, 10_000)).toBe(9);
  });
});

describe("the tender's rule for confirmed impossible claims", () => {
  const base = (id: string, unitPrice: number, claims: ScoringClaim[]): ScoringOffer => ({
    id,
    vendorOrgId: id,
    vendorName: id,
    moduleName: id,
    partNumber: id,
    codeFamily: "LDPC",
    decision: "hard",
    n: 1944,
    k: 1620,
    rate: 1620 / 1944,
    envelope: { unitPrice, currency: "EUR", leadTimeWeeks: 8, warrantyMonths: 24, priceBreaks: [] },
    claims,
  });
  const rejected = claim({ verdict: "impossible", mark: "rejected-impossible" });
  const input = (rule: "disqualify" | "penalty", penalty = 0): ScoringInput => ({
    tender: {
      reference: "RC-RULE",
      channelModel: "bsc",
      operatingPoints: [{ label: "P", value: 1e-3 }],
      targetMetric: "bler",
      targetValue: 1e-4,
      quantity: 100,
      currency: "EUR",
      weights: { technical: 50, evidence: 0, price: 50, leadTime: 0, warranty: 0 },
      impossibleRule: rule,
      impossiblePenalty: penalty,
    },
    offers: [base("Cheap", 5, [rejected]), base("Fair", 10, [claim()])],
  });

  it("disqualify: shown, flagged, no rank, and the price reference comes from offers still standing", () => {
    const sheet = buildScoreSheet(input("disqualify"));
    const cheap = sheet.offers.find((o) => o.offerId === "Cheap")!;
    expect(cheap).toMatchObject({ disqualified: true, rank: null });
    expect(cheap.flags[0]).toMatch(/Disqualified/);
    expect(sheet.offers[0].offerId).toBe("Fair");
    expect(sheet.offers[0].rank).toBe(1);
    expect(sheet.offers[0].lines.find((l) => l.criterion === "price")!.normalised).toBe(100);
  });

  it("disqualify: the cheaper disqualified offer shows no score at all, and every score stays within 0..100", () => {
    const sheet = buildScoreSheet(input("disqualify"));
    const cheap = sheet.offers.find((o) => o.offerId === "Cheap")!;
    // Before: its price score was 100 x 10 / 5 = 200 on a 0..100 scale.
    expect(cheap.lines.every((l) => l.normalised === null && l.contribution === null)).toBe(true);
    expect(cheap.total).toBeNull();
    expect(cheap.totalPrice).toBe(500);
    for (const o of sheet.offers)
      for (const l of o.lines)
        if (l.normalised !== null) {
          expect(l.normalised).toBeGreaterThanOrEqual(0);
          expect(l.normalised).toBeLessThanOrEqual(100);
        }
  });

  it("flags an acceptance that overrides the engine's impossible verdict", () => {
    const i = input("disqualify");
    i.offers[0].claims = [claim({ verdict: "impossible", mark: "accepted" })];
    expect(
      buildScoreSheet(i)
        .offers.find((o) => o.offerId === "Cheap")!
        .flags.join(" "),
    ).toMatch(/Accepted although the engine found it impossible \(P\)/);
  });

  it("penalty: subtracts the points (floor 0) and keeps the offer ranked", () => {
    const plain = buildScoreSheet(input("penalty", 0));
    const cheapPlain = plain.offers.find((o) => o.offerId === "Cheap")!;
    // Cheap: technical 0 (impossible), price 100 -> 50; Fair: technical 85, price 50 -> 67.5.
    expect(cheapPlain.total).toBeCloseTo(50, 12);
    const sheet = buildScoreSheet(input("penalty", 20));
    const cheap = sheet.offers.find((o) => o.offerId === "Cheap")!;
    expect(cheap).toMatchObject({ disqualified: false, penalty: 20, rank: 2 });
    expect(cheap.total).toBeCloseTo(30, 12);
    expect(buildScoreSheet(input("penalty", 80)).offers.find((o) => o.offerId === "Cheap")!.total).toBe(0);
  });

  it("an unconfirmed impossible verdict (no rejecting mark) is not a confirmed impossible claim", () => {
    const i = input("disqualify");
    i.offers[0].claims = [claim({ verdict: "impossible", mark: "accepted" })];
    expect(buildScoreSheet(i).offers.find((o) => o.offerId === "Cheap")!.disqualified).toBe(false);
    i.offers[0].claims = [claim({ evidence: "contradicted" })];
    expect(buildScoreSheet(i).offers.find((o) => o.offerId === "Cheap")!.disqualified).toBe(true);
  });

  it("refuses to score a price in another currency, flagging it rather than guessing a rate", () => {
    const i = input("disqualify");
    i.offers[1].envelope = { ...i.offers[1].envelope!, currency: "USD" };
    const fair = buildScoreSheet(i).offers.find((o) => o.offerId === "Fair")!;
    expect(fair).toMatchObject({ needsConversion: true, total: null, rank: null, totalPrice: null });
    expect(fair.lines.find((l) => l.criterion === "price")!.rawText).toMatch(/needs conversion/);
  });

  it("withholds commercial scores, totals and ranks while an envelope is sealed", () => {
    const i = input("penalty");
    i.offers = i.offers.map((o) => ({ ...o, envelope: null }));
    const sheet = buildScoreSheet(i);
    expect(sheet.sealed).toBe(true);
    expect(sheet.offers.every((o) => o.total === null && o.rank === null && o.totalPrice === null)).toBe(true);
    expect(sheet.offers[0].lines.find((l) => l.criterion === "technical")!.normalised).not.toBeNull();
  });
});

describe("the Comparison CSV", () => {
  it("carries numbers as numbers: no currency sign, no thousands separator, no float noise; nothing for no value", () => {
    expect(csvCell(164000)).toBe("164000");
    expect(csvCell(81.23456789)).toBe("81.2346");
    expect(csvCell(0.1 + 0.2)).toBe("0.3");
    expect(csvCell(null)).toBe("");
    expect(csvCell("Kestrelink Radio")).toBe("Kestrelink Radio");
    expect(Number(csvCell(41.05 * 4000))).toBeCloseTo(164200, 6);
  });
});

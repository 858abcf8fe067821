import { describe, expect, it } from "vitest";
import { buildScoreSheet, comparisonRows, totalPriceAt, type PriceBreak, type ScoringInput, type ScoringOffer } from "@/lib/scoring";

/*
 * A worked example, by hand. Quantity 1,000 units, EUR. Weights: price 70, lead time 30 (the other
 * criteria weigh 0, so the sum of weights is 100).
 *
 *   offer     base unit  price breaks                   unit at 1,000   total at 1,000   lead time
 *   Alder     12.50      >= 500: 11.90, >= 2000: 10.00  11.90           11,900.00        8 weeks
 *   Birch     11.75      none                           11.75           11,750.00        12 weeks
 *   Cedar     13.99      >= 1000: 11.05                 11.05 (1000<=1000) 11,050.00     10 weeks
 *
 * Price score = 100 * lowest / offered, lowest = 11,050.00:
 *   Alder 100 * 11050 / 11900 = 650/7     = 92.857142857142857...
 *   Birch 100 * 11050 / 11750 = 22100/235 = 94.042553191489361...
 *   Cedar 100
 * Lead-time score = 100 * shortest / offered, shortest = 8 weeks:
 *   Alder 100, Birch 100 * 8/12 = 66.666666666666667..., Cedar 100 * 8/10 = 80
 * Total = (70 * price + 30 * lead) / 100:
 *   Alder 0.7 * 650/7 + 0.3 * 100          = 65 + 30 = 95
 *   Birch 0.7 * 22100/235 + 0.3 * 200/3    = 65.829787234042553 + 20 = 85.829787234042553
 *   Cedar 0.7 * 100 + 0.3 * 80             = 70 + 24 = 94
 * Ranks: Alder 1, Cedar 2, Birch 3.
 */
const offer = (id: string, unitPrice: number, leadTimeWeeks: number, priceBreaks: PriceBreak[]): ScoringOffer => ({
  id,
  vendorOrgId: `org-${id}`,
  vendorName: id,
  moduleName: `${id} module`,
  partNumber: `${id}-1`,
  codeFamily: "LDPC",
  decision: "hard",
  n: null,
  k: null,
  rate: null,
  envelope: { unitPrice, currency: "EUR", leadTimeWeeks, warrantyMonths: 24, priceBreaks },
  claims: [],
});

const input: ScoringInput = {
  tender: {
    reference: "RC-HAND-001",
    channelModel: "bsc",
    operatingPoints: [],
    targetMetric: "bler",
    targetValue: 1e-4,
    quantity: 1000,
    currency: "EUR",
    weights: { technical: 0, evidence: 0, price: 70, leadTime: 30, warranty: 0 },
    impossibleRule: "disqualify",
    impossiblePenalty: 0,
  },
  offers: [
    offer("Alder", 12.5, 8, [
      { minQuantity: 500, unitPrice: 11.9 },
      { minQuantity: 2000, unitPrice: 10 },
    ]),
    offer("Birch", 11.75, 12, []),
    offer("Cedar", 13.99, 10, [{ minQuantity: 1000, unitPrice: 11.05 }]),
  ],
};

describe("a worked score sheet", () => {
  const sheet = buildScoreSheet(input);
  const by = (name: string) => sheet.offers.find((o) => o.vendorName === name)!;
  const line = (name: string, c: string) => by(name).lines.find((l) => l.criterion === c)!;

  it("prices each offer at the tender quantity with its price breaks, to the cent", () => {
    expect(by("Alder").totalPrice).toBe(11900);
    expect(by("Birch").totalPrice).toBe(11750);
    expect(by("Cedar").totalPrice).toBe(11050);
    expect(by("Alder").unitPriceUsed).toBe(11.9);
    expect(by("Cedar").unitPriceUsed).toBe(11.05);
    // A break above the quantity never applies; at 2,000 units Alder's second break does.
    expect(
      totalPriceAt(
        12.5,
        [
          { minQuantity: 500, unitPrice: 11.9 },
          { minQuantity: 2000, unitPrice: 10 },
        ],
        2000,
      ),
    ).toBe(20000);
    expect(totalPriceAt(13.99, [{ minQuantity: 1000, unitPrice: 11.05 }], 999)).toBe(13976.01);
  });

  it("normalises price and lead time as written out above", () => {
    expect(line("Alder", "price").normalised).toBeCloseTo(650 / 7, 9);
    expect(line("Birch", "price").normalised).toBeCloseTo(22100 / 235, 9);
    expect(line("Cedar", "price").normalised).toBe(100);
    expect(line("Alder", "leadTime").normalised).toBe(100);
    expect(line("Birch", "leadTime").normalised).toBeCloseTo(200 / 3, 9);
    expect(line("Cedar", "leadTime").normalised).toBeCloseTo(80, 9);
  });

  it("weights the criteria into totals and ranks them", () => {
    expect(sheet.weightSum).toBe(100);
    expect(by("Alder").total).toBeCloseTo(95, 9);
    expect(by("Birch").total).toBeCloseTo(65.829787234042553 + 20, 9);
    expect(by("Cedar").total).toBeCloseTo(94, 9);
    expect(sheet.offers.map((o) => [o.vendorName, o.rank])).toEqual([
      ["Alder", 1],
      ["Cedar", 2],
      ["Birch", 3],
    ]);
    // Each contribution is weight * normalised / sum of weights, and they add up to the total.
    expect(line("Birch", "price").contribution).toBeCloseTo((70 * 22100) / 235 / 100, 9);
    const sum = by("Birch").lines.reduce((s, l) => s + (l.contribution ?? 0), 0);
    expect(sum).toBeCloseTo(by("Birch").total!, 12);
    // Criteria weighing 0 contribute nothing, whatever they score.
    expect(line("Alder", "warranty").contribution).toBe(0);
  });

  it("explains each line with its raw value and unit", () => {
    expect(line("Alder", "price").raw).toBe(11900);
    expect(line("Alder", "price").rawText).toContain("1,000 ×");
    expect(line("Birch", "leadTime").rawText).toBe("12 weeks");
  });

  it("re-ranks under what-if weights without touching the tender's frozen weights", () => {
    const whatIf = buildScoreSheet(input, { technical: 0, evidence: 0, price: 100, leadTime: 0, warranty: 0 });
    expect(whatIf.offers.map((o) => o.vendorName)).toEqual(["Cedar", "Birch", "Alder"]);
    expect(input.tender.weights.price).toBe(70);
    expect(buildScoreSheet(input).offers[0].vendorName).toBe("Alder");
  });

  it("gives grid rows in rank order with the total price and scores", () => {
    const rows = comparisonRows(input, sheet);
    expect(rows.map((r) => r.vendorName)).toEqual(["Alder", "Cedar", "Birch"]);
    expect(rows[1]).toMatchObject({ totalPrice: 11050, unitPrice: 11.05, leadTimeWeeks: 10, rank: 2 });
    expect(rows[1].scores.price).toBe(100);
  });
});

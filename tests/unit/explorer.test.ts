import { describe, expect, it } from "vitest";
import { evaluateClaim } from "@/lib/bounds";
import { boundViewOfResult, buildBoundCharts, sensitivityResult } from "@/lib/explorer";
import { explorerIssues, explorerSchema, sensitivitySchema } from "@/lib/validation/explorer";

describe("the bound charts", () => {
  it("span the claim's own channel even far from the waterfall", () => {
    // At p = 5e-3 this (2048, 1640) code sits far left of its waterfall (BLER near 1e-30).
    const charts = buildBoundCharts({ model: "bsc", x: 0.005, n: 2048, k: 1640, target: 1e-4 });
    const xs = charts.channel.map((p) => p.x);
    expect(Math.min(...xs)).toBeLessThanOrEqual(0.005);
    expect(Math.max(...xs)).toBeGreaterThanOrEqual(0.005);
    expect(charts.channel.every((p) => Number.isFinite(p.normal))).toBe(true);
  });

  it("keep the waterfall's own range when the claim is inside it", () => {
    const inside = buildBoundCharts({ model: "bsc", x: 0.02, n: 2048, k: 1640, target: 1e-4 });
    expect(inside.channel[0].x).toBeLessThan(0.02);
    expect(inside.channel[inside.channel.length - 1].x).toBeGreaterThan(0.02);
  });

  it("chart a rate stated with n at the engine's whole k, and nothing without n", () => {
    const withN = evaluateClaim({ channel: { model: "bsc", p: 1e-3 }, code: { n: 2048, rate: 0.95 }, target: { metric: "bler", value: 1e-6 } });
    expect(withN.k).toBe(1945); // floor(2048 x 0.95 = 1945.6)
    expect(boundViewOfResult(withN)).toMatchObject({ model: "bsc", x: 1e-3, n: 2048, k: 1945, target: 1e-6 });
    const rateOnly = evaluateClaim({ channel: { model: "bsc", p: 1e-3 }, code: { rate: 0.95 }, target: { metric: "bler", value: 1e-6 } });
    expect(boundViewOfResult(rateOnly)).toBeNull();
  });

  it("chart a soft-decision claim stated in Es/N0 at its Eb/N0", () => {
    const result = evaluateClaim({ channel: { model: "biawgn", esn0Db: 0 }, code: { n: 1000, k: 500 }, target: { metric: "bler", value: 1e-3 } });
    // Eb/N0 = Es/N0 - 10 log10(R) = 0 + 3.0103 dB at rate 1/2.
    expect(boundViewOfResult(result)!.x).toBeCloseTo(3.0103, 3);
  });
});

describe("the explorer's inputs in words", () => {
  it("an invalid view gets sentences naming the fields, not a validator's message", () => {
    const text = explorerSchema.safeParse({ model: "bsc", x: "abc", n: "100", k: "50" });
    expect(explorerIssues(text.error!)).toEqual(["The channel value must be a number."]);
    const r = explorerSchema.safeParse({ model: "bsc", x: "0.01", n: "100", k: "200", target: "0.7" });
    expect(explorerIssues(r.error!)).toEqual([
      "The information bits k must be a whole number from 1 to n (100).",
      "The target BLER must be above 0 and below 0.5.",
    ]);
  });
  it("the soft-decision charts carry the 1959 bound and the energy limit", () => {
    const charts = buildBoundCharts({ model: "biawgn", x: 1, n: 1024, k: 512, target: 1e-4 });
    expect(charts.result.verdict).toBe("impossible"); // issue 11: the 1959 bound needs about 1.1 dB
    expect(charts.channel.every((p) => p.converse !== null && p.converse <= 0)).toBe(true);
    expect(charts.result.thresholds.spherePacking!).toBeCloseTo(1.0953, 4);
    expect(charts.result.energy!.converseEbn0Db!).toBeLessThan(0);
    expect(charts.rate.every((p) => p.converseRate !== null && p.converseRate >= p.normalRate - 0.05)).toBe(true);
  });
});

describe("the sensitivity calculator", () => {
  it("turns an input level into Eb/N0 and back, with the least level for the payload", () => {
    const v = sensitivitySchema.parse({ level: "-121.5", rb: "1200", nf: "2", payload: "160", per: "0.01" });
    const r = sensitivityResult(v);
    expect(r.ebn0Db).toBeCloseTo(-121.5 + 173.9751871942281 - 10 * Math.log10(1200) - 2, 9);
    expect(r.levelDbm).toBeCloseTo(-121.5, 9);
    // the least level is the converse's Eb/N0 plus noise, rate and noise figure (PPV 2011)
    expect(r.limitLevelDbm! - r.limitEbn0Db!).toBeCloseTo(-121.5 - r.ebn0Db, 9);
    const back = sensitivityResult(sensitivitySchema.parse({ ebn0: String(r.ebn0Db), rb: "1200", nf: "2" }));
    expect(back.levelDbm).toBeCloseTo(-121.5, 9);
  });
  it("refuses both a level and an Eb/N0, or a bad bit rate, in words", () => {
    const r = sensitivitySchema.safeParse({ level: "-120", ebn0: "3", rb: "-5" });
    expect(explorerIssues(r.error!)).toEqual([
      "Give either the input level or Eb/N0, not both.",
      "The information bit rate must be from 0.001 to 10^12 bit/s.",
    ]);
  });
});

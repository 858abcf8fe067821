import { describe, expect, it } from "vitest";
import { evaluateClaim } from "@/lib/bounds";
import { boundViewOfResult, buildBoundCharts } from "@/lib/explorer";

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

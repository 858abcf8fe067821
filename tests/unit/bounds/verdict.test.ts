// Verdict rules of BOUNDS.md section 5 on worked examples, and the claim contract of the API and CLI.
import { describe, expect, it } from "vitest";
import { ENGINE_VERSION, bscConverseLog, claimSchema, evaluateClaim, formatClaimError, netCodingGainDb, rawBerForNcg, type ClaimInput } from "@/lib/bounds";

const bsc = (p: number, code: ClaimInput["code"], value = 1e-6, metric: "bler" | "ber" = "bler") =>
  evaluateClaim({ channel: { model: "bsc", p }, code, target: { metric, value } });
const codes = (r: ReturnType<typeof evaluateClaim>) => r.findings.map((f) => f.code);

describe("verdicts on the BSC, n = 1944, k = 1620, BLER 1e-6 (PPV Theorems 33 and 35)", () => {
  const code = { n: 1944, k: 1620 };
  it("plausible well inside the RCU threshold", () => {
    const r = bsc(0.002, code);
    expect(r.verdict).toBe("plausible");
    expect(codes(r)).toContain("within-achievability");
    expect(r.converse!.log10Bler).toBeLessThanOrEqual(r.achievable!.log10Bler);
  });
  it("needs evidence between the two thresholds, impossible beyond the converse threshold", () => {
    const t = bsc(0.002, code).thresholds;
    expect(t.achievable!).toBeLessThan(t.converse!);
    const mid = (t.achievable! + t.converse!) / 2;
    expect(bsc(mid, code).verdict).toBe("needs-evidence");
    expect(codes(bsc(mid, code))).toContain("beyond-achievability");
    const r = bsc(t.converse! * 1.01, code);
    expect(r.verdict).toBe("impossible");
    expect(codes(r)).toContain("below-converse");
    expect(r.findings.find((f) => f.code === "below-converse")!.source).toBe("Polyanskiy, Poor, Verdu 2010, Theorem 35");
  });
  it("gives the benefit of the doubt within a relative 1e-9 of the converse, not beyond", () => {
    const p = 0.0125;
    const eps = Math.exp(bscConverseLog(1944, 1620, p));
    expect(bsc(p, code, eps).verdict).not.toBe("impossible");
    expect(bsc(p, code, eps * (1 - 1e-10)).verdict).not.toBe("impossible");
    expect(bsc(p, code, eps * (1 - 1e-6)).verdict).toBe("impossible");
  });
  it("reports margins consistent with the thresholds", () => {
    const r = bsc(0.002, code);
    expect(r.margins.channelKind).toBe("ratio");
    expect(r.margins.channel.converse).toBeCloseTo(r.thresholds.converse! / 0.002, 12);
    expect(r.margins.rateGapBits).toBeCloseTo(r.normal!.rate - 1620 / 1944, 12);
    expect(r.margins.rateGapFraction).toBeCloseTo(r.margins.rateGapBits! / r.normal!.rate, 12);
    expect(r.engineVersion).toBe(ENGINE_VERSION);
  });
  it("writes each finding as one sentence with its source", () => {
    for (const p of [0.002, 0.0117, 0.02, 0.2]) {
      for (const f of bsc(p, code).findings) {
        expect(f.message.endsWith(".")).toBe(true);
        expect(f.message.slice(0, -1)).not.toMatch(/\.\s/);
        expect(f.source.length).toBeGreaterThan(5);
      }
    }
  });
});

describe("BER claims (BOUNDS.md section 4: BER <= BLER <= k BER)", () => {
  it("is impossible when the BER is below epsilon_min / k", () => {
    const p = 0.013;
    const epsMin = Math.exp(bscConverseLog(1944, 1620, p));
    expect(bsc(p, { n: 1944, k: 1620 }, (epsMin / 1620) * 0.5, "ber").verdict).toBe("impossible");
    expect(bsc(p, { n: 1944, k: 1620 }, (epsMin / 1620) * 2, "ber").verdict).not.toBe("impossible");
  });
  it("is plausible when the RCU bound guarantees BLER at or below the BER", () => {
    const r = bsc(0.002, { n: 1944, k: 1620 }, 1e-12, "ber");
    expect(r.verdict).toBe("plausible");
    expect(codes(r)).toContain("ber-target");
  });
  it("is impossible at any n when R (1 - h2(pb)) > C", () => {
    const r = bsc(0.06, { rate: 0.7 }, 1e-3, "ber");
    expect(r.verdict).toBe("impossible");
    expect(codes(r)).toContain("capacity-exceeded");
  });
});

describe("claims without n, k or with a derived k", () => {
  it("rate-only: only asymptotic checks, and the finding says so", () => {
    const r = bsc(0.002, { rate: 0.8333 });
    expect(r.verdict).toBe("needs-evidence");
    expect(codes(r)).toContain("asymptotic-only");
    expect(r.converse).toBeNull();
    expect(r.achievable).toBeNull();
    expect(r.normal).toBeNull();
    expect(r.thresholds.converse).toBeNull();
    expect(r.n).toBeNull();
    expect(r.k).toBeNull();
  });
  it("overhead-only: R = 1 / (1 + OH)", () => {
    expect(bsc(0.002, { overhead: 0.07 }).rate).toBeCloseTo(1 / 1.07, 15);
  });
  it("k missing: n with a rate gives the whole k = floor(n R), and says so", () => {
    const r = bsc(0.002, { n: 64800, rate: 5 / 6 });
    expect(r.k).toBe(54000);
    expect(codes(r)).not.toContain("whole-k");
    expect(r.converse).not.toBeNull();
    const real = bsc(0.002, { n: 1944, rate: 0.8333 }); // n R = 1619.94
    expect(real.k).toBe(1619);
    expect(real.rate).toBe(1619 / 1944);
    expect(real.findings.find((f) => f.code === "whole-k")!.message).toMatch(/1619\.94 information bits, so k = 1619 is used \(rounded down/);
  });
  it("rounding k down never makes a claim impossible that the fractional k allowed", () => {
    // BLER bounds grow with k, so floor(n R) can only move a verdict away from impossible
    const n = 2048;
    const p = 0.0125;
    const fractional = bscConverseLog(n, 2048 * 0.95, p);
    expect(bscConverseLog(n, 1945, p)).toBeLessThanOrEqual(fractional);
  });
});

describe("net coding gain claims (ITU-T G.975.1)", () => {
  it("resolves the raw BER the gain implies, and the round trip gives the gain back", () => {
    const claim: ClaimInput = { channel: { model: "bsc", ncgDb: 9 }, code: { n: 30592, k: 28592 }, target: { metric: "ber", value: 1e-15 } };
    const r = evaluateClaim(claim);
    const R = 28592 / 30592;
    expect(r.channel.p).toBeCloseTo(rawBerForNcg(9, 1e-15, R), 15);
    expect(netCodingGainDb(r.channel.p!, 1e-15, R)).toBeCloseTo(9, 9);
    expect(codes(r)).toContain("ncg-resolved");
  });
  it("on the BI-AWGN channel uses the Es/N0 of that raw BER, and an absurd gain is impossible", () => {
    const r = evaluateClaim({ channel: { model: "biawgn", ncgDb: 11 }, code: { n: 30592, k: 28592 }, target: { metric: "ber", value: 1e-15 } });
    expect(r.thresholds.unit).toBe("ebn0Db");
    expect(r.channel.esn0Db).toBeDefined();
    const absurd = evaluateClaim({ channel: { model: "bsc", ncgDb: 16 }, code: { overhead: 0.07 }, target: { metric: "ber", value: 1e-15 } });
    expect(absurd.verdict).toBe("impossible");
  });
});

describe("BI-AWGN verdicts (normal approximation decides plausibility; capacity decides impossibility)", () => {
  const awgn = (ebn0Db: number) =>
    evaluateClaim({ channel: { model: "biawgn", ebn0Db }, code: { n: 64800, k: 32400 }, target: { metric: "bler", value: 1e-6 } });
  it("plausible, needs evidence, impossible across Eb/N0", () => {
    const t = awgn(2).thresholds;
    expect(t.capacity).toBeLessThan(t.normal!);
    expect(awgn(2).verdict).toBe("plausible");
    expect(awgn((t.capacity + t.normal!) / 2).verdict).toBe("needs-evidence");
    expect(awgn(t.capacity - 0.05).verdict).toBe("impossible");
    expect(awgn(2).margins.channel.normal).toBeCloseTo(t.normal! - 2, 12);
    expect(awgn(2).converse).toBeNull();
  });
  it("reports Es/N0 thresholds when the claim states Es/N0", () => {
    const r = evaluateClaim({ channel: { model: "biawgn", esn0Db: -1 }, code: { n: 1944, k: 972 }, target: { metric: "bler", value: 1e-6 } });
    expect(r.thresholds.unit).toBe("esn0Db");
    expect(r.thresholds.shannon).toBeCloseTo(0.187 - 10 * Math.log10(2), 2); // rate 1/2 limit as Es/N0
  });
});

describe("edge channels and codes", () => {
  it("noiseless channels allow any rate up to 1", () => {
    expect(bsc(0, { n: 100, k: 100 }, 1e-30).verdict).toBe("plausible");
    const bec = evaluateClaim({ channel: { model: "bec", e: 0 }, code: { n: 100, k: 90 }, target: { metric: "bler", value: 1e-30 } });
    expect(bec.verdict).toBe("plausible");
    expect(bec.converse!.bler).toBe(0);
  });
  it("p = 0.5 has capacity 0", () => {
    const r = bsc(0.5, { n: 100, k: 1 }, 0.4);
    expect(r.capacity).toBe(0);
    expect(r.verdict).toBe("impossible");
  });
  it("uncoded (k = n) is plausible exactly at its own BLER 1 - (1 - p)^n", () => {
    const p = 1e-4;
    const exact = -Math.expm1(1000 * Math.log1p(-p));
    expect(bsc(p, { n: 1000, k: 1000 }, exact * (1 + 1e-6)).verdict).toBe("plausible");
    expect(bsc(p, { n: 1000, k: 1000 }, exact * (1 - 1e-6)).verdict).toBe("impossible");
  });
});

describe("bad input: every message names the field and the allowed range", () => {
  const ok = { channel: { model: "bsc", p: 0.002 }, code: { n: 1944, k: 1620 }, target: { metric: "bler", value: 1e-6 } };
  const bad: [string, unknown, RegExp][] = [
    ["n < 1", { ...ok, code: { n: 0, k: 1 } }, /code\.n: must be at least 1/],
    ["k < 1", { ...ok, code: { n: 10, k: 0 } }, /code\.k: must be at least 1/],
    ["k > n", { ...ok, code: { n: 1944, k: 2000 } }, /code\.k: must be at most n \(1944\)/],
    ["n above 1e7", { ...ok, code: { n: 2e7, k: 5 } }, /code\.n: must be at most 10000000/],
    ["p above 0.5", { ...ok, channel: { model: "bsc", p: 0.7 } }, /channel\.p: must be at most 0\.5/],
    ["p negative", { ...ok, channel: { model: "bsc", p: -0.1 } }, /channel\.p: must be at least 0/],
    ["e = 1", { ...ok, channel: { model: "bec", e: 1 } }, /channel\.e: must be below 1/],
    ["target 0", { ...ok, target: { metric: "bler", value: 0 } }, /target\.value: must be above 0/],
    ["target 1", { ...ok, target: { metric: "ber", value: 1 } }, /target\.value: must be below 1/],
    ["non-number", { ...ok, code: { n: "1944", k: 1620 } }, /code\.n: must be a number/],
    ["missing target", { channel: ok.channel, code: ok.code }, /target: is required/],
    ["missing p", { ...ok, channel: { model: "bsc" } }, /channel\.p: give exactly one of p, ncgDb/],
    ["unknown model", { ...ok, channel: { model: "awgn", p: 0.1 } }, /channel\.model: must be one of "bsc", "bec", "biawgn"/],
    ["unknown metric", { ...ok, target: { metric: "fer", value: 1e-6 } }, /target\.metric: must be "bler" or "ber"/],
    ["k without n", { ...ok, code: { k: 5 } }, /code\.n: is required with k/],
    ["fractional n", { ...ok, code: { n: 10.5, k: 5 } }, /code\.n: must be an integer/],
    ["not an object", "claim", /claim: must be an object/],
  ];
  it.each(bad)("%s", (_, input, message) => {
    const r = claimSchema.safeParse(input);
    expect(r.success).toBe(false);
    if (!r.success) expect(formatClaimError(r.error)).toMatch(message);
  });
});

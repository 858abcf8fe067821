// Verdicts on radio claims (BOUNDS.md sections 8 and 9) and the external checks of section 10
// that concern them, each with its source.
import { describe, expect, it } from "vitest";
import {
  claimSchema,
  energyConverseEbn0Db,
  evaluateClaim,
  formatClaimError,
  orthogonalEbn0Db,
  qInv,
  spherePackingEbn0Db,
  THERMAL_DBM_PER_HZ,
  type ClaimInput,
} from "@/lib/bounds";

const evaluate = (claim: unknown) => evaluateClaim(claimSchema.parse(claim));
const codes = (r: ReturnType<typeof evaluateClaim>) => r.findings.map((f) => f.code);
const db = (x: number) => 10 * Math.log10(x);

describe("external checks (BOUNDS.md section 10)", () => {
  it("k = 1: the energy converse is antipodal signalling exactly, E/N0 = Qinv(eps)^2 / 2, 9.59 dB at 1e-5 (PPV 2011; BPSK Q(sqrt(2 Eb/N0)))", () => {
    for (const eps of [1e-2, 1e-5, 1e-9]) expect(energyConverseEbn0Db(1, Math.log(eps))).toBeCloseTo(db(qInv(eps) ** 2 / 2), 10);
    expect(energyConverseEbn0Db(1, Math.log(1e-5))!).toBeCloseTo(9.59, 2);
  });
  it("the energy converse tends to -1.59 dB (ln 2) as k grows, for every BLER below 1/2 (Shannon 1949; PPV 2011)", () => {
    for (const eps of [0.4, 0.1, 1e-3, 1e-9]) expect(Math.abs(energyConverseEbn0Db(1e7, Math.log(eps))! - db(Math.LN2))).toBeLessThan(0.02);
    // at small error rates it falls towards ln 2 from above (a large BLER lets a small k go below it)
    for (const eps of [1e-3, 1e-9]) {
      let last = Infinity;
      for (const k of [10, 1e3, 1e5, 1e7]) {
        const v = energyConverseEbn0Db(k, Math.log(eps))!;
        expect(v).toBeLessThan(last);
        expect(v).toBeGreaterThan(db(Math.LN2));
        last = v;
      }
    }
  });
  it("-1.57 dB needs about a million information bits: k = 10^6 sits just above it, k = 10^5 well above (PPV 2011, abstract; BLER 1e-3 from memory)", () => {
    const at = (k: number) => energyConverseEbn0Db(k, Math.log(1e-3))!;
    expect(at(1e6)).toBeGreaterThan(-1.57);
    expect(at(1e6)).toBeLessThan(-1.56);
    expect(at(1e5)).toBeGreaterThan(-1.53);
  });
  it("the 1959 bound's Eb/N0 for rate-1/2 codes falls towards 0 dB as n grows, always above it (Shannon 1959; Dolinar, Divsalar, Pollara 1998, from memory)", () => {
    let last = Infinity;
    for (const n of [64, 256, 1024, 4096, 16384, 65536]) {
      const v = spherePackingEbn0Db(n, n / 2, Math.log(1e-4))!;
      expect(v).toBeLessThan(last);
      expect(v).toBeGreaterThan(0); // the unconstrained AWGN needs (2^(2R) - 1) / (2R) = 1, 0 dB, at R = 1/2
      last = v;
    }
    expect(last).toBeLessThan(0.25);
  });
  it("thermal noise is -174 dBm/Hz at 290 K (common practice)", () => expect(THERMAL_DBM_PER_HZ).toBeCloseTo(-174, 1));
  it("orthogonal signalling needs at least the converse's energy (PPV 2011: achievability >= converse)", () => {
    for (const [k, eps] of [
      [1, 1e-3],
      [16, 1e-4],
      [160, 1e-2],
      [1024, 1e-6],
    ])
      expect(orthogonalEbn0Db(k, Math.log(eps))!).toBeGreaterThanOrEqual(energyConverseEbn0Db(k, Math.log(eps))!);
  });
});

describe("BI-AWGN claims with n and k (section 8)", () => {
  const packet = (ebn0Db: number, extra: object = {}) =>
    evaluate({ channel: { model: "biawgn", ebn0Db }, code: { n: 1024, k: 512, ...extra }, target: { metric: "bler", value: 1e-4 } });
  it("PER 1e-4 at 1.0 dB with (1024, 512) packets is impossible: the 1959 bound needs about 1.1 dB (issue 11)", () => {
    for (const modulation of ["bpsk", "qpsk"]) {
      const r = packet(1.0, { modulation });
      expect(r.verdict).toBe("impossible");
      expect(codes(r)).toContain("below-sphere-packing");
      expect(r.thresholds.spherePacking!).toBeCloseTo(1.0953, 4);
      expect(r.margins.channel.converse!).toBeCloseTo(0.0953, 4); // threshold minus claimed, dB
      expect(r.spherePacking!.log10Bler).toBeGreaterThan(-4);
      expect(r.findings.find((f) => f.code === "below-sphere-packing")!.source).toMatch(/Shannon 1959/);
    }
  });
  it("carries the implied Eb/N0 and the energy limits at k, whatever the input unit", () => {
    const r = evaluate({ channel: { model: "biawgn", esn0Db: -1 }, code: { n: 1024, k: 512 }, target: { metric: "bler", value: 1e-4 } });
    expect(r.implied!.ebn0Db).toBeCloseTo(-1 + db(2), 12);
    expect(r.energy!.converseEbn0Db!).toBeLessThan(r.energy!.achievableEbn0Db!);
    expect(r.thresholds.spherePacking!).toBeCloseTo(packet(2).thresholds.spherePacking!, 12);
  });
  it("in a deep tail the normal approximation is not relied on: needs evidence until Gallager's bound reaches the claim", () => {
    const at = (ebn0Db: number) => evaluate({ channel: { model: "biawgn", ebn0Db }, code: { n: 2048, k: 1024 }, target: { metric: "bler", value: 1e-10 } });
    const r = at(1.6); // above the normal approximation's threshold (1.58 dB), below Gallager's
    expect(r.thresholds.normal!).toBeLessThan(1.6);
    expect(r.verdict).toBe("needs-evidence");
    expect(codes(r)).toContain("normal-approximation-unreliable");
    expect(r.findings.find((f) => f.code === "beyond-random-coding")!.message).toMatch(
      /not relied on here, since the claimed BLER 1\.0e-10 lies below 1\.0e-6/,
    );
    const ok = at(2.0);
    expect(ok.verdict).toBe("plausible");
    expect(ok.findings.find((f) => f.code === "within-random-coding")!.message).toMatch(/rests on this rigorous bound/);
  });
  it("a rate with n takes the whole k below n R and says so (no fractional k)", () => {
    const r = evaluate({ channel: { model: "biawgn", ebn0Db: 3 }, code: { n: 2048, rate: 0.95 }, target: { metric: "bler", value: 1e-3 } });
    expect(r.k).toBe(1945);
    expect(r.findings.find((f) => f.code === "whole-k")!.message).toMatch(/n R = 1945\.60 information bits, so k = 1945/);
  });
  it("BSC and BEC results keep their fields and gain no radio numbers", () => {
    const r = evaluate({ channel: { model: "bsc", p: 0.002 }, code: { n: 1944, k: 1620 }, target: { metric: "bler", value: 1e-6 } });
    expect(r.spherePacking).toBeNull();
    expect(r.energy).toBeNull();
    expect(r.implied).toBeNull();
    expect(r.thresholds.spherePacking).toBeNull();
  });
});

describe("sensitivity claims (section 9): k = 160 bits at 1,200 bit/s, PER 1e-2", () => {
  // Eb/N0 = S + 173.975 - 30.792 - NF; the converse needs -0.455 dB (S >= -143.64 dBm at NF 0),
  // orthogonal signalling -0.431 dB
  const claim = (channel: object): ClaimInput =>
    claimSchema.parse({ channel: { model: "biawgn", bitRate: 1200, ...channel }, code: { k: 160 }, target: { metric: "bler", value: 1e-2 } });
  it("impossible below the energy converse at NF 0 dB, with the limit and margin in dB", () => {
    const r = evaluateClaim(claim({ sensitivityDbm: -145 }));
    expect(r.verdict).toBe("impossible");
    expect(r.implied!.ebn0Db).toBeCloseTo(-145 - THERMAL_DBM_PER_HZ - db(1200), 12);
    expect(r.margins.channel.converse!).toBeCloseTo(r.energy!.converseEbn0Db! - r.implied!.ebn0Db, 12);
    expect(r.findings.find((f) => f.code === "below-energy-converse")!.message).toMatch(/margin -1\.\d\d dB/);
    expect(r.rate).toBeNull();
    expect(codes(r)).toContain("noise-figure-ideal");
  });
  it("needs evidence where the tender's assumed noise figure leaves it short of orthogonal signalling", () => {
    const r = evaluateClaim(claim({ sensitivityDbm: -142, assumedNoiseFigureDb: 4 }));
    expect(r.verdict).toBe("needs-evidence");
    expect(codes(r)).toEqual(expect.arrayContaining(["noise-figure-assumed", "within-energy-converse", "beyond-orthogonal"]));
  });
  it("plausible with margin at the assumed noise figure; a stated figure is used for both tests", () => {
    expect(evaluateClaim(claim({ sensitivityDbm: -130, assumedNoiseFigureDb: 4 })).verdict).toBe("plausible");
    const stated = evaluateClaim(claim({ sensitivityDbm: -143, noiseFigureDb: 2, assumedNoiseFigureDb: 9 }));
    expect(stated.implied!.ebn0Db).toBeCloseTo(-143 - THERMAL_DBM_PER_HZ - db(1200) - 2, 12);
    expect(stated.verdict).toBe("impossible");
    expect(codes(stated)).not.toContain("noise-figure-assumed");
  });
  it("with n and k the 1959 bound judges too", () => {
    // -142.5 dBm is Eb/N0 0.68 dB: above the energy converse, below the 1959 bound's 1.11 dB at n = 320
    const r = evaluate({
      channel: { model: "biawgn", sensitivityDbm: -142.5, bitRate: 1200 },
      code: { n: 320, k: 160 },
      target: { metric: "bler", value: 1e-2 },
    });
    expect(codes(r)).toContain("within-energy-converse");
    expect(r.thresholds.spherePacking!).toBeGreaterThan(r.energy!.converseEbn0Db!);
    expect(r.verdict).toBe("impossible");
    expect(codes(r)).toContain("below-sphere-packing");
  });
  it("every finding is one sentence with its source", () => {
    for (const sensitivityDbm of [-145, -142, -130])
      for (const f of evaluateClaim(claim({ sensitivityDbm, assumedNoiseFigureDb: 4 })).findings) {
        expect(f.message.slice(0, -1)).not.toMatch(/\.\s/);
        expect(f.source.length).toBeGreaterThan(5);
      }
  });
});

describe("the contract refuses bad radio input with a clear message in its place", () => {
  const ok = { channel: { model: "biawgn", sensitivityDbm: -120, bitRate: 1200 }, code: { k: 160 }, target: { metric: "bler", value: 1e-2 } };
  const cases: [string, unknown, RegExp][] = [
    ["a negative bit rate", { ...ok, channel: { ...ok.channel, bitRate: -1 } }, /channel\.bitRate: must be above 0/],
    ["a sensitivity above +30 dBm", { ...ok, channel: { ...ok.channel, sensitivityDbm: 31 } }, /channel\.sensitivityDbm: must be at most 30/],
    ["k = 0", { ...ok, code: { k: 0 } }, /code\.k: must be at least 1/],
    ["a noise figure below 0", { ...ok, channel: { ...ok.channel, noiseFigureDb: -0.5 } }, /channel\.noiseFigureDb: must be at least 0/],
    ["a sensitivity without a bit rate", { ...ok, channel: { model: "biawgn", sensitivityDbm: -120 } }, /channel\.bitRate: is required with sensitivityDbm/],
    ["a bit rate without a sensitivity", { ...ok, channel: { model: "biawgn", ebn0Db: 2, bitRate: 10 } }, /channel\.bitRate: goes only with sensitivityDbm/],
    ["k alone on the BSC", { ...ok, channel: { model: "bsc", p: 0.01 } }, /code\.n: is required with k/],
    [
      "a modulation off the BI-AWGN channel",
      { channel: { model: "bsc", p: 0.01 }, code: { n: 10, k: 5, modulation: "qpsk" }, target: ok.target },
      /code\.modulation: applies only/,
    ],
    ["an unknown modulation", { ...ok, code: { k: 160, modulation: "qam16" } }, /code\.modulation: must be "bpsk" or "qpsk"/],
  ];
  for (const [name, input, message] of cases)
    it(name, () => {
      const r = claimSchema.safeParse(input);
      expect(r.success).toBe(false);
      if (!r.success) expect(formatClaimError(r.error)).toMatch(message);
    });
});

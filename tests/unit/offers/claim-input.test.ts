import { describe, expect, it } from "vitest";
import { claimSchema, evaluateClaim } from "@/lib/bounds";
import {
  claimInputFor,
  codeRate,
  currentVersion,
  engineCode,
  evaluateOffer,
  keyFinding,
  nextVersion,
  submissionRefusal,
  termsErrors,
  verdictSummary,
  worstVerdict,
} from "@/lib/offers";

const nk = { n: 2048, k: 1536, rate: null, overhead: null };

describe("claimInputFor: an offer's claim at a tender's operating point, as the engine reads it", () => {
  it("takes p from a hard-decision point", () => {
    expect(claimInputFor("bsc", 5e-3, nk, { metric: "bler", value: 1e-5 })).toEqual({
      channel: { model: "bsc", p: 5e-3 },
      code: { n: 2048, k: 1536 },
      target: { metric: "bler", value: 1e-5 },
    });
  });

  it("takes e from an erasure point and Eb/N0 in dB from a soft-decision point", () => {
    expect(claimInputFor("bec", 0.1, nk, { metric: "ber", value: 1e-6 }).channel).toEqual({ model: "bec", e: 0.1 });
    expect(claimInputFor("biawgn", 2, nk, { metric: "ber", value: 1e-6 }).channel).toEqual({ model: "biawgn", ebn0Db: 2 });
  });

  it("states a net coding gain claim by the gain and its output BER, ignoring the point's value", () => {
    const input = claimInputFor("bsc", 5e-3, { n: null, k: null, rate: null, overhead: 0.07 }, { metric: "ncg", value: 8.5, ncgOutputBer: 1e-15 });
    expect(input).toEqual({ channel: { model: "bsc", ncgDb: 8.5 }, code: { overhead: 0.07 }, target: { metric: "ber", value: 1e-15 } });
    expect(claimSchema.safeParse(input).success).toBe(true);
    expect(() => claimInputFor("bec", 0.1, nk, { metric: "ncg", value: 3, ncgOutputBer: 1e-9 })).toThrow(/erasure/);
  });

  it("passes n along with a rate, and sends exactly one of k, rate and overhead", () => {
    expect(engineCode({ n: 2048, k: null, rate: 0.95, overhead: null })).toEqual({ n: 2048, rate: 0.95 });
    expect(engineCode({ n: null, k: null, rate: null, overhead: 0.25 })).toEqual({ overhead: 0.25 });
    expect(engineCode({ n: 1024, k: 901, rate: 0.5, overhead: null })).toEqual({ n: 1024, k: 901 });
    expect(codeRate({ n: 1024, k: 512 })).toBe(0.5);
    expect(codeRate({ overhead: 0.25 })).toBeCloseTo(0.8, 12);
    expect(codeRate({})).toBeNull();
  });

  it("gives the engine's own verdict: a rate above capacity is impossible", () => {
    // C(BSC, 2e-3) = 1 - h2(2e-3) is about 0.979, below the rate 2040/2048 = 0.996.
    const result = evaluateClaim(claimInputFor("bsc", 2e-3, { n: 2048, k: 2040 }, { metric: "bler", value: 1e-9 }));
    expect(result.verdict).toBe("impossible");
    expect(keyFinding(result)?.severity).toBe("violation");
  });

  it("leads a plausible claim with the bound that guarantees it, and a doubtful one with its gap", () => {
    const honest = evaluateClaim(claimInputFor("bsc", 1e-3, nk, { metric: "bler", value: 1e-5 }));
    expect(honest.verdict).toBe("plausible");
    expect(keyFinding(honest)?.code).toBe("within-achievability");
    const doubtful = evaluateClaim(claimInputFor("bsc", 5e-3, { n: 1024, k: 901 }, { metric: "bler", value: 1e-5 }));
    expect(doubtful.verdict).toBe("needs-evidence");
    expect(keyFinding(doubtful)?.severity).toBe("gap");
    expect(keyFinding({ findings: [] })).toBeNull();
  });
});

const tender = {
  state: "open",
  closesAt: new Date("2027-03-01T12:00:00Z"),
  channelModel: "bsc" as const,
  operatingPoints: [
    { label: "Clear", value: 1e-3 },
    { label: "Storm", value: 5e-3 },
  ],
  currency: "EUR",
};
const claims = [0, 1].map((pointIndex) => ({ pointIndex, metric: "bler" as const, value: 1e-5, ncgOutputBer: null }));

describe("submission rules", () => {
  it("accept only an open tender before its closing time", () => {
    expect(submissionRefusal(tender, new Date("2027-03-01T11:59:59Z"))).toBeNull();
    expect(submissionRefusal(tender, new Date("2027-03-01T12:00:00Z"))).toMatch(/closed at 2027-03-01T12:00:00Z/);
    expect(submissionRefusal({ ...tender, state: "technical" }, new Date("2027-01-01"))).toMatch(/closed/);
    expect(submissionRefusal({ ...tender, state: "cancelled" }, new Date("2027-01-01"))).toMatch(/cancelled/);
    expect(submissionRefusal({ ...tender, state: "draft" }, new Date("2027-01-01"))).toMatch(/not open yet/);
  });

  it("want one claim per operating point, no gain on an erasure channel, the tender's currency", () => {
    expect(termsErrors(tender, { claims, envelope: { currency: "EUR" } })).toEqual({});
    expect(termsErrors(tender, { claims: [claims[0], claims[0]], envelope: { currency: "EUR" } }).claims).toBeTruthy();
    expect(termsErrors(tender, { claims: claims.slice(0, 1), envelope: { currency: "EUR" } }).claims[0]).toMatch(/2 operating points/);
    expect(termsErrors(tender, { claims, envelope: { currency: "GBP" } })["envelope.currency"][0]).toMatch(/EUR/);
    const bec = { ...tender, channelModel: "bec" as const };
    expect(termsErrors(bec, { claims: [claims[0], { ...claims[1], metric: "ncg" }], envelope: { currency: "EUR" } })["claims.1.metric"]).toBeTruthy();
  });

  it("refuse a soft-decision code on a hard-decision (BSC) tender, saying what to do", () => {
    const soft = { code: { decision: "soft" as const }, claims, envelope: { currency: "EUR" } };
    expect(termsErrors({ ...tender, channelModel: "bsc" }, soft)["code.decision"][0]).toMatch(
      /hard decision \(binary symmetric channel\).*offer the module with a hard-decision decoder/,
    );
    expect(termsErrors({ ...tender, channelModel: "bsc" }, { ...soft, code: { decision: "hard" } })).toEqual({});
    expect(termsErrors({ ...tender, channelModel: "biawgn" }, soft)["code.decision"]).toBeUndefined();
  });

  it("evaluateOffer stores the engine's verdict per point and names fields the engine refuses", () => {
    const ok = evaluateOffer(tender, { code: { n: 1024, k: 901 }, claims, envelope: { currency: "EUR" } });
    if (!ok.ok) throw new Error("expected an evaluation");
    expect(ok.claims.map((c) => c.pointLabel)).toEqual(["Clear", "Storm"]);
    for (const c of ok.claims) {
      expect(c.verdict).toBe(evaluateClaim(claimInputFor("bsc", c.channelValue, { n: 1024, k: 901 }, c)).verdict);
      expect(c.engineVersion).toBe(c.result.engineVersion);
    }
    const bad = evaluateOffer(tender, { code: { n: 100, k: 200 }, claims, envelope: { currency: "EUR" } });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.fieldErrors["code.k"][0]).toMatch(/at most n \(100\)/);
  });

  it("number versions upwards and take the newest one not superseded as current", () => {
    expect(nextVersion([])).toBe(1);
    expect(nextVersion([{ version: 1 }, { version: 3 }, { version: 2 }])).toBe(4);
    const versions = [
      { version: 1, status: "superseded" },
      { version: 2, status: "withdrawn" },
      { version: 3, status: "submitted" },
    ];
    expect(currentVersion(versions)?.version).toBe(3);
    expect(currentVersion(versions.slice(0, 2))?.status).toBe("withdrawn");
    expect(currentVersion([{ version: 1, status: "superseded" }])).toBeNull();
  });

  it("summarise verdicts without prices, the worst one first", () => {
    expect(verdictSummary(["plausible", "impossible", "plausible"])).toEqual({ impossible: 1, "needs-evidence": 0, plausible: 2 });
    expect(worstVerdict(["plausible", "needs-evidence"])).toBe("needs-evidence");
    expect(worstVerdict(["needs-evidence", "impossible"])).toBe("impossible");
    expect(worstVerdict([])).toBeNull();
  });
});

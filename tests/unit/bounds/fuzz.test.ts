// The engine always answers: every claim the contract accepts, down to its extreme and degenerate
// values, is evaluated within a CPU-time budget, with finite numbers only. A failure prints the
// fast-check seed and path, so the case replays exactly.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { claimSchema, evaluateClaim } from "@/lib/bounds";
import { MAX_N } from "@/lib/bounds/schema";

const SEED = 20261202;
/** CPU seconds one claim may take: several times the slowest case seen, so a loaded machine passes. */
const BUDGET_S = 2;

/** CPU time of fn in seconds (user + system of this process, unaffected by other processes' load). */
function cpuSeconds(fn: () => void): number {
  const t0 = process.cpuUsage();
  fn();
  const d = process.cpuUsage(t0);
  return (d.user + d.system) / 1e6;
}

/** Paths of every number in v that is not finite. */
function nonFinite(v: unknown, at = ""): string[] {
  if (typeof v === "number") return Number.isFinite(v) ? [] : [`${at}=${v}`];
  if (v && typeof v === "object") return Object.entries(v).flatMap(([k, x]) => nonFinite(x, `${at}.${k}`));
  return [];
}

/** A field's extreme values, mixed with the whole range between them. */
const edgy = (edges: number[], min: number, max: number) => fc.oneof(fc.constantFrom(...edges), fc.double({ min, max, noNaN: true }));
const tiny = [Number.MIN_VALUE, 1e-300];

const db = edgy([-50, 50, 0, -49.999], -50, 50);
const ncg = edgy([-20, 40, 0, 15], -20, 40);
const channel = fc.oneof(
  edgy([0, 0.5, 0.4999999, ...tiny], 0, 0.5).map((p) => ({ model: "bsc", p })),
  ncg.map((ncgDb) => ({ model: "bsc", ncgDb })),
  edgy([0, 0.9999999999, ...tiny], 0, 0.9999999999).map((e) => ({ model: "bec", e })),
  db.map((ebn0Db) => ({ model: "biawgn", ebn0Db })),
  db.map((esn0Db) => ({ model: "biawgn", esn0Db })),
  ncg.map((ncgDb) => ({ model: "biawgn", ncgDb })),
  fc
    .record({
      sensitivityDbm: edgy([-250, 30, -120], -250, 30),
      bitRate: edgy([Number.MIN_VALUE, 1, 1e12], Number.MIN_VALUE, 1e12),
      noiseFigureDb: fc.option(edgy([0, 40], 0, 40), { nil: undefined }),
      assumedNoiseFigureDb: fc.option(edgy([0, 40], 0, 40), { nil: undefined }),
    })
    .map((s) => ({ model: "biawgn", ...s })),
);
const n = fc.oneof(fc.constantFrom(1, 2, 3, MAX_N), fc.integer({ min: 1, max: 5000 }), fc.integer({ min: 1, max: MAX_N }));
const frac = edgy([0, 1, 1e-9], 0, 1);
const rate = edgy([1, 0.5, 0.9999, ...tiny], Number.MIN_VALUE, 1);
const overhead = edgy([0, 1000, 1e-12], 0, 1000);
const code = fc.oneof(
  fc
    .tuple(n, frac, fc.constantFrom(undefined, "bpsk", "qpsk"))
    .map(([n, f, modulation]) => ({ n, k: Math.max(1, Math.min(n, Math.round(f * n))), modulation })),
  fc.oneof(fc.constantFrom(1, 2, MAX_N), fc.integer({ min: 1, max: MAX_N })).map((k) => ({ k })),
  rate.map((rate) => ({ rate })),
  fc.tuple(n, rate).map(([n, rate]) => ({ n, rate })),
  overhead.map((overhead) => ({ overhead })),
  fc.tuple(n, overhead).map(([n, overhead]) => ({ n, overhead })),
);
const target = fc.record({
  metric: fc.constantFrom("bler", "ber"),
  value: edgy([1e-10, 0.5, 0.99, 1 - 2 ** -53, ...tiny], Number.MIN_VALUE, 1 - 2 ** -53),
});

describe("the engine always answers in time (fuzzed over the whole accepted input)", () => {
  it(`evaluates every valid claim within ${BUDGET_S} CPU seconds, with finite numbers only (seed ${SEED})`, () => {
    fc.assert(
      fc.property(fc.record({ channel, code, target }), (raw) => {
        const parsed = claimSchema.safeParse(raw);
        if (!parsed.success) return; // refused with a message, which the contract tests cover
        let result: ReturnType<typeof evaluateClaim> | undefined;
        const spent = cpuSeconds(() => {
          result = evaluateClaim(parsed.data);
        });
        expect(spent, JSON.stringify(raw)).toBeLessThan(BUDGET_S);
        expect(nonFinite(result), JSON.stringify(raw)).toEqual([]);
      }),
      { seed: SEED, numRuns: 250 },
    );
  });
});

describe("regressions: claims that once never returned", () => {
  // A net coding gain so low that the raw BER it implies underflows to 0 gave Es/N0 = +Infinity,
  // and the quadrature then split its NaN panels 2^40 times.
  const frozen = {
    channel: { model: "biawgn", ncgDb: -20 },
    code: { n: 2048, rate: 0.5 },
    target: { metric: "bler", value: 1e-10 },
  } as const;
  it("the BI-AWGN claim at NCG -20 dB, n = 2048, rate 1/2, BLER 1e-10", () => {
    const parsed = claimSchema.parse(frozen);
    let r: ReturnType<typeof evaluateClaim> | undefined;
    expect(cpuSeconds(() => (r = evaluateClaim(parsed)))).toBeLessThan(BUDGET_S);
    // erfcinv(2e-10) 10^((10 log10(1/2) + 20) / 20) = 31.99..., so Es/N0 = 20 log10 of it (ITU-T G.975.1)
    expect(r!.channel.esn0Db).toBeCloseTo(30.05, 2);
    expect(nonFinite(r)).toEqual([]);
    expect(r!.findings[0].message).toMatch(/raw BER of 3\.9e-442/);
  });
  it("a Es/N0 so low that the LLR's mean underflows (rate 1e-300) still has capacity 0", () => {
    const r = evaluateClaim({ channel: { model: "biawgn", ebn0Db: 0 }, code: { rate: 1e-300 }, target: { metric: "bler", value: 1e-3 } });
    expect(r.capacity).toBeCloseTo(0, 12);
    expect(nonFinite(r)).toEqual([]);
  });
  it("refuses a net coding gain with an output error rate of 1/2 or more, saying why", () => {
    const r = claimSchema.safeParse({ ...frozen, target: { metric: "ber", value: 0.6 } });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].message).toMatch(/below 0\.5 with a net coding gain/);
  });
});

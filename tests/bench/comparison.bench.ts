// Comparison route benchmark: a tender in commercial evaluation with 50 offers of 10 claims each,
// envelopes open; GET /api/v1/tenders/[id]/comparison called in-process as a signed-in buyer,
// 20 requests at a time. Each request is timed on its own (its latency under that concurrency).
// Needs an in-memory database and the server-only guard lifted:
//   DB_MEMORY=1 npx tsx --conditions=react-server tests/bench/comparison.bench.ts
import type { BenchRow } from "./types";

const OFFERS = 50;
const CLAIMS_PER_OFFER = 10;
const CONCURRENCY = 20;
const REQUESTS = 200;
const TARGET_P95_MS = 200;

interface Setup {
  call: () => Promise<number>;
}

let setup: Promise<Setup> | null = null;

async function prepare(): Promise<Setup> {
  process.env.DB_MEMORY ??= "1";
  process.env.BETTER_AUTH_URL ??= "http://localhost:3000";
  const { freshDatabase, params, request, signInAs } = await import("../support/app");
  const { createCommercialTender, honest, impossible } = await import("../support/comparison-fixtures");
  const { GET } = await import("@/app/api/v1/tenders/[id]/comparison/route");
  const db = await freshDatabase();
  // Ten operating points from clear to stormy, so each offer carries ten claims.
  const points = Array.from({ length: CLAIMS_PER_OFFER }, (_, i) => ({ label: `Point ${i + 1}`, value: 1e-3 * (1 + i * 0.4) }));
  const offers = Array.from({ length: OFFERS }, (_, i) => {
    const base =
      i % 7 === 0
        ? impossible(`Vendor ${i + 1}`, 30 + i, 4 + (i % 9), 12 + (i % 4) * 12)
        : honest(`Vendor ${i + 1}`, 35 + (i % 13) * 1.5, 4 + (i % 9), 12 + (i % 4) * 12);
    const claim = base.claims[i % 7 === 0 ? 1 : 0];
    return {
      ...base,
      priceBreaks: [{ minQuantity: 1000, unitPrice: base.unitPrice - 2 }],
      claims: points.map((_, j) => ({ ...claim, evidence: j === 0 && i % 3 === 0 ? ("verified" as const) : undefined })),
    };
  });
  const fx = await createCommercialTender(db, { opened: true, points, targetValue: 1e-3, offers });
  const headers = await signInAs("buyer@tarnwell.example");
  let checked = false;
  const call = async () => {
    const t0 = performance.now();
    const response = await GET(request(`/api/v1/tenders/${fx.tenderId}/comparison`, { headers }), params({ id: fx.tenderId }));
    // The route's latency ends with its bytes; parsing them is the client's work, checked once.
    const text = await response.text();
    const elapsed = performance.now() - t0;
    if (response.status !== 200) throw new Error(`unexpected answer ${response.status}`);
    if (!checked && JSON.parse(text).input.offers.length !== OFFERS) throw new Error("unexpected offers in the answer");
    checked = true;
    return elapsed;
  };
  return { call };
}

const quantile = (sorted: number[], q: number) => sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))];

/** REQUESTS calls in waves of CONCURRENCY (median and p95 of the per-request latencies), then 50 calls one at a time. */
export async function benchComparison(): Promise<BenchRow[]> {
  setup ??= prepare();
  const { call } = await setup;
  for (let i = 0; i < CONCURRENCY; i++) await call(); // warm-up
  const times: number[] = [];
  for (let done = 0; done < REQUESTS; done += CONCURRENCY) {
    times.push(...(await Promise.all(Array.from({ length: Math.min(CONCURRENCY, REQUESTS - done) }, call))));
  }
  times.sort((a, b) => a - b);
  // The same route one request at a time: its service time, without queueing behind the others.
  const alone: number[] = [];
  for (let i = 0; i < 50; i++) alone.push(await call());
  alone.sort((a, b) => a - b);
  return [
    {
      name: `comparison route, ${OFFERS} offers x ${CLAIMS_PER_OFFER} claims, 1 at a time`,
      runs: alone.length,
      medianMs: quantile(alone, 0.5),
      p95Ms: quantile(alone, 0.95),
      target: "-",
    },
    {
      name: `comparison route, ${OFFERS} offers x ${CLAIMS_PER_OFFER} claims, ${CONCURRENCY} concurrent`,
      runs: times.length,
      medianMs: quantile(times, 0.5),
      p95Ms: quantile(times, 0.95),
      target: `p95 < ${TARGET_P95_MS} ms`,
    },
  ];
}

/** For tests/bench/run.ts: rows measured per request (latency under 20 in flight), not per wave. */
export const report = benchComparison;

if (import.meta.url === `file://${process.argv[1]}`) {
  benchComparison().then(
    (rows) => {
      console.table(rows.map((r) => ({ ...r, medianMs: r.medianMs.toFixed(1), p95Ms: r.p95Ms.toFixed(1) })));
      process.exit(0);
    },
    (error) => {
      console.error(error);
      process.exit(1);
    },
  );
}

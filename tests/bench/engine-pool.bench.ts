// Other requests while 10 slow evaluations run: the engine works in worker threads with a
// deadline, so a signed-in buyer listing tenders is served as usual while 10 jobs that would never
// end fill the engine until their deadline. Route handlers are called in-process, 4 clients at a
// time, first with an idle engine, then while the slow jobs run. ENGINE_TEST_DELAY_MS (honoured
// only with NODE_ENV=test) stands in for a claim that never ends.
import type { BenchRow } from "./types";

const SLOW = 10;
/** For contrast: how long one slow evaluation holds the request thread when it runs there. */
const ON_THREAD_MS = 2000;
const CLIENTS = 4;
const IDLE_MS = 3000;

let workers = 0;
const quantile = (sorted: number[], q: number) => sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))];

async function prepare() {
  process.env.DB_MEMORY ??= "1";
  process.env.BETTER_AUTH_URL ??= "http://localhost:3000";
  Object.assign(process.env, { NODE_ENV: "test", ENGINE_DEADLINE_MS: "10000" });
  const { env, resetEnvForTests } = await import("@/lib/env");
  resetEnvForTests();
  workers = env().ENGINE_WORKERS;
  const { freshDatabase, request, signInAs } = await import("../support/app");
  const { GET: listTenders } = await import("@/app/api/v1/tenders/route");
  const { POST: evaluate } = await import("@/app/api/v1/evaluate/route");
  const { runEngine, closeEnginePool } = await import("@/lib/runtime/engine-pool");
  await freshDatabase();
  const buyer = await signInAs("buyer@tarnwell.example");
  const engineer = await signInAs("engineer@tarnwell.example");
  const claim = { channel: { model: "bsc", p: 1e-3 }, code: { n: 2048, k: 1640 }, target: { metric: "bler", value: 1e-4 } };
  const timed = async (call: () => Promise<Response>) => {
    const t0 = performance.now();
    const response = await call();
    await response.text();
    return { ms: performance.now() - t0, status: response.status };
  };
  return {
    list: () => timed(() => listTenders(request("/api/v1/tenders", { headers: buyer }), undefined)),
    evaluateFast: () => timed(() => evaluate(request("/api/v1/evaluate", { method: "POST", headers: engineer, body: claim }), undefined)),
    /** Starts the slow jobs (each spins past the deadline), then puts the setting back for everyone else. */
    startSlow() {
      process.env.ENGINE_TEST_DELAY_MS = "600000";
      resetEnvForTests();
      const jobs = Array.from({ length: SLOW }, () =>
        runEngine("claims", [claim as never]).then(
          () => "finished",
          (e: Error) => e.name,
        ),
      );
      delete process.env.ENGINE_TEST_DELAY_MS;
      resetEnvForTests();
      return Promise.all(jobs);
    },
    closeEnginePool,
  };
}

type Sample = { ms: number; status: number };

function spin(ms: number) {
  const until = performance.now() + ms;
  while (performance.now() < until);
}

/** CLIENTS clients, each calling `call` one request after another until told to stop. */
async function load(call: () => Promise<Sample>, stop: { done: boolean }): Promise<Sample[]> {
  const samples: Sample[] = [];
  await Promise.all(
    Array.from({ length: CLIENTS }, async () => {
      while (!stop.done) samples.push(await call());
    }),
  );
  return samples;
}

function row(name: string, samples: Sample[], target: string): BenchRow {
  const times = samples.map((s) => s.ms).sort((a, b) => a - b);
  const refused = samples.filter((s) => s.status !== 200).length;
  return {
    name: refused ? `${name} (${refused} answered ${[...new Set(samples.filter((s) => s.status !== 200).map((s) => s.status))].join("/")})` : name,
    runs: times.length,
    medianMs: quantile(times, 0.5),
    p95Ms: quantile(times, 0.95),
    target,
  };
}

async function phase(call: () => Promise<Sample>, during: Promise<unknown> | number): Promise<Sample[]> {
  const stop = { done: false };
  const running = load(call, stop);
  await (typeof during === "number" ? new Promise((r) => setTimeout(r, during)) : during);
  stop.done = true;
  return running;
}

export async function report(): Promise<BenchRow[]> {
  const bench = await prepare();
  await Promise.all(Array.from({ length: workers }, bench.evaluateFast)); // the workers are up
  const idleList = await phase(bench.list, IDLE_MS);
  const idleEval = await phase(bench.evaluateFast, IDLE_MS);
  const slowA = bench.startSlow();
  const busyList = await phase(bench.list, slowA);
  // The same again for evaluations of other people: they wait for a worker.
  const slowB = bench.startSlow();
  const busyEval = await phase(bench.evaluateFast, slowB);
  const outcomes = [...(await slowA), ...(await slowB)];
  // The same, had the engine run on the request thread: one slow evaluation holds everyone.
  const onThread = await phase(bench.list, new Promise((resolve) => setTimeout(() => resolve(spin(ON_THREAD_MS)), 100)));
  await bench.closeEnginePool();
  if (outcomes.some((o) => o !== "EngineDeadlineError")) throw new Error(`slow jobs ended unexpectedly: ${outcomes.join(", ")}`);
  return [
    row("GET /api/v1/tenders, engine idle", idleList, "-"),
    row(`GET /api/v1/tenders, while ${SLOW} slow evaluations run on ${workers} worker(s)`, busyList, "p95 <= 200 ms"),
    row(`GET /api/v1/tenders, while 1 slow evaluation of ${ON_THREAD_MS / 1000} s runs on the request thread (for contrast)`, onThread, "-"),
    row("POST /api/v1/evaluate (fast claim), engine idle", idleEval, "-"),
    row(`POST /api/v1/evaluate (fast claim), while ${SLOW} slow evaluations run on ${workers} worker(s)`, busyEval, "-"),
  ];
}

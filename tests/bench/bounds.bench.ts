// Bounds engine benchmarks: full verdicts with thresholds, the radio bounds, and the CLI as a
// whole process from its compiled bundle (start-up, 1,000 BSC claims, a 10,000-claim mixed batch).
// Single verdicts start from cold caches (clearBoundsCaches) and change k on every run, so no
// earlier run's work is reused; the CLI batch shows the warm, realistic case.
import { spawn, spawnSync } from "node:child_process";
import path from "node:path";
import { clearBoundsCaches, energyConverseEbn0Db, evaluateClaim, orthogonalEbn0Db, spherePackingEbn0Db, spherePackingLog, type ClaimInput } from "@/lib/bounds";
import type { BenchCase } from "./types";

const root = path.resolve(import.meta.dirname, "../..");

function cold(claim: ClaimInput) {
  clearBoundsCaches();
  return evaluateClaim(claim);
}

function bscClaim(n: number, i: number): ClaimInput {
  const k = Math.round(n * 0.85) - (i % 97);
  return { channel: { model: "bsc", p: 0.004 }, code: { n, k }, target: { metric: "bler", value: 1e-6 } };
}

function mixedClaims(count: number): string {
  const lines: string[] = [];
  for (let i = 0; i < count; i++) {
    const n = [648, 1944, 16200, 64800][i % 4];
    const k = Math.round(n * [0.5, 0.75, 0.8333, 0.9][(i >> 2) % 4]) - (i % 13);
    const target = { metric: i % 3 ? "bler" : "ber", value: 10 ** -(3 + (i % 10)) };
    const ch =
      i % 5 === 0
        ? { model: "bec", e: 0.02 + (i % 7) * 0.02 }
        : i % 5 === 1
          ? { model: "biawgn", ebn0Db: 1 + (i % 9) * 0.5 }
          : i % 5 === 2
            ? { model: "bsc", p: 1e-3 * (1 + (i % 11)) }
            : i % 5 === 3
              ? { model: "bsc", ncgDb: 8 + (i % 5) * 0.3 }
              : { model: "bsc", p: 5e-3 };
    const code = i % 17 === 0 ? { overhead: 0.07 } : { n, k };
    lines.push(i % 1000 === 999 ? "{bad line" : JSON.stringify({ channel: ch, code, target }));
  }
  return lines.join("\n") + "\n";
}

/** The CLI as a whole process, from its compiled bundle (built once here if stale, as `npm run evaluate` does). */
function runCli(input: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [path.join(root, ".build/evaluate.mjs")], { cwd: root });
    let lines = 0;
    child.stdout.on("data", (b: Buffer) => {
      for (const c of b) if (c === 10) lines++;
    });
    child.on("error", reject);
    child.on("close", (code) => (code === 0 ? resolve(lines) : reject(new Error(`cli exited ${code}`))));
    child.stdin.end(input);
  });
}

const batch = mixedClaims(10_000);
const bscBatch = Array.from({ length: 1000 }, (_, i) => {
  const n = [1944, 16_200, 64_800][i % 3];
  const k = Math.round(n * [0.5, 0.75, 0.8333, 0.9][i % 4]) - (i % 13);
  return JSON.stringify({ channel: { model: "bsc", p: 1e-3 * (1 + (i % 11)) }, code: { n, k }, target: { metric: "bler", value: 10 ** -(3 + (i % 10)) } });
}).join("\n");
spawnSync(process.execPath, [path.join(root, "lib/runtime/evaluate.mjs"), "--build"], { cwd: root });

/** The 1959 bound cold at n up to 10^5: a new k each run, so no cone angle is reused. */
const sphereForward = (n: number) => (i: number) => {
  clearBoundsCaches();
  return spherePackingLog(n, Math.round(n / 2) + i, 1.5);
};
const sphereInverse = (n: number) => (i: number) => {
  clearBoundsCaches();
  return spherePackingEbn0Db(n, Math.round(n / 2) + i, Math.log(1e-6));
};

export const benches: BenchCase[] = [
  { name: "BSC verdict + thresholds, n = 1,944", runs: 40, targetMs: 5, run: (i) => cold(bscClaim(1944, i)) },
  { name: "BSC verdict + thresholds, n = 64,800", runs: 30, targetMs: 5, run: (i) => cold(bscClaim(64_800, i)) },
  { name: "BSC verdict + thresholds, n = 10^6", runs: 15, targetMs: 50, run: (i) => cold(bscClaim(1_000_000, i)) },
  {
    name: "BEC verdict + thresholds, n = 10^5",
    runs: 20,
    run: (i) => cold({ channel: { model: "bec", e: 0.05 }, code: { n: 100_000, k: 90_000 - i }, target: { metric: "bler", value: 1e-6 } }),
  },
  {
    name: "BI-AWGN verdict + thresholds, n = 64,800",
    runs: 20,
    targetMs: 5,
    run: (i) => cold({ channel: { model: "biawgn", ebn0Db: 1.5 + i * 1e-3 }, code: { n: 64_800, k: 32_400 - i }, target: { metric: "bler", value: 1e-6 } }),
  },
  { name: "1959 bound forward, n = 1,024", runs: 40, targetMs: 2, run: sphereForward(1024) },
  { name: "1959 bound forward, n = 100,000", runs: 40, targetMs: 2, run: sphereForward(100_000) },
  { name: "1959 bound inverse, n = 1,024", runs: 20, targetMs: 20, run: sphereInverse(1024) },
  { name: "1959 bound inverse, n = 100,000", runs: 20, targetMs: 20, run: sphereInverse(100_000) },
  { name: "energy converse, k = 160..10^6", runs: 200, targetMs: 0.1, run: (i) => energyConverseEbn0Db(160 + i * 5000, Math.log(1e-3)) },
  { name: "orthogonal achievability inverse, k = 160", runs: 20, targetMs: 0.1, run: (i) => orthogonalEbn0Db(160 + i, Math.log(1e-3)) },
  { name: "CLI process start-up (compiled bundle, no input)", runs: 10, warmup: 1, childProcess: true, targetMs: 300, run: () => runCli("") },
  {
    name: "CLI process, 1,000 BSC claims (n = 1,944 / 16,200 / 64,800)",
    runs: 5,
    childProcess: true,
    warmup: 1,
    targetMs: 700,
    run: async () => {
      const lines = await runCli(`${bscBatch}\n`);
      if (lines !== 1000) throw new Error(`expected 1,000 output lines, got ${lines}`);
    },
  },
  {
    name: "CLI process, 10,000 mixed claims",
    runs: 3,
    childProcess: true,
    warmup: 0,
    targetMs: 20_000,
    run: async () => {
      const lines = await runCli(batch);
      if (lines !== 10_000) throw new Error(`expected 10,000 output lines, got ${lines}`);
    },
  },
];

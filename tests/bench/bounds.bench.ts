// Bounds engine benchmarks: full verdicts with thresholds, and a 10,000-claim batch through the CLI.
// Single verdicts start from cold caches (clearBoundsCaches) and change k on every run, so no
// earlier run's work is reused; the CLI batch shows the warm, realistic case.
import { spawn } from "node:child_process";
import path from "node:path";
import { clearBoundsCaches, evaluateClaim, type ClaimInput } from "@/lib/bounds";
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
      i % 5 === 0 ? { model: "bec", e: 0.02 + (i % 7) * 0.02 }
      : i % 5 === 1 ? { model: "biawgn", ebn0Db: 1 + (i % 9) * 0.5 }
      : i % 5 === 2 ? { model: "bsc", p: 1e-3 * (1 + (i % 11)) }
      : i % 5 === 3 ? { model: "bsc", ncgDb: 8 + (i % 5) * 0.3 }
      : { model: "bsc", p: 5e-3 };
    const code = i % 17 === 0 ? { overhead: 0.07 } : { n, k };
    lines.push(i % 1000 === 999 ? "{bad line" : JSON.stringify({ channel: ch, code, target }));
  }
  return lines.join("\n") + "\n";
}

function runCli(input: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const child = spawn(path.join(root, "node_modules/.bin/tsx"), [path.join(root, "lib/bounds/cli.ts")], { cwd: root });
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

export const benches: BenchCase[] = [
  { name: "BSC verdict + thresholds, n = 1,944", runs: 40, targetMs: 5, run: (i) => cold(bscClaim(1944, i)) },
  { name: "BSC verdict + thresholds, n = 64,800", runs: 30, targetMs: 5, run: (i) => cold(bscClaim(64_800, i)) },
  { name: "BSC verdict + thresholds, n = 10^6", runs: 15, targetMs: 50, run: (i) => cold(bscClaim(1_000_000, i)) },
  {
    name: "BEC verdict + thresholds, n = 10^5",
    runs: 20,
    run: (i) =>
      cold({ channel: { model: "bec", e: 0.05 }, code: { n: 100_000, k: 90_000 - i }, target: { metric: "bler", value: 1e-6 } }),
  },
  {
    name: "BI-AWGN verdict + thresholds, n = 64,800",
    runs: 20,
    targetMs: 5,
    run: (i) =>
      cold({ channel: { model: "biawgn", ebn0Db: 1.5 + i * 1e-3 }, code: { n: 64_800, k: 32_400 - i }, target: { metric: "bler", value: 1e-6 } }),
  },
  {
    name: "CLI process, 10,000 mixed claims",
    runs: 3,
    warmup: 0,
    targetMs: 20_000,
    run: async () => {
      const lines = await runCli(batch);
      if (lines !== 10_000) throw new Error(`expected 10,000 output lines, got ${lines}`);
    },
  },
];

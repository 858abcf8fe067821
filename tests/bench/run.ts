// Benchmark runner: imports every bench module listed below, runs each case, prints a table of
// medians. To add benches, export `benches: BenchCase[]` or `report()` from a module and list it in MODULES.
import { readFileSync } from "node:fs";
import type { BenchCase, BenchRow } from "./types";

// A module exports `benches` (each run timed here) or `report()` (it times itself and returns rows).
// `npm run bench -- web` runs only the web benchmark (a production server on the scale workload).
const MODULES = process.argv.includes("web") ? ["./web.ts"] : ["./bounds.bench.ts", "./comparison.bench.ts", "./engine-pool.bench.ts"];

/** CPU ms of this process's reaped children (cutime + cstime of /proc/self/stat, 10 ms ticks); NaN off Linux. */
function childCpuMs(): number {
  try {
    const fields = readFileSync("/proc/self/stat", "utf8").split(") ")[1].split(" ");
    return (Number(fields[13]) + Number(fields[14])) * 10; // fields 16 and 17 of proc(5), at 100 ticks a second
  } catch {
    return NaN;
  }
}

function quantile(sorted: number[], q: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))];
}

async function main() {
  // CPU ms is this process's own user + system time: the shared machine's load inflates wall time
  // but not CPU time. For the CLI cases it is the child process's time, from the kernel's count.
  const rows: string[][] = [["case", "runs", "median ms", "p95 ms", "CPU ms", "target"]];
  let over = 0;
  for (const m of MODULES) {
    const mod = (await import(m)) as { benches?: BenchCase[]; report?: () => Promise<BenchRow[]> };
    for (const r of (await mod.report?.()) ?? []) {
      rows.push([r.name, String(r.runs), r.medianMs.toFixed(2), r.p95Ms.toFixed(2), "-", r.target]);
    }
    for (const b of mod.benches ?? []) {
      for (let i = 0; i < (b.warmup ?? 2); i++) await b.run(i);
      const times: number[] = [];
      const cpu: number[] = [];
      for (let i = 0; i < b.runs; i++) {
        const c0 = process.cpuUsage();
        const k0 = childCpuMs();
        const t0 = performance.now();
        await b.run(i + 1000);
        times.push(performance.now() - t0);
        const c = process.cpuUsage(c0);
        cpu.push(b.childProcess ? childCpuMs() - k0 : (c.user + c.system) / 1000);
      }
      times.sort((a, c) => a - c);
      cpu.sort((a, c) => a - c);
      const cpuText = Number.isNaN(quantile(cpu, 0.5)) ? "-" : quantile(cpu, 0.5).toFixed(b.childProcess ? 0 : 2);
      const median = quantile(times, 0.5);
      if (b.targetMs !== undefined && median > b.targetMs) over++;
      rows.push([b.name, String(b.runs), median.toFixed(2), quantile(times, 0.95).toFixed(2), cpuText, b.targetMs === undefined ? "-" : `<= ${b.targetMs} ms`]);
      process.stderr.write(`.`);
    }
  }
  process.stderr.write("\n");
  const widths = rows[0].map((_, j) => Math.max(...rows.map((r) => r[j].length)));
  for (const [i, r] of rows.entries()) {
    console.log(r.map((c, j) => (j === 0 ? c.padEnd(widths[j]) : c.padStart(widths[j]))).join("  "));
    if (i === 0) console.log(widths.map((w) => "-".repeat(w)).join("  "));
  }
  if (over > 0) console.log(`\n${over} case(s) above target (medians; the machine is shared, rerun before concluding)`);
}

main();

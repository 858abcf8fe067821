// Round trip through the evaluate CLI as a separate process: JSON lines in, JSON lines out, in order.
import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import path from "node:path";

const root = path.resolve(import.meta.dirname, "../..");
const tsx = path.join(root, "node_modules/.bin/tsx");
const cli = path.join(root, "lib/bounds/cli.ts");

function run(input: string, args: string[] = []) {
  return spawnSync(tsx, [cli, ...args], { cwd: root, input, encoding: "utf8", timeout: 60_000 });
}

describe("evaluate CLI", () => {
  it("answers each claim line in order, reports bad lines and skips blank ones", () => {
    const lines = [
      JSON.stringify({ channel: { model: "bsc", p: 0.002 }, code: { n: 1944, k: 1620 }, target: { metric: "bler", value: 1e-6 } }),
      "",
      "{not json",
      JSON.stringify({ channel: { model: "bsc", p: 0.002 }, code: { n: 1944, k: 2000 }, target: { metric: "bler", value: 1e-6 } }),
      "   ",
      JSON.stringify({ channel: { model: "bsc", p: 0.01 }, code: { overhead: 0.07 }, target: { metric: "ber", value: 1e-15 } }),
      JSON.stringify({ channel: { model: "biawgn", ebn0Db: 2 }, code: { n: 64800, k: 32400 }, target: { metric: "bler", value: 1e-6 } }),
      JSON.stringify({ channel: { model: "bec", e: 0.05 }, code: { n: 1000, k: 900 }, target: { metric: "bler", value: 1e-6 } }),
    ];
    const r = run(lines.join("\n") + "\n");
    expect(r.status).toBe(0);
    const out = r.stdout
      .trim()
      .split("\n")
      .map((l) => JSON.parse(l));
    expect(out).toHaveLength(6); // two blank lines produce nothing
    expect(out[0].verdict).toBe("plausible");
    expect(out[0].engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
    expect(out[1].error).toMatch(/^line 3: not valid JSON/);
    expect(out[2].error).toBe("line 4: code.k: must be at most n (1944)");
    expect(out[3].verdict).toBe("impossible");
    expect(out[4].verdict).toBe("plausible");
    expect(out[4].thresholds.unit).toBe("ebn0Db");
    expect(out[5].converse.log10Bler).toBeLessThan(0);
  });

  it("answers the claim that once never returned (BI-AWGN, NCG -20 dB, n = 2048, rate 1/2, BLER 1e-10)", () => {
    const claim = { channel: { model: "biawgn", ncgDb: -20 }, code: { n: 2048, rate: 0.5 }, target: { metric: "bler", value: 1e-10 } };
    const r = run(`${JSON.stringify(claim)}\n`);
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).verdict).toBe("plausible");
  });

  it("prints usage with --help and exits 0", () => {
    const r = run("", ["--help"]);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/Usage: npm run --silent evaluate/);
    expect(r.stdout).toMatch(/empty or hold only white space are skipped/);
  });

  it("exits 0 on empty input with no output", () => {
    const r = run("");
    expect(r.status).toBe(0);
    expect(r.stdout).toBe("");
  });
});

// Command line: one JSON claim per input line, one JSON result per output line, in order.
import { createInterface } from "node:readline";
import { claimSchema, formatClaimError } from "./schema";
import { evaluateClaim } from "./verdict";
import { ENGINE_VERSION } from "./version";

const HELP = `Usage: npm run --silent evaluate < claims.jsonl > results.jsonl

Reads one claim per line on standard input, as JSON, and writes one result per line on
standard output, in the same order (bounds engine ${ENGINE_VERSION}).

A claim:
  {"channel": {"model": "bsc", "p": 0.002} | {"model": "bec", "e": 0.05}
             | {"model": "biawgn", "ebn0Db": 2.0} | {"model": "biawgn", "esn0Db": -1.0}
             | {"model": "bsc" | "biawgn", "ncgDb": 8.5}
             | {"model": "biawgn", "sensitivityDbm": -121.5, "bitRate": 1200,
                "noiseFigureDb": 2, "assumedNoiseFigureDb": 4}
               (bitRate: information bits per second; noise figures optional, default 0 dB),
   "code": {"n": 1944, "k": 1620} | {"rate": 0.8333} | {"overhead": 0.07}  (n may accompany rate or overhead;
           a rate with n is taken as the whole k = floor(n R))
           | {"k": 160}  (a payload alone, BI-AWGN in ebn0Db or sensitivityDbm: energy checks only),
           optional "modulation": "bpsk" | "qpsk" (BI-AWGN; default bpsk),
   "target": {"metric": "bler" | "ber", "value": 1e-6}}

A result carries "verdict" (impossible, needs-evidence, plausible), "findings", bounds, thresholds
and margins, and for the BI-AWGN channel "spherePacking", "energy" and "implied" (Eb/N0 in dB);
see lib/bounds/result.ts for every field.

Lines that are empty or hold only white space are skipped and produce no output line.
A line that is not valid JSON or not a valid claim produces {"error": "..."} naming the field
and its allowed range; the following lines are still evaluated.
Exit status: 0 when the input could be read (even if some lines were bad), 2 when it could not.

Options:
  --help, -h   print this text and exit`;

/** Output is gathered into chunks so a long batch costs few writes; drain is awaited when the pipe is full. */
class BufferedOut {
  private parts: string[] = [];
  private size = 0;
  async line(s: string): Promise<void> {
    this.parts.push(s, "\n");
    this.size += s.length + 1;
    if (this.size >= 1 << 16) await this.flush();
  }
  async flush(): Promise<void> {
    if (this.size === 0) return;
    const chunk = this.parts.join("");
    this.parts = [];
    this.size = 0;
    if (!process.stdout.write(chunk)) await new Promise<void>((resolve) => process.stdout.once("drain", resolve));
  }
}

/** One input line to one output line (never throws). */
function evaluateLine(line: string, lineNo: number): string {
  let data: unknown;
  try {
    data = JSON.parse(line);
  } catch (err) {
    return JSON.stringify({ error: `line ${lineNo}: not valid JSON (${(err as Error).message})` });
  }
  const parsed = claimSchema.safeParse(data);
  if (!parsed.success) return JSON.stringify({ error: `line ${lineNo}: ${formatClaimError(parsed.error)}` });
  try {
    return JSON.stringify(evaluateClaim(parsed.data));
  } catch (err) {
    return JSON.stringify({ error: `line ${lineNo}: the engine failed on this claim (${(err as Error).message})` });
  }
}

async function main(): Promise<number> {
  const args = process.argv.slice(2);
  if (args.includes("--help") || args.includes("-h")) {
    process.stdout.write(`${HELP}\n`);
    return 0;
  }
  if (args.length > 0) {
    process.stderr.write(`unknown argument: ${args[0]} (try --help)\n`);
    return 2;
  }
  const out = new BufferedOut();
  let failed = false;
  process.stdin.on("error", (err) => {
    failed = true;
    process.stderr.write(`cannot read standard input: ${err.message}\n`);
  });
  const rl = createInterface({ input: process.stdin, crlfDelay: Infinity });
  let lineNo = 0;
  for await (const line of rl) {
    lineNo++;
    if (line.trim() === "") continue;
    await out.line(evaluateLine(line, lineNo));
  }
  await out.flush();
  return failed ? 2 : 0;
}

main().then(
  (code) => {
    process.exitCode = code;
  },
  (err: unknown) => {
    process.stderr.write(`cannot read standard input: ${(err as Error).message}\n`);
    process.exitCode = 2;
  },
);

// The web benchmark (`npm run bench -- web`; kept out of `npm test` and out of the default bench):
// builds the app if needed, fills a data folder with the scale workload (db/seed-scale.ts) unless
// it holds one already, starts the production build (`npm start`, DEMO=1) on it, signs in the demo
// accounts and measures p50 and p95 of each page and route at 1 and at 20 concurrent signed-in
// clients, while sampling the server's resident memory. Then the same on PostgreSQL: two app
// instances on two ports behind one database (DATABASE_URL, or a server started under /tmp from
// Debian's binaries, as .ci/run does), the clients spread over both.
//
// Settings: BENCH_PORT (3104; the second instance uses BENCH_PORT + 10), BENCH_DATA_DIR (a folder
// under the system's temp folder, seeded once and reused), BENCH_PG_PORT (55432), DATABASE_URL.
// Flags after `web`: --pglite-only, --pg-only, --rounds N (waves of 20 per case, default 3).
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import type { BenchRow } from "./types";

const ROOT = path.resolve(import.meta.dirname, "../..");
const PORT = Number(process.env.BENCH_PORT ?? 3104);
const DATA = process.env.BENCH_DATA_DIR ?? path.join(os.tmpdir(), "ratecourt-bench-data");
const PG_PORT = Number(process.env.BENCH_PG_PORT ?? 55432);
const TARGET_MS = 200;
const MEMORY_TARGET_MB = 1024;
const CONCURRENT = 20;
const WIDE_TITLE = "Framework: telemetry radios for every works";

const args = process.argv.slice(2);
const flag = (name: string) => args.includes(name);
const ROUNDS = Number(args[args.indexOf("--rounds") + 1]) || 3;
const log = (line: string) => process.stderr.write(`[web bench] ${line}\n`);

type Settings = Record<string, string>;

/** The bench's environment with the given settings; DATABASE_URL only where given (the PGlite runs have none). */
function envWith(env: Settings): NodeJS.ProcessEnv {
  const { DATABASE_URL: _given, ...rest } = process.env;
  return { ...rest, ...env } as NodeJS.ProcessEnv;
}

/** Runs a command to its end with the output passed through; rejects on a non-zero exit. */
function run(command: string, commandArgs: string[], env: Settings = {}): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, commandArgs, { cwd: ROOT, env: envWith(env), stdio: ["ignore", "inherit", "inherit"] });
    child.on("exit", (code) => (code === 0 ? resolve() : reject(new Error(`${command} ${commandArgs.join(" ")} ended with ${code}`))));
  });
}

/** The newest modification time of the app's sources (what a production build is made from). */
function newestSource(): number {
  let newest = 0;
  const walk = (dir: string) => {
    for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) walk(full);
      else newest = Math.max(newest, fs.statSync(full).mtimeMs);
    }
  };
  for (const dir of ["app", "lib", "db", "policies", "drizzle"]) walk(path.join(ROOT, dir));
  for (const file of ["package.json", "next.config.ts", "proxy.ts", "tailwind.config.ts"])
    newest = Math.max(newest, fs.statSync(path.join(ROOT, file)).mtimeMs);
  return newest;
}

/** Builds unless a production build newer than every source file is there: never measure stale code. */
async function ensureBuild() {
  const id = path.join(ROOT, ".next", "BUILD_ID");
  if (fs.existsSync(id) && fs.statSync(id).mtimeMs > newestSource()) return;
  log("no production build of the current sources: running npm run build (several minutes on 2 cores)");
  await run("npm", ["run", "build"]);
}

// ---- servers and their memory -------------------------------------------------------------

interface Server {
  base: string;
  proc: ChildProcess;
  stop: () => Promise<void>;
}

async function startServer(port: number, dataDir: string, env: Settings = {}): Promise<Server> {
  const base = `http://localhost:${port}`;
  const logFile = path.join(os.tmpdir(), `ratecourt-bench-server-${port}.log`);
  const out = fs.openSync(logFile, "w");
  const proc = spawn("npm", ["start"], {
    cwd: ROOT,
    detached: true,
    stdio: ["ignore", out, out],
    env: envWith({
      NODE_ENV: "production",
      DEMO: "1",
      PORT: String(port),
      DATA_DIR: dataDir,
      BETTER_AUTH_URL: base,
      SIGN_IN_ATTEMPTS_PER_MINUTE: "100000",
      ...env,
    }),
  });
  const deadline = Date.now() + 240_000;
  for (;;) {
    if (proc.exitCode !== null) throw new Error(`the server on ${port} stopped at start: see ${logFile}`);
    try {
      const response = await fetch(`${base}/sign-in`);
      if (response.status === 200) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`the server on ${port} did not answer within 4 minutes: see ${logFile}`);
    await new Promise((r) => setTimeout(r, 1000));
  }
  const stop = async () => {
    if (proc.exitCode !== null) return;
    const exited = new Promise((r) => proc.once("exit", r));
    process.kill(-proc.pid!, "SIGTERM");
    await Promise.race([exited, new Promise((r) => setTimeout(r, 15_000))]);
    if (proc.exitCode === null) process.kill(-proc.pid!, "SIGKILL");
  };
  return { base, proc, stop };
}

/** Resident memory in MB of a process and its descendants: [the largest one, all together]. */
function residentMb(rootPid: number): [number, number] {
  const parents = new Map<number, number>();
  for (const entry of fs.readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const stat = fs.readFileSync(`/proc/${entry}/stat`, "utf8");
      parents.set(Number(entry), Number(stat.slice(stat.lastIndexOf(")") + 2).split(" ")[1]));
    } catch {
      // gone meanwhile
    }
  }
  const tree = new Set([rootPid]);
  for (let grew = true; grew;) {
    grew = false;
    for (const [pid, ppid] of parents) {
      if (tree.has(ppid) && !tree.has(pid)) {
        tree.add(pid);
        grew = true;
      }
    }
  }
  let largest = 0;
  let total = 0;
  for (const pid of tree) {
    try {
      const kb = Number(/VmRSS:\s+(\d+)/.exec(fs.readFileSync(`/proc/${pid}/status`, "utf8"))?.[1] ?? 0);
      largest = Math.max(largest, kb);
      total += kb;
    } catch {
      // gone meanwhile
    }
  }
  return [largest / 1024, total / 1024];
}

/** Samples every server's memory twice a second; peak() gives the largest process and the largest sum seen. */
function sampleMemory(servers: Server[]) {
  let peakOne = 0;
  let peakAll = 0;
  const timer = setInterval(() => {
    for (const s of servers) {
      const [one, all] = residentMb(s.proc.pid!);
      peakOne = Math.max(peakOne, one);
      peakAll = Math.max(peakAll, all);
    }
  }, 500);
  return { stop: () => clearInterval(timer), peak: () => ({ peakOne, peakAll }) };
}

// ---- signed-in clients ----------------------------------------------------------------------

interface Client {
  base: string;
  cookie: string;
}

async function signIn(base: string, email: string): Promise<Client> {
  const response = await fetch(`${base}/api/auth/sign-in/email`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: base },
    body: JSON.stringify({ email, password: "ratecourt-demo" }),
  });
  if (response.status !== 200) throw new Error(`sign-in as ${email} at ${base}: ${response.status} ${await response.text()}`);
  const cookie = response.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
  return { base, cookie };
}

/** Connections the server closed under a kept-alive request and that were retried (counted, reported). */
let resets = 0;

async function call(client: Client, target: string, body?: unknown): Promise<Response> {
  try {
    return await send(client, target, body);
  } catch (error) {
    // A kept-alive connection the server closed as the request went out: once more on a new one.
    if (!(error instanceof TypeError)) throw error;
    resets += 1;
    return send(client, target, body);
  }
}

function send(client: Client, target: string, body?: unknown): Promise<Response> {
  return fetch(`${client.base}${target}`, {
    method: body === undefined ? "GET" : "POST",
    headers: { cookie: client.cookie, origin: client.base, ...(body === undefined ? {} : { "content-type": "application/json" }) },
    body: body === undefined ? undefined : JSON.stringify(body),
    redirect: "manual",
  });
}

/** A list answer, whether a bare array or a page object (pagination may wrap it). */
function itemsOf<T>(value: unknown, key: string): T[] {
  if (Array.isArray(value)) return value as T[];
  const record = value as Record<string, unknown>;
  for (const k of [key, "items", "rows", "data"]) if (Array.isArray(record?.[k])) return record[k] as T[];
  return [];
}

// ---- the cases ------------------------------------------------------------------------------

type Role = "buyer" | "engineer" | "admin";
const EMAILS: Record<Role, string> = { buyer: "buyer@tarnwell.example", engineer: "engineer@tarnwell.example", admin: "admin@tarnwell.example" };

interface Case {
  name: string;
  role: Role;
  /** One visit: every request it makes, in order (a page and what it embeds). */
  paths: string[];
  body?: unknown;
  /** Waves of CONCURRENT at 20 clients (heavy cases fewer). */
  rounds?: number;
}

/** 1,000 invented claims over a spread of channels, codes and targets (the same batch each time). */
function thousandClaims() {
  const codes = [
    [648, 540],
    [1024, 768],
    [1944, 1620],
    [2048, 1536],
    [4096, 3584],
  ];
  const ps = [1e-3, 2e-3, 3e-3, 5e-3, 8e-3];
  const targets = [1e-4, 1e-5, 1e-6, 1e-7];
  return Array.from({ length: 1000 }, (_, i) => {
    const [n, k] = codes[i % codes.length];
    return {
      channel: { model: "bsc", p: ps[Math.floor(i / 5) % ps.length] * (1 + (i % 8) / 10) },
      code: { n, k },
      target: { metric: "bler", value: targets[Math.floor(i / 25) % targets.length] },
    };
  });
}

async function findCases(buyer: Client, engineer: Client): Promise<Case[]> {
  // The list is paged: ask the server for the two tenders by its filters.
  const listed = async (query: string) =>
    itemsOf<{ id: string; title: string; state: string }>(await (await call(buyer, `/api/v1/tenders?${query}`)).json(), "tenders");
  const wide = (await listed(`q=${encodeURIComponent(WIDE_TITLE)}`)).find((t) => t.title === WIDE_TITLE);
  const approval = (await listed("state=approval")).at(0);
  if (!wide || !approval) throw new Error("the data folder does not hold the scale workload: remove it and run again (it is seeded when missing)");
  const queue = itemsOf<{ id: string }>(await (await call(engineer, "/api/v1/claims")).json(), "claims");
  if (queue.length === 0) throw new Error("the engineer's review bench is empty: the scale workload is missing");
  return [
    { name: "Desk", role: "buyer", paths: ["/desk"] },
    { name: "Tenders list", role: "buyer", paths: ["/tenders"] },
    { name: "Review bench", role: "engineer", paths: ["/review"] },
    { name: "Claim page", role: "engineer", paths: [`/review/claims/${queue[Math.floor(queue.length / 2)].id}`] },
    { name: "Comparison route (50 offers x 10 claims)", role: "buyer", paths: [`/api/v1/tenders/${wide.id}/comparison`] },
    {
      name: "Sign-off tab (page + memo preview)",
      role: "buyer",
      paths: [`/tenders/${approval.id}/sign-off`, `/api/v1/tenders/${approval.id}/memo/preview`],
      rounds: 1,
    },
    { name: "Ledger tab", role: "buyer", paths: [`/tenders/${wide.id}/ledger`] },
    { name: "People page", role: "admin", paths: ["/people"] },
    { name: "POST /api/v1/evaluate (1,000 claims)", role: "engineer", paths: ["/api/v1/evaluate"], body: thousandClaims(), rounds: 1 },
  ];
}

/** One visit, timed to the last byte of its last answer. */
async function visit(client: Client, c: Case): Promise<number> {
  const t0 = performance.now();
  for (const p of c.paths) {
    const response = await call(client, p, c.body);
    await response.arrayBuffer();
    if (response.status !== 200) throw new Error(`${c.name}: ${p} answered ${response.status}`);
  }
  return performance.now() - t0;
}

const quantile = (sorted: number[], q: number) => sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))];

async function measure(label: string, c: Case, clients: Client[], concurrency: number): Promise<BenchRow> {
  resets = 0;
  const times: number[] = [];
  if (concurrency === 1) {
    await visit(clients[0], c); // warm-up
    for (let i = 0; i < 10; i++) times.push(await visit(clients[i % clients.length], c));
  } else {
    await Promise.all(clients.slice(0, concurrency).map((client) => visit(client, c))); // warm-up wave
    for (let r = 0; r < (c.rounds ?? ROUNDS); r++) times.push(...(await Promise.all(clients.slice(0, concurrency).map((client) => visit(client, c)))));
  }
  times.sort((a, b) => a - b);
  const row = {
    name: `${label}: ${c.name}, ${concurrency} client${concurrency > 1 ? "s" : ""}${resets ? ` (${resets} reset connection${resets > 1 ? "s" : ""} retried)` : ""}`,
    runs: times.length,
    medianMs: quantile(times, 0.5),
    p95Ms: quantile(times, 0.95),
    target: `p95 < ${TARGET_MS} ms`,
  };
  resets = 0;
  log(`${row.name}: p50 ${row.medianMs.toFixed(0)} ms, p95 ${row.p95Ms.toFixed(0)} ms`);
  return row;
}

/** Signs in CONCURRENT sessions per role, spread over the servers, then measures every case. */
async function measureAll(label: string, servers: Server[]): Promise<BenchRow[]> {
  const sessions = {} as Record<Role, Client[]>;
  for (const role of Object.keys(EMAILS) as Role[]) {
    sessions[role] = [];
    for (let i = 0; i < CONCURRENT; i++) sessions[role].push(await signIn(servers[i % servers.length].base, EMAILS[role]));
  }
  const cases = await findCases(sessions.buyer[0], sessions.engineer[0]);
  const memory = sampleMemory(servers);
  const rows: BenchRow[] = [];
  try {
    for (const c of cases) {
      rows.push(await measure(label, c, sessions[c.role], 1));
      rows.push(await measure(label, c, sessions[c.role], CONCURRENT));
      log(`peak resident memory so far: ${memory.peak().peakOne.toFixed(0)} MB (largest process)`);
    }
  } finally {
    memory.stop();
  }
  const { peakOne, peakAll } = memory.peak();
  rows.push({
    name: `${label}: peak resident memory, largest process / all of a server's processes (MB)`,
    runs: 0,
    medianMs: peakOne,
    p95Ms: peakAll,
    target: `< ${MEMORY_TARGET_MB} MB`,
  });
  return rows;
}

// ---- the two databases ----------------------------------------------------------------------

async function pgliteRows(): Promise<BenchRow[]> {
  if (!fs.existsSync(path.join(DATA, "pglite"))) {
    log(`seeding the scale workload into ${DATA} (npm run seed:scale)`);
    await run("npm", ["run", "seed:scale"], { DATA_DIR: DATA });
  }
  const server = await startServer(PORT, DATA);
  try {
    return await measureAll("PGlite", [server]);
  } finally {
    await server.stop();
  }
}

/** A PostgreSQL server under /tmp from Debian's binaries, for this run only (as .ci/run does). */
async function startPostgres(): Promise<{ url: string; stop: () => void }> {
  const bins = fs.existsSync("/usr/lib/postgresql") ? fs.readdirSync("/usr/lib/postgresql").sort((a, b) => Number(a) - Number(b)) : [];
  const bin = bins.length ? path.join("/usr/lib/postgresql", bins.at(-1)!, "bin") : null;
  if (!bin || !fs.existsSync(path.join(bin, "initdb"))) {
    throw new Error("No PostgreSQL server binaries in /usr/lib/postgresql/*/bin: install them (apt-get install -y postgresql) or set DATABASE_URL.");
  }
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "ratecourt-bench-pg-"));
  const root = process.getuid?.() === 0;
  // initdb refuses to run as root: as root, run the server as the postgres user.
  if (root && spawnSync("id", ["postgres"]).status !== 0) spawnSync("useradd", ["--system", "--no-create-home", "postgres"], { stdio: "inherit" });
  if (root) spawnSync("chown", ["postgres", dir]);
  const as = (cmd: string) => {
    const result = root
      ? spawnSync("su", ["postgres", "-s", "/bin/bash", "-c", cmd], { stdio: "inherit" })
      : spawnSync("bash", ["-c", cmd], { stdio: "inherit" });
    if (result.status !== 0) throw new Error(`PostgreSQL setup failed: ${cmd}`);
  };
  as(`${bin}/initdb -D ${dir}/data -A trust -U ratecourt >/dev/null`);
  as(`${bin}/pg_ctl -D ${dir}/data -o '-p ${PG_PORT} -k ${dir} -c listen_addresses=127.0.0.1 -c max_connections=100' -l ${dir}/log -w start >/dev/null`);
  as(`${bin}/createdb -h 127.0.0.1 -p ${PG_PORT} -U ratecourt ratecourt`);
  return {
    url: `postgres://ratecourt@127.0.0.1:${PG_PORT}/ratecourt`,
    stop: () => {
      try {
        as(`${bin}/pg_ctl -D ${dir}/data -m fast stop >/dev/null`);
      } finally {
        fs.rmSync(dir, { recursive: true, force: true });
      }
    },
  };
}

/** How many tenders a PostgreSQL database holds (0 when it has no schema yet). */
async function tendersIn(url: string): Promise<number> {
  const { default: pg } = await import("pg");
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const { rows } = await client.query("select count(*)::int as n from tenders");
    return rows[0].n as number;
  } catch {
    return 0;
  } finally {
    await client.end();
  }
}

async function postgresRows(): Promise<BenchRow[]> {
  const own = process.env.DATABASE_URL ? null : await startPostgres();
  const url = process.env.DATABASE_URL ?? own!.url;
  // Each instance has its own data folder; the second starts as a copy of the first, so both hold
  // the same secrets, ledger checkpoints and stored memos. With a given DATABASE_URL that holds
  // the workload already, the first folder (BENCH_DATA_DIR-pg, from the seeding run) is reused.
  const first = `${DATA}-pg`;
  const second = `${DATA}-pg-b`;
  try {
    if (own || !fs.existsSync(first) || (await tendersIn(url)) < 200) {
      log("seeding the scale workload into PostgreSQL (npm run db:reset, then npm run seed:scale)");
      fs.rmSync(first, { recursive: true, force: true });
      await run("npm", ["run", "db:reset"], { DATA_DIR: first, DATABASE_URL: url });
      await run("npm", ["run", "seed:scale"], { DATA_DIR: first, DATABASE_URL: url });
    }
    fs.rmSync(second, { recursive: true, force: true });
    fs.cpSync(first, second, { recursive: true, filter: (src) => path.basename(src) !== "server.lock" });
    const servers = [await startServer(PORT, first, { DATABASE_URL: url }), await startServer(PORT + 10, second, { DATABASE_URL: url })];
    try {
      return await measureAll("PostgreSQL, 2 instances", servers);
    } finally {
      for (const s of servers) await s.stop();
    }
  } finally {
    own?.stop();
    fs.rmSync(second, { recursive: true, force: true });
    if (own) fs.rmSync(first, { recursive: true, force: true });
  }
}

/** For tests/bench/run.ts (`npm run bench -- web`). */
export async function report(): Promise<BenchRow[]> {
  await ensureBuild();
  const [load] = os.loadavg();
  log(`machine: ${os.cpus().length} cores, load average ${load.toFixed(2)} at the start`);
  const rows: BenchRow[] = [];
  if (!flag("--pg-only")) rows.push(...(await pgliteRows()));
  if (!flag("--pglite-only")) rows.push(...(await postgresRows()));
  log(`load average ${os.loadavg()[0].toFixed(2)} at the end`);
  return rows;
}

// `npm run dev` (through tsx) and `npm start` (its bundle, .next/ratecourt/start.mjs, on plain node;
// see lib/runtime/bundle.mjs): check the settings, hold the data folder, then run Next.js as a
// child that inherits the lock. A second server on the same folder stops here with a message.
import { spawn } from "node:child_process";
import { createRequire } from "node:module";
import { demoPackagesRefusal, missingDemoPackages } from "../dev/demo-packages";
import { parseEnv, productionProblems, productionRefusal } from "../env";
import { holdDataFolder } from "./data-lock";

const mode = process.argv[2];
if (mode !== "dev" && mode !== "start") {
  console.error("usage: start.ts dev|start [next options]");
  process.exit(2);
}

function fail(message: string): never {
  console.error(message);
  process.exit(1);
}

// `next start` runs in production whatever NODE_ENV says; check the settings as it will see them.
const childEnv: NodeJS.ProcessEnv = { ...process.env, NODE_ENV: mode === "start" ? "production" : "development" };
let settings;
try {
  settings = parseEnv(childEnv);
} catch (error) {
  fail((error as Error).message);
}
const problems = productionProblems(settings);
if (problems.length > 0) fail(productionRefusal(problems));
const resolvePackage = createRequire(import.meta.url).resolve;
// The demo's fakes are development packages: an install without them refuses the demo here.
const missing = missingDemoPackages(settings, (name) => resolvePackage(name));
if (missing.length > 0) fail(demoPackagesRefusal({ missing }));

// Everything the server writes into the data folder is for its owner only.
process.umask(0o077);
try {
  holdDataFolder(settings.DATA_DIR, mode === "dev" ? "npm run dev" : "npm start");
} catch (error) {
  fail((error as Error).message);
}

const next = resolvePackage("next/dist/bin/next");
const args = [next, mode, "-p", String(settings.PORT), ...process.argv.slice(3)];
if (settings.demoMode) {
  const what = mode === "dev" ? "development" : "demo mode";
  console.log(`Ratecourt (${what}): local mail and storage fakes, data in ${settings.DATA_DIR}, ${settings.appUrl}`);
}
const child = spawn(process.execPath, args, {
  stdio: "inherit",
  env: { ...childEnv, RATECOURT_DATA_LOCK_PID: String(process.pid) },
});

for (const signal of ["SIGINT", "SIGTERM", "SIGHUP"] as const) {
  process.on(signal, () => child.kill(signal));
}
child.on("exit", (code, signal) => process.exit(code ?? (signal ? 1 : 0)));

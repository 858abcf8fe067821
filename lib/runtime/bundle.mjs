// The second half of `npm run build`: compiles what production runs outside Next.js (the starter,
// the engine's worker threads, the operator's scripts) into plain JavaScript under
// .next/ratecourt/, so that `npm start` and the operator's scripts run on node without tsx.
// Packages stay external: they load from node_modules at run time, as in development.
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");

/** Output name → TypeScript entry. */
export const PRODUCTION_ENTRIES = {
  start: "lib/runtime/start.ts",
  "engine-worker": "lib/runtime/engine-worker.ts",
  "create-admin": "db/create-admin.ts",
  backup: "db/backup.ts",
  restore: "db/restore.ts",
};

/** Bundles `entries` (default: all of PRODUCTION_ENTRIES) into `outdir` as <name>.mjs. */
export async function bundleProduction(outdir = path.join(root, ".next", "ratecourt"), entries = PRODUCTION_ENTRIES) {
  const { build } = await import("esbuild");
  await build({
    absWorkingDir: root,
    entryPoints: Object.entries(entries).map(([out, entry]) => ({ out, in: path.join(root, entry) })),
    outdir,
    outExtension: { ".js": ".mjs" },
    bundle: true,
    packages: "external",
    platform: "node",
    format: "esm",
    target: "node20",
    tsconfig: path.join(root, "tsconfig.json"),
    logLevel: "error",
  });
}

// `node lib/runtime/bundle.mjs [outdir]` (the tests bundle into a folder of their own).
if (process.argv[1] === fileURLToPath(import.meta.url)) await bundleProduction(process.argv[2] && path.resolve(process.argv[2]));

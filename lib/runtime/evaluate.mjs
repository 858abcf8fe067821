// Runs the evaluate CLI (lib/bounds/cli.ts) from its compiled bundle, so no TypeScript is compiled
// at start-up; the bundle is rebuilt first whenever an engine source or the lock file is newer.
// `node lib/runtime/evaluate.mjs --build` only builds. Output: .build/evaluate.mjs (git-ignored).
import { readdirSync, statSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
const out = path.join(root, ".build", "evaluate.mjs");
const entry = path.join(root, "lib", "bounds", "cli.ts");

function sources() {
  const dir = path.join(root, "lib", "bounds");
  return [...readdirSync(dir).map((f) => path.join(dir, f)), path.join(root, "package-lock.json"), fileURLToPath(import.meta.url)];
}

function stale() {
  let built;
  try {
    built = statSync(out).mtimeMs;
  } catch {
    return true;
  }
  return sources().some((f) => statSync(f).mtimeMs > built);
}

const buildOnly = process.argv.includes("--build");
if (buildOnly || stale()) {
  const { build } = await import("esbuild");
  await build({
    entryPoints: [entry],
    outfile: out,
    bundle: true,
    platform: "node",
    format: "esm",
    target: "node20",
    minify: true,
    logLevel: "error",
    // CommonJS dependencies bundled into an ES module may call require for Node built-ins
    banner: { js: "import { createRequire as __cr } from 'node:module'; const require = __cr(import.meta.url);" },
  });
}
if (!buildOnly) {
  process.argv = process.argv.filter((a) => a !== "--build");
  await import(pathToFileURL(out).href);
}

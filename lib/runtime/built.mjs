// `npm start` and the operator's commands run the compiled copies that `npm run build` writes to
// .next/ratecourt/ (lib/runtime/bundle.mjs). This launcher says so plainly when they are missing,
// instead of a module-not-found trace: `node lib/runtime/built.mjs <name> [arguments]`.
import { existsSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { PRODUCTION_ENTRIES } from "./bundle.mjs";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
const name = process.argv[2];
if (!Object.hasOwn(PRODUCTION_ENTRIES, name)) {
  console.error(`usage: built.mjs ${Object.keys(PRODUCTION_ENTRIES).join("|")} [arguments]`);
  process.exit(2);
}
// RATECOURT_BUILT_DIR: another folder of compiled copies (the tests use one of their own).
const file = path.join(process.env.RATECOURT_BUILT_DIR ?? path.join(root, ".next", "ratecourt"), `${name}.mjs`);
if (!existsSync(file)) {
  console.error(`Ratecourt is not built yet (${file} is missing): run npm run build first, then run this command again.`);
  process.exit(1);
}
// The compiled script reads its own arguments from process.argv[2] on.
process.argv.splice(2, 1);
await import(pathToFileURL(file).href);

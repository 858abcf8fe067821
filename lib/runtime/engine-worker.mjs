// Where each engine worker thread starts (lib/runtime/engine-pool.ts): plain JavaScript, loaded by
// Node.js itself and never bundled by Next.js, which registers tsx (already what runs the starter)
// and then loads the worker in TypeScript.
import { register } from "tsx/esm/api";

register();
await import("./engine-worker.ts");

// Where each engine worker thread starts in development and tests (lib/runtime/engine-pool.ts):
// plain JavaScript, loaded by Node.js itself and never bundled by Next.js, which registers tsx
// and then loads the worker in TypeScript. A production server runs .next/ratecourt/engine-worker.mjs
// instead, compiled by `npm run build` (lib/runtime/bundle.mjs).
import { register } from "tsx/esm/api";

register();
await import("./engine-worker.ts");

// The engine's heavy work, as run inside the worker threads (lib/runtime/engine-worker.ts).
// Pure functions of plain data: inputs and results cross the thread boundary by structured clone.
import { evaluateClaim, type ClaimInput, type ClaimResult } from "../bounds";
import { buildBoundCharts, type BoundView } from "../explorer";
import { validateEvidenceRows, type CsvClaim } from "../review/csv";

export const engineTasks = {
  /** Verdicts for claims already checked against claimSchema; reports each one done, so a stuck one can be named. */
  claims: (claims: ClaimInput[], progress: (done: number) => void): ClaimResult[] =>
    claims.map((claim, index) => {
      const result = evaluateClaim(claim);
      progress(index + 1);
      return result;
    }),
  /** The Bound explorer's verdict and charts. */
  charts: (view: BoundView) => buildBoundCharts(view),
  /** A lab's CSV file checked row by row, each run assessed against its claim. */
  csv: (input: { csv: string; claims: CsvClaim[]; fallbackId: string | null }) => validateEvidenceRows(input.csv, input.claims, input.fallbackId),
};

export type EngineTasks = typeof engineTasks;
export type EngineKind = keyof EngineTasks;
export type EngineInput<K extends EngineKind> = Parameters<EngineTasks[K]>[0];
export type EngineOutput<K extends EngineKind> = ReturnType<EngineTasks[K]>;

/** What the pool sends a worker, and what comes back. */
export type EngineJob = { id: number; kind: EngineKind; input: unknown; spinMs: number };
export type EngineReply =
  { ready: true } | { id: number; progress: number } | { id: number; ok: true; value: unknown } | { id: number; ok: false; message: string };

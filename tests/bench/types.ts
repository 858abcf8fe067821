/** One benchmark case: `run` is timed `runs` times after `warmup` untimed calls; i varies the input. */
export interface BenchCase {
  name: string;
  runs: number;
  warmup?: number;
  targetMs?: number;
  /** The case runs a child process: its CPU time is read from the reaped children's times (Linux). */
  childProcess?: boolean;
  run: (i: number) => unknown | Promise<unknown>;
}

/** A row a module measured itself (exported as `report()`), e.g. latencies under concurrency. */
export interface BenchRow {
  name: string;
  runs: number;
  medianMs: number;
  p95Ms: number;
  target: string;
}

/** One benchmark case: `run` is timed `runs` times after `warmup` untimed calls; i varies the input. */
export interface BenchCase {
  name: string;
  runs: number;
  warmup?: number;
  targetMs?: number;
  run: (i: number) => unknown | Promise<unknown>;
}

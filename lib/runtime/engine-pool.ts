// Heavy engine work runs here, never on the request thread: a few worker threads, a queue, and a
// deadline per request (queue time included). A job past its deadline has its worker terminated
// and replaced, so one claim that never ends costs one worker for at most the deadline.
import path from "node:path";
import { Worker } from "node:worker_threads";
import { env } from "../env";
import type { EngineInput, EngineJob, EngineKind, EngineOutput, EngineReply } from "./engine-tasks";

/** The job did not finish before its deadline; `done` counts the claims it had finished. */
export class EngineDeadlineError extends Error {
  override readonly name = "EngineDeadlineError";
  constructor(
    readonly deadlineMs: number,
    /** False when it waited in the queue all along (every worker was busy). */
    readonly started: boolean,
    readonly done: number,
  ) {
    super(`The bounds engine did not finish within ${deadlineMs / 1000} s.`);
  }
}

/** By name, not instanceof: Next.js may load two copies of this module into one process. */
export function isEngineDeadline(error: unknown): error is EngineDeadlineError {
  return error instanceof Error && error.name === "EngineDeadlineError";
}

/** The work itself failed (the engine threw, or its worker could not start or died). */
export class EngineFailedError extends Error {
  override readonly name = "EngineFailedError";
}

type Pending = {
  job: EngineJob;
  deadlineMs: number;
  done: number;
  timer: NodeJS.Timeout;
  slot?: Slot;
  resolve(value: unknown): void;
  reject(error: Error): void;
};
type Slot = { worker: Worker; ready: boolean; started: Promise<void>; running?: Pending };

// Resolved from the project folder at run time; the ignore comments keep Turbopack from bundling it
// as a worker entry. A production server runs the worker that `npm run build` compiled to plain
// JavaScript (lib/runtime/bundle.mjs); development and tests load the TypeScript through tsx.
const workerScript = () =>
  env().NODE_ENV === "production"
    ? path.join(/* turbopackIgnore: true */ process.cwd(), ".next", "ratecourt", "engine-worker.mjs")
    : path.join(/* turbopackIgnore: true */ process.cwd(), "lib", "runtime", "engine-worker.mjs");

class EnginePool {
  private readonly slots = new Set<Slot>();
  private readonly queue: Pending[] = [];
  private nextId = 1;

  constructor(private readonly size: number) {}

  run<K extends EngineKind>(kind: K, input: EngineInput<K>, deadlineMs: number, spinMs = 0): Promise<EngineOutput<K>> {
    return new Promise((resolve, reject) => {
      const pending: Pending = {
        job: { id: this.nextId++, kind, input, spinMs },
        deadlineMs,
        done: 0,
        timer: setTimeout(() => this.expire(pending), deadlineMs),
        resolve: resolve as (value: unknown) => void,
        reject,
      };
      this.queue.push(pending);
      while (this.slots.size < this.size) this.spawn();
      this.dispatch();
    });
  }

  /** Starts every worker and waits until each has loaded the engine (or failed to). */
  async warm(): Promise<void> {
    while (this.slots.size < this.size) this.spawn();
    await Promise.all([...this.slots].map((slot) => slot.started));
  }

  /** Stops every worker; queued and running jobs fail. */
  async close(): Promise<void> {
    for (const pending of [...this.queue, ...[...this.slots].flatMap((s) => (s.running ? [s.running] : []))]) {
      this.settle(pending, new EngineFailedError("The engine pool was closed."));
    }
    this.queue.length = 0;
    const slots = [...this.slots];
    this.slots.clear();
    await Promise.all(slots.map((slot) => slot.worker.terminate()));
  }

  private spawn(): void {
    const worker = new Worker(/* turbopackIgnore: true */ workerScript());
    const started = new Promise<void>((resolve) => {
      worker.on("message", (message: EngineReply) => "ready" in message && resolve());
      worker.once("exit", () => resolve());
    });
    const slot: Slot = { worker, ready: false, started };
    slot.worker.unref();
    slot.worker.on("message", (message: EngineReply) => this.onMessage(slot, message));
    slot.worker.on("error", (error) => this.onDeath(slot, error));
    slot.worker.on("exit", (code) => this.onDeath(slot, new Error(`the worker stopped (exit code ${code})`)));
    this.slots.add(slot);
  }

  private onMessage(slot: Slot, message: EngineReply): void {
    if ("ready" in message) {
      slot.ready = true;
    } else if (slot.running?.job.id === message.id) {
      const pending = slot.running;
      if ("progress" in message) {
        pending.done = message.progress;
        return;
      }
      slot.running = undefined;
      this.settle(pending, message.ok ? undefined : new EngineFailedError(message.message), message.ok ? message.value : undefined);
    }
    this.dispatch();
  }

  /** A worker that died (or failed to start) is dropped; its job fails and a fresh worker takes its place. */
  private onDeath(slot: Slot, error: Error): void {
    if (!this.slots.delete(slot)) return;
    if (slot.running) this.settle(slot.running, new EngineFailedError(`The bounds engine failed: ${error.message}`));
    if (!slot.ready) {
      // It never started (a broken installation): fail what waits instead of retrying forever.
      for (const pending of this.queue.splice(0)) this.settle(pending, new EngineFailedError(`The bounds engine could not start: ${error.message}`));
      return;
    }
    if (this.queue.length > 0) this.spawn();
  }

  private expire(pending: Pending): void {
    const queued = this.queue.indexOf(pending);
    if (queued >= 0) this.queue.splice(queued, 1);
    const slot = pending.slot;
    if (slot?.running === pending) {
      // The only way to stop a computation that does not return: end its thread, start another.
      this.slots.delete(slot);
      slot.running = undefined;
      void slot.worker.terminate();
      this.spawn();
    }
    this.settle(pending, new EngineDeadlineError(pending.deadlineMs, Boolean(slot), pending.done));
  }

  private settle(pending: Pending, error: Error | undefined, value?: unknown): void {
    clearTimeout(pending.timer);
    if (error) pending.reject(error);
    else pending.resolve(value);
  }

  private dispatch(): void {
    for (const slot of this.slots) {
      if (this.queue.length === 0) return;
      if (!slot.ready || slot.running) continue;
      const pending = this.queue.shift()!;
      pending.slot = slot;
      slot.running = pending;
      slot.worker.postMessage(pending.job);
    }
  }
}

const KEY = Symbol.for("ratecourt.engine-pool");
type Holder = { [KEY]?: EnginePool };

function pool(): EnginePool {
  return ((globalThis as Holder)[KEY] ??= new EnginePool(env().ENGINE_WORKERS));
}

/** Starts the engine's workers now rather than at the first request (tests time the work, not the start). */
export function warmEnginePool(): Promise<void> {
  return pool().warm();
}

/** Runs one engine task in a worker thread within the request deadline (ENGINE_DEADLINE_MS). */
export function runEngine<K extends EngineKind>(kind: K, input: EngineInput<K>): Promise<EngineOutput<K>> {
  const settings = env();
  const spinMs = settings.NODE_ENV === "test" ? (settings.ENGINE_TEST_DELAY_MS ?? 0) : 0;
  return pool().run(kind, input, settings.ENGINE_DEADLINE_MS, spinMs);
}

/** Stops the process's engine workers (tests, benchmarks, scripts). */
export async function closeEnginePool(): Promise<void> {
  const holder = globalThis as Holder;
  const current = holder[KEY];
  holder[KEY] = undefined;
  await current?.close();
}

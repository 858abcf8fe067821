// The engine's worker pool: work off the request thread, a deadline per request, a stuck worker
// terminated and replaced. ENGINE_TEST_DELAY_MS makes each job spin first, like a claim that never ends.
import { afterAll, afterEach, describe, expect, it, vi } from "vitest";
import { evaluateClaim, type ClaimInput } from "@/lib/bounds";
import { closeEnginePool, isEngineDeadline, runEngine, warmEnginePool, type EngineDeadlineError } from "@/lib/runtime/engine-pool";
import { setEnv } from "../support/env";

const claim: ClaimInput = { channel: { model: "bsc", p: 1e-3 }, code: { n: 2048, k: 1640 }, target: { metric: "bler", value: 1e-4 } };
const settle = <T>(promise: Promise<T>) =>
  promise.then(
    (value) => ({ value, error: undefined }),
    (error: unknown) => ({ value: undefined, error }),
  );

/** Whether `work` is still unsettled after this thread's event loop takes a turn: the engine does not hold the thread. */
async function stillRunningAfterATurn(work: Promise<unknown>): Promise<boolean> {
  let settled = false;
  void work.finally(() => (settled = true)).catch(() => undefined);
  await new Promise<void>((resolve) => setImmediate(resolve));
  return !settled;
}

let restore = () => {};
afterEach(async () => {
  restore();
  await closeEnginePool();
});
afterAll(closeEnginePool);

describe("the engine worker pool", () => {
  it("gives in a worker thread exactly what the engine gives on this thread", async () => {
    const [result] = await runEngine("claims", [claim]);
    expect(result).toEqual(JSON.parse(JSON.stringify(evaluateClaim(claim))));
    const charts = await runEngine("charts", { model: "bsc", x: 0.005, n: 2048, k: 1640, target: 1e-4 });
    expect(charts.channel.length).toBeGreaterThan(10);
  });

  it("stops a job past its deadline, keeps the request thread free meanwhile, and serves the next job on a fresh worker", async () => {
    // A worker's first start compiles the engine: warm it with a deadline no loaded machine misses.
    restore = setEnv({ ENGINE_WORKERS: "1", ENGINE_DEADLINE_MS: "120000" });
    await warmEnginePool();
    restore();
    restore = setEnv({ ENGINE_WORKERS: "1", ENGINE_DEADLINE_MS: "1500", ENGINE_TEST_DELAY_MS: "600000" });
    // The deadline runs on a fake clock; the worker spins in real time, as a claim that never ends.
    vi.useFakeTimers({ toFake: ["setTimeout", "clearTimeout"] });
    try {
      const slow = settle(runEngine("claims", [claim]));
      expect(await stillRunningAfterATurn(slow)).toBe(true);
      await vi.advanceTimersByTimeAsync(1499);
      expect(await stillRunningAfterATurn(slow)).toBe(true);
      await vi.advanceTimersByTimeAsync(1);
      const { error } = await slow;
      expect(isEngineDeadline(error)).toBe(true);
      expect(error).toMatchObject({ started: true, done: 0, deadlineMs: 1500 });
    } finally {
      vi.useRealTimers();
    }

    restore();
    // The replacement worker starts cold, like the first one.
    restore = setEnv({ ENGINE_WORKERS: "1", ENGINE_DEADLINE_MS: "120000" });
    const [after] = await runEngine("claims", [claim]);
    expect(after.verdict).toBe(evaluateClaim(claim).verdict);
  });

  it("answers a job that waited behind busy workers past its deadline as not started", async () => {
    restore = setEnv({ ENGINE_WORKERS: "1", ENGINE_DEADLINE_MS: "120000" });
    await warmEnginePool();
    restore();
    restore = setEnv({ ENGINE_WORKERS: "1", ENGINE_DEADLINE_MS: "1500", ENGINE_TEST_DELAY_MS: "600000" });
    const [first, second] = await Promise.all([settle(runEngine("claims", [claim])), settle(runEngine("claims", [claim]))]);
    expect((first.error as EngineDeadlineError).started).toBe(true);
    expect((second.error as EngineDeadlineError).started).toBe(false);
  });

  it("reports an engine error as a failure, not as a deadline", async () => {
    const { error } = await settle(runEngine("claims", [{ channel: { model: "nope" } } as unknown as ClaimInput]));
    expect(error).toBeInstanceOf(Error);
    expect(isEngineDeadline(error)).toBe(false);
    expect((error as Error).name).toBe("EngineFailedError");
  });
});

// One engine worker thread: runs the jobs the pool sends, one at a time. A job that never ends is
// the pool's to stop: it terminates this thread and starts another.
import { parentPort } from "node:worker_threads";
import { engineTasks, type EngineJob, type EngineReply } from "./engine-tasks";

const port = parentPort!;
const reply = (message: EngineReply) => port.postMessage(message);

/** Blocks the thread like a claim that never ends (the tests' stand-in for one). */
function spin(ms: number) {
  const until = performance.now() + ms;
  while (performance.now() < until);
}

port.on("message", (job: EngineJob) => {
  try {
    spin(job.spinMs);
    const task = engineTasks[job.kind] as (input: unknown, progress: (done: number) => void) => unknown;
    const value = task(job.input, (done) => reply({ id: job.id, progress: done }));
    reply({ id: job.id, ok: true, value });
  } catch (error) {
    reply({ id: job.id, ok: false, message: error instanceof Error ? error.message : String(error) });
  }
});

reply({ ready: true });

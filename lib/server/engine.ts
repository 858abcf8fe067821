import "server-only";
import type { ClaimInput } from "@/lib/bounds";
import type { BoundCharts, BoundView } from "@/lib/explorer";
import { isEngineDeadline, runEngine, type EngineDeadlineError } from "@/lib/runtime/engine-pool";
import type { EngineInput, EngineKind, EngineOutput } from "@/lib/runtime/engine-tasks";
import { AppError } from "./errors";

const seconds = (ms: number) => `${ms / 1000} s`;

/** A claim in a few words, so that an error can name it. */
export function describeClaim({ channel, code, target }: ClaimInput): string {
  const db = (label: string, value: number) => `${label} ${value} dB`;
  const soft = (): string => {
    if (channel.model !== "biawgn") return "";
    if (channel.sensitivityDbm !== undefined) return `BI-AWGN, sensitivity ${channel.sensitivityDbm} dBm at ${channel.bitRate} bit/s`;
    if (channel.ebn0Db !== undefined) return `BI-AWGN, ${db("Eb/N0", channel.ebn0Db)}`;
    if (channel.esn0Db !== undefined) return `BI-AWGN, ${db("Es/N0", channel.esn0Db)}`;
    return `BI-AWGN, ${db("net coding gain", channel.ncgDb!)}`;
  };
  const where =
    channel.model === "bec"
      ? `BEC e = ${channel.e}`
      : channel.model === "bsc"
        ? channel.p !== undefined
          ? `BSC p = ${channel.p}`
          : `BSC, ${db("net coding gain", channel.ncgDb!)}`
        : soft();
  const length = code.n !== undefined ? `n = ${code.n}` : null;
  const form =
    code.k !== undefined ? `k = ${code.k}` : code.rate !== undefined ? `rate ${code.rate}` : code.overhead !== undefined ? `overhead ${code.overhead}` : null;
  return `${where}; ${[length, form].filter(Boolean).join(", ")}; ${target.metric.toUpperCase()} ${target.value}`;
}

/** Why the engine gave no answer in time, in words for the person who asked. */
export function unfinishedMessage(error: EngineDeadlineError, what: string): string {
  return error.started
    ? `The bounds engine did not finish ${what} within ${seconds(error.deadlineMs)} and stopped it.`
    : `The bounds engine was busy with other evaluations and could not start ${what} within ${seconds(error.deadlineMs)}.`;
}

/**
 * Runs engine work in the worker pool. Past the deadline it answers 422 (this work itself ran too
 * long: `refusal` says what to do) or 503 (it waited for a busy engine: try again shortly).
 */
export async function inEngine<K extends EngineKind>(
  kind: K,
  input: EngineInput<K>,
  what: (error: EngineDeadlineError) => string,
  refusal: string,
): Promise<EngineOutput<K>> {
  try {
    return await runEngine(kind, input);
  } catch (error) {
    if (!isEngineDeadline(error)) throw error;
    const message = unfinishedMessage(error, what(error));
    if (error.started) throw new AppError(`${message} ${refusal}`, 422);
    throw new AppError(`${message} Try again in a moment.`, 503);
  }
}

/** The Bound explorer's verdict and charts, or what to tell the reader when the engine ran out of time. */
export async function boundCharts(view: BoundView): Promise<{ charts: BoundCharts; refusal?: never } | { charts?: never; refusal: string }> {
  try {
    return { charts: await runEngine("charts", view) };
  } catch (error) {
    if (!isEngineDeadline(error)) throw error;
    const next = error.started ? "Try a shorter block length or another channel value." : "Reload the page in a moment.";
    return { refusal: `${unfinishedMessage(error, "this view")} ${next}` };
  }
}

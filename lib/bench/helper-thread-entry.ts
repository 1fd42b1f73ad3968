// The helper thread's side (see helper-thread.ts): bundled on its own, so it imports only the bench modules it runs.

import { parentPort, type MessagePort } from "node:worker_threads";
import { readClaimedBlocks, type CaptureBlockPlan, type CaptureBlockTally } from "./capture-csv";
import { findZeroCrossings, peakMagnitude } from "./electrical";
import { measureHarmonicWindows, type HarmonicsInput, type HarmonicWindows } from "./harmonics";

/** Work the main thread waits for synchronously: the answer comes on `port`, and `done` is set and notified. */
export type HelperJob =
  | { kind: "harmonic windows"; input: HarmonicsInput; windows: HarmonicWindows }
  | { kind: "peak"; signal: Float64Array }
  | { kind: "crossings"; signal: Float64Array; threshold: number; restSamples: number; after: number };

export type HelperRequest = { kind: "blocks"; id: number; plan: CaptureBlockPlan } | { kind: "job"; job: HelperJob; port: MessagePort; done: Int32Array };

export type HelperReply = { id: number; tallies: CaptureBlockTally[] } | { id: number; error: string };

const messageOf = (error: unknown) => (error instanceof Error ? error.message : String(error));

function answer(job: HelperJob) {
  if (job.kind === "harmonic windows") return measureHarmonicWindows(job.input, job.windows);
  if (job.kind === "peak") return peakMagnitude(job.signal);
  return findZeroCrossings(job.signal, job.threshold, job.restSamples, job.after);
}

parentPort?.on("message", (request: HelperRequest) => {
  if (request.kind === "blocks") {
    readClaimedBlocks(request.plan, "back").then(
      (tallies) => parentPort?.postMessage({ id: request.id, tallies } satisfies HelperReply),
      (error: unknown) => parentPort?.postMessage({ id: request.id, error: messageOf(error) } satisfies HelperReply),
    );
    return;
  }
  const { job } = request;
  try {
    request.port.postMessage({ value: answer(job) });
  } catch (error) {
    request.port.postMessage({ error: messageOf(error) });
  }
  request.port.close();
  Atomics.store(request.done, 0, 1);
  Atomics.notify(request.done, 0);
});

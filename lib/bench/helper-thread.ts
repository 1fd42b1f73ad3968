// A second thread for the bench math on a two-core machine (the CLI and the benchmark start one): it reads blocks
// of a large capture beside the main thread, shares the search for zero crossings, and measures harmonic windows while
// the main thread does the rest. Node 20 cannot load TypeScript in a worker thread without a loader of its own
// (tsx's costs about 34 MB and 0.4 s a thread), so the thread's code is bundled to plain JavaScript by esbuild
// (tsx's own compiler) as the helper starts.

import { fileURLToPath } from "node:url";
import { MessageChannel, receiveMessageOnPort, Worker } from "node:worker_threads";
import { build, stop } from "esbuild";
import type { AnalysisHelper } from "./analysis";
import type { CaptureBlockPlan, CaptureBlockTally } from "./capture-csv";
import type { ZeroCrossings } from "./electrical";
import type { HarmonicsInput, HarmonicWindows } from "./harmonics";
import type { HelperJob, HelperReply, HelperRequest } from "./helper-thread-entry";

/** How long the main thread waits for a job before it gives up on a thread that died. */
const JOB_WAIT_MS = 10 * 60 * 1000;

export interface HelperThread extends AnalysisHelper {
  close(): Promise<void>;
}

/**
 * Starts the helper thread in the background: bundling its code and starting the thread take some 50 ms, which pass
 * while the caller reads the start of the capture. Reading blocks waits for the thread; the jobs come after such a
 * read (only its shared arrays go to the helper), so they find it running.
 */
export function startHelperThread(): HelperThread {
  const starting = connectHelperThread();
  let running: HelperThread | undefined;
  // A failure to start reaches whoever waits for the thread; until then it must not go unhandled.
  starting.then(
    (helper) => {
      running = helper;
    },
    () => undefined,
  );
  const started = () => {
    if (running === undefined) throw new Error("the helper thread is still starting: its jobs follow a read of blocks, which waits for it");
    return running;
  };
  return {
    readBlocks: async (plan) => (await starting).readBlocks(plan),
    startHarmonicWindows: (input, windows) => started().startHarmonicWindows(input, windows),
    startPeak: (signal) => started().startPeak(signal),
    startCrossings: (signal, threshold, restSamples, after) => started().startCrossings(signal, threshold, restSamples, after),
    async close() {
      const helper = await starting.catch(() => undefined);
      await helper?.close();
    },
  };
}

async function connectHelperThread(): Promise<HelperThread> {
  const bundle = await build({
    entryPoints: [fileURLToPath(new URL("./helper-thread-entry.ts", import.meta.url))],
    bundle: true,
    platform: "node",
    format: "cjs",
    target: "node20",
    write: false,
    logLevel: "silent",
  });
  // esbuild's service process would otherwise keep a finished CLI alive.
  await stop();
  const code = bundle.outputFiles[0]?.text;
  if (code === undefined) throw new Error("esbuild produced no code for the helper thread");
  const worker = new Worker(code, { eval: true, execArgv: [] });

  const pending = new Map<number, { resolve: (tallies: CaptureBlockTally[]) => void; reject: (error: Error) => void }>();
  // The helper keeps the process alive only while it owes an answer, so a finished CLI exits.
  const settle = () => {
    if (pending.size === 0) worker.unref();
  };
  const failAll = (error: Error) => {
    for (const { reject } of pending.values()) reject(error);
    pending.clear();
    settle();
  };
  worker.on("message", (reply: HelperReply) => {
    const waiting = pending.get(reply.id);
    if (waiting === undefined) return;
    pending.delete(reply.id);
    settle();
    if ("error" in reply) waiting.reject(new Error(`helper thread: ${reply.error}`));
    else waiting.resolve(reply.tallies);
  });
  worker.on("error", failAll);
  worker.on("exit", (code) => failAll(new Error(`the helper thread stopped (exit code ${code})`)));
  settle();

  let nextId = 0;
  const send = (request: HelperRequest, transfer: Transferable[] = []) => worker.postMessage(request, transfer as never);

  /** Blocking in the function returned keeps analyzeSamples synchronous for every caller; the answer is taken off its port directly. */
  const startJob = <Answer>(job: HelperJob) => {
    const { port1, port2 } = new MessageChannel();
    const done = new Int32Array(new SharedArrayBuffer(Int32Array.BYTES_PER_ELEMENT));
    send({ kind: "job", job, port: port2, done }, [port2]);
    return (): Answer => {
      const waited = Atomics.wait(done, 0, 0, JOB_WAIT_MS);
      const received = receiveMessageOnPort(port1);
      port1.close();
      if (waited === "timed-out" || received === undefined) throw new Error(`the helper thread did not answer (${job.kind})`);
      const answer = received.message as { value: Answer } | { error: string };
      if ("error" in answer) throw new Error(`helper thread: ${answer.error}`);
      return answer.value;
    };
  };

  return {
    readBlocks(plan: CaptureBlockPlan) {
      const id = nextId++;
      return new Promise<CaptureBlockTally[]>((resolve, reject) => {
        pending.set(id, { resolve, reject });
        worker.ref();
        send({ kind: "blocks", id, plan });
      });
    },
    startHarmonicWindows: (input: HarmonicsInput, windows: HarmonicWindows) => startJob<void>({ kind: "harmonic windows", input, windows }),
    startPeak: (signal: Float64Array) => startJob<number>({ kind: "peak", signal }),
    startCrossings: (signal: Float64Array, threshold: number, restSamples: number, after: number) =>
      startJob<ZeroCrossings>({ kind: "crossings", signal, threshold, restSamples, after }),
    async close() {
      failAll(new Error("the helper thread was closed"));
      await worker.terminate();
    },
  };
}

// npm run bench:api: GET /api/tools latency on a running app while the worker analyses a 100 MB capture.
// Generates the capture, uploads it to object storage, queues its analysis on the real job queue, then times a bounded
// number of requests while the job runs. Needs the app (BENCH_API_URL, else APP_ORIGIN), the worker, the database and
// object storage; afterwards it removes the capture it made. The demo run of the first lab carries the capture.
import { randomUUID } from "node:crypto";
import { parseArgs } from "node:util";
import { eq } from "drizzle-orm";
import { closeDatabase, db } from "@/db";
import { getRunForAnalysis, insertAnalysis, insertCapture } from "@/db/queries/captures";
import { listRunInstruments } from "@/db/queries/runs";
import { analyses, captures, testRuns } from "@/db/schema";
import { demoRuns } from "@/db/seeds/bench-runs-data";
import { accuracyChoices, buildWaveformOptions, defaultAccuracyChoice } from "@/lib/analysis-options";
import { captureObjectKey } from "@/lib/capture-uploads";
import { enqueueAnalysis } from "@/lib/jobs";
import { deleteObject, putObject } from "@/lib/object-storage";
import { burstFiredCaptureBlocks } from "@/lib/synthetic-captures";

const { values: flags } = parseArgs({
  options: {
    requests: { type: "string", default: "300" },
    megabytes: { type: "string", default: "100" },
    keep: { type: "boolean", default: false },
  },
});
const requestCount = Number(flags.requests);
const targetBytes = Number(flags.megabytes) * 1024 * 1024;
const appUrl = (process.env.BENCH_API_URL ?? process.env.APP_ORIGIN ?? "http://localhost:3000").replace(/\/$/, "");
const TARGET_P95_MS = 200;

function percentile(sorted: number[], share: number): number {
  return sorted[Math.min(sorted.length - 1, Math.ceil(share * sorted.length) - 1)] ?? Number.NaN;
}

async function analysisStatus(id: string) {
  const [row] = await db.select({ status: analyses.status, startedAt: analyses.startedAt, finishedAt: analyses.finishedAt, error: analyses.error }).from(analyses).where(eq(analyses.id, id));
  return row ?? null;
}

async function waitFor(id: string, done: (status: string) => boolean, timeoutMs: number) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const row = await analysisStatus(id);
    if (row && done(row.status)) return row;
    if (Date.now() > deadline) return null;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

async function main(): Promise<number> {
  const demo = demoRuns[0]!;
  const [run] = await db.select({ id: testRuns.id, reviewerId: testRuns.reviewerId }).from(testRuns).where(eq(testRuns.id, demo.id));
  if (!run) throw new Error(`the demo run ${demo.id} is missing: seed the database first (npm run db:seed)`);
  const probe = await fetch(`${appUrl}/api/tools?perPage=5`).catch((error: unknown) => error as Error);
  if (probe instanceof Error || !probe.ok) throw new Error(`no app answering GET ${appUrl}/api/tools: start it, or set BENCH_API_URL`);

  const waveform = demo.captures.find((capture) => capture.kind === "waveform");
  if (waveform?.kind !== "waveform") throw new Error("the demo run has no waveform capture to copy the set-up of");
  // About 27 bytes a row: enough seconds at 20 kS/s to reach the requested size.
  const heater = { ...waveform.heater, sampleRateHz: 20_000, seconds: Math.ceil(targetBytes / 27 / 20_000) };
  const started = performance.now();
  const blocks: Buffer[] = [];
  let size = 0;
  for (const block of burstFiredCaptureBlocks(heater, waveform.layout)) {
    const bytes = Buffer.from(block, "utf8");
    blocks.push(bytes);
    size += bytes.length;
    if (size >= targetBytes) break;
  }
  const body = Buffer.concat(blocks);
  console.log(`bench:api: generated a ${(body.length / 1024 / 1024).toFixed(1)} MB capture in ${Math.round(performance.now() - started)} ms`);

  const captureId = randomUUID();
  const objectKey = captureObjectKey({ runId: run.id, captureId, fileName: "bench-api-100mb.csv" });
  await putObject(objectKey, body, "text/csv");
  const [runContext, instruments] = await Promise.all([getRunForAnalysis({ runId: run.id }), listRunInstruments({ runId: run.id })]);
  const built = buildWaveformOptions({
    mapping: {
      ...waveform.mapping,
      captureId,
      currentAccuracy: defaultAccuracyChoice(accuracyChoices(instruments, "current"), runContext!.tool.ratedPowerW / runContext!.conditions.supplyVoltage),
      voltageAccuracy: defaultAccuracyChoice(accuracyChoices(instruments, "voltage"), runContext!.conditions.supplyVoltage),
    },
    conditions: runContext!.conditions,
    tool: runContext!.tool,
    instruments,
  });
  if (!built.ok) throw new Error(JSON.stringify(built.fieldErrors));
  const analysis = await db.transaction(async (tx) => {
    await insertCapture(tx, { id: captureId, runId: run.id, kind: "waveform", objectKey, fileName: "bench-api-100mb.csv", declaredBytes: body.length, createdById: run.reviewerId });
    await tx.update(captures).set({ status: "uploaded", uploadedAt: new Date() }).where(eq(captures.id, captureId));
    return insertAnalysis(tx, { captureId, options: built.options, instrumentSnapshots: built.instrumentSnapshots, requestedById: run.reviewerId });
  });
  await enqueueAnalysis({ analysisId: analysis.id });

  try {
    if (!(await waitFor(analysis.id, (status) => status !== "queued", 30_000))) {
      throw new Error("the analysis was not picked up within 30 s: is the worker running (npm run worker)?");
    }
    const latencies: number[] = [];
    let duringAnalysis = 0;
    for (let i = 0; i < requestCount; i++) {
      const running = (await analysisStatus(analysis.id))?.status === "running";
      const sent = performance.now();
      const response = await fetch(`${appUrl}/api/tools?page=1&perPage=24`);
      await response.arrayBuffer();
      const elapsed = performance.now() - sent;
      if (!response.ok) throw new Error(`GET /api/tools answered ${response.status}`);
      latencies.push(elapsed);
      if (running) duringAnalysis++;
    }
    const finished = await waitFor(analysis.id, (status) => status === "done" || status === "failed", 10 * 60_000);
    const sorted = [...latencies].sort((a, b) => a - b);
    const p95 = percentile(sorted, 0.95);
    const ms = (value: number) => `${value.toFixed(1)} ms`;
    console.log(`bench:api: GET ${appUrl}/api/tools, ${requestCount} requests one after another, ${duringAnalysis} of them while the analysis was running`);
    console.log(`bench:api: p50 ${ms(percentile(sorted, 0.5))}  p95 ${ms(p95)}  max ${ms(sorted[sorted.length - 1]!)}`);
    if (finished?.startedAt && finished.finishedAt) {
      const seconds = (finished.finishedAt.getTime() - finished.startedAt.getTime()) / 1000;
      console.log(`bench:api: the analysis ended ${finished.status} after ${seconds.toFixed(1)} s${finished.error ? `: ${finished.error.message}` : ""}`);
    }
    const met = p95 < TARGET_P95_MS && duringAnalysis > 0;
    console.log(`bench:api: target p95 < ${TARGET_P95_MS} ms during an analysis: ${met ? "met" : duringAnalysis === 0 ? "not measured (the analysis ended first)" : "MISSED"}`);
    return met ? 0 : 1;
  } finally {
    if (!flags.keep) {
      await db.delete(captures).where(eq(captures.id, captureId));
      await deleteObject(objectKey);
    }
  }
}

try {
  process.exitCode = await main();
} catch (error) {
  console.error(`bench:api: ${error instanceof Error ? error.message : String(error)}`);
  process.exitCode = 1;
} finally {
  await closeDatabase();
  // The job queue's sender keeps a pool open; the figures are printed, so leave without waiting for it.
  process.exit();
}

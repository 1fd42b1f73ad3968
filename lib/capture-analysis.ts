import "server-only";
import { z } from "zod";
import { db, type Transaction } from "@/db";
import { claimAnalysis, completeAnalysis, failAnalysis } from "@/db/queries/captures";
import { insertMeasurements } from "@/db/queries/runs";
import type { DisplaySeries } from "@/db/schema";
import type { StoredAnalysisOptions } from "@/lib/analysis-options";
import { analyzeSamples, readCaptureForAnalysis } from "@/lib/bench/analysis";
import { CaptureError, readCapture, type CaptureData } from "@/lib/bench/capture-csv";
import { halfCycleSeries, thinSeries, waveformEnvelope } from "@/lib/bench/display-series";
import type { AnalyseCaptureJob } from "@/lib/jobs";
import { getObjectStream } from "@/lib/object-storage";
import { analyzeHeatUpLog, measurementsFromHeatUp, measurementsFromWaveform, type MeasurementDraft } from "@/lib/run-measurements";

/** The object's bytes chunk by chunk; the download is cancelled if the reader stops early (a rejected capture). */
async function* storedChunks(objectKey: string): AsyncGenerator<Uint8Array> {
  const stream = await getObjectStream(objectKey);
  if (stream === null) throw new CaptureError("the uploaded file is missing from storage; upload the capture again", null);
  const reader = stream.getReader();
  let finished = false;
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) {
        finished = true;
        return;
      }
      yield value;
    }
  } finally {
    if (!finished) await reader.cancel().catch(() => undefined);
    reader.releaseLock();
  }
}

export type AnalysisOutcome = { analysisVersion: string; result: object; displaySeries: DisplaySeries; drafts: MeasurementDraft[] };

async function analyseWaveform(
  options: Extract<StoredAnalysisOptions, { kind: "waveform" }>,
  data: CaptureData,
  sizeBytes: number,
): Promise<AnalysisOutcome> {
  // analyzeCapture split in its two halves, so the samples read once also feed the charts: the stored result is
  // still the CLI's object for the same file.
  const samples = await readCaptureForAnalysis({ data, sizeBytes }, options.analysis);
  const result = analyzeSamples(samples, options.analysis);
  const current = samples.current as Float64Array;
  return {
    analysisVersion: result.analysisVersion,
    result,
    displaySeries: {
      waveform: waveformEnvelope({ current, voltage: samples.voltage, sampleRateHz: samples.sampleRateHz }),
      halfCycles: halfCycleSeries({ current, voltage: samples.voltage, sampleRateHz: samples.sampleRateHz, nominalHz: result.nominalFrequencyHz }),
    },
    drafts: measurementsFromWaveform(result, options.analysis),
  };
}

async function analyseHeatUpLog(
  options: Extract<StoredAnalysisOptions, { kind: "heat_up_log" }>,
  data: CaptureData,
  sizeBytes: number,
): Promise<AnalysisOutcome> {
  const { heatUp } = options;
  const capture = await readCapture(data, {
    current: null,
    voltage: null,
    temperature: heatUp.temperature,
    time: heatUp.time,
    sampleIntervalSeconds: heatUp.sampleIntervalSeconds,
    sizeHintBytes: sizeBytes,
  });
  const result = analyzeHeatUpLog(capture, heatUp);
  const temperature = capture.temperature as Float64Array;
  return {
    analysisVersion: result.analysisVersion,
    result,
    displaySeries: {
      heatUp: {
        timeS: thinSeries(Array.from(temperature, (_, k) => k / capture.sampleRateHz)),
        temperatureC: thinSeries(temperature),
        setpointC: heatUp.setpointC,
      },
    },
    drafts: measurementsFromHeatUp(result),
  };
}

/** What a reviewer is shown when an analysis fails: the problem and, for a bad capture, the line at fault. */
export function describeAnalysisFailure(error: unknown): { message: string; line: number | null } {
  if (error instanceof CaptureError) return { message: error.problem, line: error.line };
  if (error instanceof z.ZodError) return { message: error.issues.map((issue) => `${issue.path.join(".")}: ${issue.message}`).join("; "), line: null };
  return { message: error instanceof Error ? error.message : String(error), line: null };
}

/** Reads the stored capture and analyses it under the options; a capture the analysis rejects throws. */
export async function analyseStoredCapture({
  options,
  objectKey,
  sizeBytes,
}: {
  options: StoredAnalysisOptions;
  objectKey: string;
  sizeBytes: number;
}): Promise<AnalysisOutcome> {
  const data = storedChunks(objectKey);
  return options.kind === "waveform" ? analyseWaveform(options, data, sizeBytes) : analyseHeatUpLog(options, data, sizeBytes);
}

/**
 * The result, the chart series and the run's measurements, written together in the caller's transaction. Only a
 * running analysis takes a result: false means another worker finished it first, and nothing was written.
 */
export async function storeAnalysisOutcome(tx: Transaction, { analysisId, runId, outcome }: { analysisId: string; runId: string; outcome: AnalysisOutcome }) {
  const stored = await completeAnalysis(tx, { id: analysisId, ...outcome });
  if (!stored) return false;
  await insertMeasurements(tx, { runId, source: { analysisId }, drafts: outcome.drafts });
  return true;
}

/**
 * The worker's job: analyse one capture under one analysis row's options and store the outcome in one transaction.
 * A capture the analysis rejects ends as a failed row with the message and line; only a failure to record either
 * outcome is thrown, so the queue retries the job.
 */
export async function runCaptureAnalysis({ analysisId }: AnalyseCaptureJob): Promise<"done" | "failed" | "skipped"> {
  const claimed = await claimAnalysis({ id: analysisId });
  if (claimed === null) return "skipped";
  const { options, capture } = claimed;
  let outcome: AnalysisOutcome;
  try {
    if (capture.status !== "uploaded") throw new CaptureError("the capture's upload was never completed", null);
    outcome = await analyseStoredCapture({ options, objectKey: capture.objectKey, sizeBytes: capture.declaredBytes });
  } catch (error) {
    await failAnalysis({ id: analysisId, error: describeAnalysisFailure(error) });
    return "failed";
  }
  const stored = await db.transaction((tx) => storeAnalysisOutcome(tx, { analysisId, runId: capture.runId, outcome }));
  return stored ? "done" : "skipped";
}

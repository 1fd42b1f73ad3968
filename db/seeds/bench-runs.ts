import { desc, eq, inArray } from "drizzle-orm";
import type { Transaction } from "@/db";
import { insertMeasurements, replaceRunInstruments, snapshotInstruments, toolRatingColumns } from "@/db/queries/runs";
import { analyses, captures, instruments, labs, manualReadings, protocols, protocolVersions, testRuns, tools, users } from "@/db/schema";
import {
  accuracyChoices,
  buildHeatUpOptions,
  buildWaveformOptions,
  defaultAccuracyChoice,
  type RunInstrument,
} from "@/lib/analysis-options";
import { mean } from "@/lib/bench/statistics";
import { analyseStoredCapture, storeAnalysisOutcome } from "@/lib/capture-analysis";
import { captureObjectKey } from "@/lib/capture-uploads";
import { measurementKindInfo } from "@/lib/measurement-kinds";
import { putObject } from "@/lib/object-storage";
import { accuracyForReading, manualReadingFigures } from "@/lib/run-measurements";
import { burstFiredCaptureBlocks, captureText, heatUpLogBlocks } from "@/lib/synthetic-captures";
import { demoRuns, type DemoRun } from "./bench-runs-data";

const day = 24 * 60 * 60 * 1000;

async function single<T>(rows: Promise<T[]>, missing: string): Promise<T> {
  const [row] = await rows;
  if (!row) throw new Error(`${missing}: run the earlier seeders first`);
  return row;
}

/** One demo run with its readings, captures and analyses; upserts by the run's fixed ids. */
export async function seedRun(tx: Transaction, demo: DemoRun, now: Date, storageReachable: { value: boolean }) {
  const lab = await single(tx.select({ id: labs.id }).from(labs).where(eq(labs.slug, demo.labSlug)), `lab ${demo.labSlug} missing`);
  const reviewer = await single(tx.select({ id: users.id }).from(users).where(eq(users.email, demo.reviewerEmail)), `${demo.reviewerEmail} missing`);
  const tool = await single(
    tx
      .select({ id: tools.id, ...toolRatingColumns })
      .from(tools)
      .where(eq(tools.slug, demo.toolSlug)),
    `tool ${demo.toolSlug} missing`,
  );
  const version = await single(
    tx
      .select({ id: protocolVersions.id, conditions: protocolVersions.conditions, tolerances: protocolVersions.tolerances })
      .from(protocolVersions)
      .innerJoin(protocols, eq(protocols.id, protocolVersions.protocolId))
      .where(eq(protocols.slug, demo.protocolSlug))
      .orderBy(desc(protocolVersions.version))
      .limit(1),
    `protocol ${demo.protocolSlug} missing`,
  );
  const instrumentRows = await tx
    .select({ id: instruments.id, serialNumber: instruments.serialNumber })
    .from(instruments)
    .where(inArray(instruments.serialNumber, demo.instrumentSerials));
  if (instrumentRows.length !== demo.instrumentSerials.length) throw new Error(`instruments of run ${demo.id} missing: run the workspace catalogue seeder first`);
  const instrumentIdBySerial = new Map(instrumentRows.map((row) => [row.serialNumber, row.id]));

  const conditions = { ...version.conditions, ...demo.conditionOverrides };
  const fields = {
    toolId: tool.id,
    protocolVersionId: version.id,
    labId: lab.id,
    reviewerId: reviewer.id,
    testedOn: new Date(now.getTime() - demo.testedDaysAgo * day).toISOString().slice(0, 10),
    unit: demo.unit,
    conditions,
    notes: demo.notes,
  };
  await tx.insert(testRuns).values({ id: demo.id, ...fields }).onConflictDoUpdate({ target: testRuns.id, set: fields });
  const runInstruments: RunInstrument[] = await snapshotInstruments(tx, { ids: instrumentRows.map((row) => row.id) });
  await replaceRunInstruments(tx, { runId: demo.id, snapshots: runInstruments });

  let readingsAdded = 0;
  for (const reading of demo.readings) {
    const instrumentId = reading.instrumentSerial ? (instrumentIdBySerial.get(reading.instrumentSerial) ?? null) : null;
    const unit = measurementKindInfo[reading.kind].unit;
    const [added] = await tx
      .insert(manualReadings)
      .values({ id: reading.id, runId: demo.id, kind: reading.kind, values: reading.values, unit, instrumentId, note: reading.note })
      .onConflictDoNothing()
      .returning({ id: manualReadings.id });
    if (!added) continue;
    const snapshot = runInstruments.find((entry) => entry.instrumentId === instrumentId)?.snapshot;
    const figures = manualReadingFigures({
      kind: reading.kind,
      values: reading.values,
      accuracy: snapshot ? accuracyForReading(snapshot.accuracy, unit, mean(reading.values)) : null,
      rule: "simple",
      ratings: { ...tool, temperatureSetpointC: conditions.temperatureSetpointC, tolerances: version.tolerances },
    });
    await insertMeasurements(tx, {
      runId: demo.id,
      source: { manualReadingId: added.id },
      drafts: [{ kind: reading.kind, value: figures.spread.mean, unit, expandedUncertainty: figures.uncertainty.expanded, verdict: figures.verdict }],
    });
    readingsAdded++;
  }

  let analysed = 0;
  for (const capture of demo.captures) {
    const [existing] = await tx.select({ status: analyses.status }).from(analyses).where(eq(analyses.id, capture.analysisId));
    if (existing?.status === "done" || !storageReachable.value) continue;
    const text =
      capture.kind === "waveform" ? captureText(burstFiredCaptureBlocks(capture.heater, capture.layout)) : captureText(heatUpLogBlocks(capture.heatUp, capture.layout));
    const objectKey = captureObjectKey({ runId: demo.id, captureId: capture.id, fileName: capture.fileName });
    try {
      await putObject(objectKey, text, "text/csv");
    } catch (error) {
      storageReachable.value = false;
      console.log(`  captures skipped: object storage is not reachable (${(error as Error).message}); start the fakes and seed again`);
      continue;
    }
    const declaredBytes = Buffer.byteLength(text);
    await tx
      .insert(captures)
      .values({ id: capture.id, runId: demo.id, kind: capture.kind, objectKey, fileName: capture.fileName, declaredBytes, status: "uploaded", uploadedAt: now, createdById: reviewer.id })
      .onConflictDoUpdate({ target: captures.id, set: { objectKey, declaredBytes, status: "uploaded" } });

    const built =
      capture.kind === "waveform"
        ? buildWaveformOptions({
            mapping: {
              ...capture.mapping,
              captureId: capture.id,
              currentAccuracy: defaultAccuracyChoice(accuracyChoices(runInstruments, "current"), tool.ratedPowerW / conditions.supplyVoltage),
              voltageAccuracy: defaultAccuracyChoice(accuracyChoices(runInstruments, "voltage"), conditions.supplyVoltage),
            },
            conditions,
            tool,
            instruments: runInstruments,
          })
        : buildHeatUpOptions({
            mapping: {
              ...capture.mapping,
              captureId: capture.id,
              temperatureAccuracy: defaultAccuracyChoice(accuracyChoices(runInstruments, "temperature"), capture.mapping.setpointC),
            },
            tool,
            tolerances: version.tolerances,
            instruments: runInstruments,
          });
    if (!built.ok) throw new Error(`demo capture ${capture.fileName}: ${JSON.stringify(built.fieldErrors)}`);
    // The analysis runs here, through the worker's own code, so the demo has figures without waiting for the worker.
    // A demo analysis that is not done is left from a failed seed: it is replaced, never a finished one.
    await tx.delete(analyses).where(eq(analyses.id, capture.analysisId));
    await tx.insert(analyses).values({
      id: capture.analysisId,
      captureId: capture.id,
      options: built.options,
      instrumentSnapshots: built.instrumentSnapshots,
      status: "running",
      startedAt: now,
      requestedById: reviewer.id,
    });
    const outcome = await analyseStoredCapture({ options: built.options, objectKey, sizeBytes: declaredBytes });
    await storeAnalysisOutcome(tx, { analysisId: capture.analysisId, runId: demo.id, outcome });
    analysed++;
  }
  return { readingsAdded, analysed };
}

/** A run per demo lab with readings, generated captures in object storage and their analyses. */
export async function seedBenchRuns(tx: Transaction) {
  const now = new Date();
  const storageReachable = { value: true };
  let readings = 0;
  let analysed = 0;
  for (const demo of demoRuns) {
    const seeded = await seedRun(tx, demo, now, storageReachable);
    readings += seeded.readingsAdded;
    analysed += seeded.analysed;
  }
  return `${demoRuns.length} runs, ${readings} readings added, ${analysed} captures analysed${storageReachable.value ? "" : " (object storage not reachable: captures skipped)"}`;
}

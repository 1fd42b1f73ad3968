import { randomUUID } from "node:crypto";
import { readFile } from "node:fs/promises";
import path from "node:path";
import { db } from "@/db";
import { analyses, captures, labs, makers, protocols, protocolVersions, testRuns, tools } from "@/db/schema";
import type { StoredAnalysisOptions } from "@/lib/analysis-options";
import { runCaptureAnalysis } from "@/lib/capture-analysis";
import { putObject } from "@/lib/object-storage";

// A tool on the bench with a finished waveform analysis, made through the worker's own job function on a fixture
// capture, so reports are tested against analyses shaped exactly as the app stores them.

const fixture = path.join(import.meta.dirname, "../fixtures/captures/orrery-orm42-hot-air.csv");

export async function createTool() {
  const suffix = randomUUID().slice(0, 8);
  const [maker] = await db.insert(makers).values({ slug: `test-maker-${suffix}`, name: `Testmaker ${suffix}`, country: "Nowhere" }).returning({ id: makers.id });
  const [tool] = await db
    .insert(tools)
    .values({
      slug: `test-tool-${suffix}`,
      makerId: maker!.id,
      model: `HA-${suffix}`,
      category: "hot_air_station",
      ratedPowerW: 600,
      ratedVoltageMin: 230,
      ratedVoltageMax: 230,
      ratedFrequenciesHz: [50],
      claimedHeatUpSeconds: 30,
    })
    .returning({ id: tools.id, slug: tools.slug });
  return { ...tool!, name: `Testmaker ${suffix} HA-${suffix}` };
}

export async function createRun({ reviewerId, toolId }: { reviewerId: string; toolId: string }) {
  const suffix = randomUUID().slice(0, 8);
  const [lab] = await db
    .insert(labs)
    .values({ slug: `test-lab-${suffix}`, name: `Test bench ${suffix}`, city: "Testford", nominalVoltage: 230, frequencyHz: 50 })
    .returning({ id: labs.id });
  const [protocol] = await db.insert(protocols).values({ slug: `test-protocol-${suffix}`, name: "Test protocol" }).returning({ id: protocols.id });
  const conditions = {
    supplyVoltage: 230,
    supplyFrequencyHz: 50,
    ambientC: 22,
    nozzle: null,
    airflowSetpoint: null,
    temperatureSetpointC: 350,
    measuringDistanceMm: null,
    warmUpMinutes: 5,
  };
  const [version] = await db
    .insert(protocolVersions)
    .values({ protocolId: protocol!.id, version: 1, summary: "Test", conditions, requiredMeasurements: ["power_input_full_demand"], repeats: 1, stepsMdx: "1. Measure.", safetyCautions: "Isolate." })
    .returning({ id: protocolVersions.id });
  const [run] = await db
    .insert(testRuns)
    .values({
      toolId,
      protocolVersionId: version!.id,
      labId: lab!.id,
      reviewerId,
      testedOn: "2026-05-04",
      unit: { serialNumber: `SN-${suffix}`, firmware: null, voltageVariant: "230 V", source: "loaned", sourceNote: "returned after testing" },
      conditions: { ...conditions, measuredSupplyVoltage: 229.4 },
    })
    .returning({ id: testRuns.id });
  return run!;
}

/** Uploads the fixture capture for the run and analyses it with the worker's job function; returns the analysis id. */
export async function analyseFixtureCapture({ runId, captureId }: { runId: string; captureId?: string }) {
  let id = captureId;
  if (!id) {
    const bytes = await readFile(fixture);
    const objectKey = `captures/${runId}/${randomUUID()}.csv`;
    await putObject(objectKey, bytes, "text/csv");
    const [capture] = await db
      .insert(captures)
      .values({ runId, kind: "waveform", objectKey, fileName: "orrery-orm42-hot-air.csv", declaredBytes: bytes.length, status: "uploaded", uploadedAt: new Date() })
      .returning({ id: captures.id });
    id = capture!.id;
  }
  const options: StoredAnalysisOptions = {
    kind: "waveform",
    mapping: {} as Extract<StoredAnalysisOptions, { kind: "waveform" }>["mapping"],
    analysis: {
      current: { column: "CH1", scale: 10 },
      voltage: { column: "CH2", scale: 1 },
      nominalVoltage: 230,
      nominalFrequencyHz: 50,
      rating: { ratedPowerW: 600, ratedVoltage: 230, appliance: "heating", currentAccuracy: "1.5%+0.05", voltageAccuracy: "0.5%+0.2", rule: "guarded" },
    },
  };
  const [analysis] = await db.insert(analyses).values({ captureId: id, options, instrumentSnapshots: [] }).returning({ id: analyses.id });
  const outcome = await runCaptureAnalysis({ analysisId: analysis!.id });
  if (outcome !== "done") throw new Error(`fixture analysis ${outcome}`);
  return { analysisId: analysis!.id, captureId: id };
}

import { randomUUID } from "node:crypto";
import { readFile } from "node:fs/promises";
import path from "node:path";
import { ListObjectsV2Command } from "@aws-sdk/client-s3";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import {
  addManualReading,
  createRun,
  deleteManualReading,
  startHeatUpAnalysis,
  startWaveformAnalysis,
  updateRun,
} from "@/app/(workspace)/workspace/runs/actions";
import { GET as getAnalysisStatus } from "@/app/api/analyses/[id]/route";
import { POST as confirmUpload } from "@/app/api/captures/[id]/uploaded/route";
import { POST as startUpload } from "@/app/api/captures/route";
import { db } from "@/db";
import { listCalibrationWarnings } from "@/db/queries/runs";
import {
  analyses,
  captures,
  instruments,
  labMembers,
  labs,
  makers,
  manualReadings,
  measurements,
  protocols,
  protocolVersions,
  runInstruments,
  testRuns,
  tools,
  type AccuracyRange,
} from "@/db/schema";
import { idleActionState } from "@/lib/action-state";
import type { StoredAnalysisOptions } from "@/lib/analysis-options";
import { analyzeCapture } from "@/lib/bench/analysis";
import { runCaptureAnalysis } from "@/lib/capture-analysis";
import { captureObjectKey, cleanUpAbandonedUploads } from "@/lib/capture-uploads";
import { enqueueAnalysis } from "@/lib/jobs";
import { getObjectStorageClient, objectStorageBucket, putObject, statObject } from "@/lib/object-storage";
import { captureText, heatUpLogBlocks } from "@/lib/synthetic-captures";
import { form, redirectOf, type ServerAction } from "../support/actions";
import { createAccount } from "../support/factories";
import { actAs } from "../support/session-mock";

vi.mock("@/lib/auth", async () => (await import("../support/session-mock")).authMock);
vi.mock("next/cache", () => ({ revalidatePath: vi.fn(), revalidateTag: vi.fn() }));
// The worker is not running here: jobs are recorded, and the tests run the job function themselves.
vi.mock("@/lib/jobs", () => ({ enqueueAnalysis: vi.fn(async () => undefined) }));

type Account = Awaited<ReturnType<typeof createAccount>>;

const fixture = path.join(import.meta.dirname, "../fixtures/captures/orrery-orm42-hot-air.csv");

function jsonRequest(url: string, body: unknown): Request {
  return new Request(`http://localhost${url}`, { method: "POST", headers: { "Content-Type": "application/json" }, body: JSON.stringify(body) });
}

const routeContext = <T extends Record<string, string>>(params: T) => ({ params: Promise.resolve(params) });

const accuracy = (quantity: AccuracyRange["quantity"], unit: string, rangeMax: number, percentOfReading: number, offset: number): AccuracyRange => ({
  quantity,
  unit,
  rangeMax,
  percentOfReading,
  offset,
});

let reviewer: Account;
let otherReviewer: Account;
let editor: Account;
let reader: Account;
const bench = { labId: "", toolId: "", protocolVersionId: "", clampId: "", scopeId: "", thermometerId: "", overdueAnemometerId: "" };

beforeAll(async () => {
  [reviewer, otherReviewer, editor, reader] = await Promise.all([
    createAccount({ role: "reviewer" }),
    createAccount({ role: "reviewer" }),
    createAccount({ role: "editor" }),
    createAccount({ role: "reader" }),
  ]);
  const tag = randomUUID().slice(0, 8);
  const [lab] = await db.insert(labs).values({ slug: `runs-lab-${tag}`, name: `Runs lab ${tag}`, city: "Testford", nominalVoltage: 230, frequencyHz: 50 }).returning();
  await db.insert(labMembers).values([reviewer, otherReviewer].map((account) => ({ labId: lab!.id, userId: account.id })));
  const [maker] = await db.insert(makers).values({ slug: `runs-maker-${tag}`, name: `Runsmaker ${tag}`, country: "Nowhere" }).returning();
  const [tool] = await db
    .insert(tools)
    .values({
      slug: `runs-tool-${tag}`,
      makerId: maker!.id,
      model: "HX-700",
      category: "hot_air_station",
      ratedPowerW: 720,
      ratedVoltageMin: 230,
      ratedVoltageMax: 230,
      ratedFrequenciesHz: [50],
      ratedAirflowLpm: 120,
      claimedHeatUpSeconds: 25,
    })
    .returning();
  const [protocol] = await db.insert(protocols).values({ slug: `runs-protocol-${tag}`, name: `Runs protocol ${tag}` }).returning();
  const [version] = await db
    .insert(protocolVersions)
    .values({
      protocolId: protocol!.id,
      version: 1,
      summary: "For the run tests.",
      conditions: { supplyVoltage: 230, supplyFrequencyHz: 50, ambientC: 23, nozzle: "6 mm", airflowSetpoint: "max", temperatureSetpointC: 350, measuringDistanceMm: 5, warmUpMinutes: 5 },
      requiredMeasurements: ["power_input_full_demand", "airflow"],
      repeats: 3,
      tolerances: {
        airflow: { kind: "percent", plus: 10, minus: 10, source: "test protocol" },
        heat_up_time: { kind: "percent", plus: 20, minus: 100, source: "test protocol" },
        temperature_vs_setpoint: { kind: "absolute", plus: 15, minus: 15, source: "test protocol" },
      },
      stepsMdx: "1. Measure.",
      safetyCautions: "Isolate the supply.",
    })
    .returning();
  const instrument = (kind: "current_clamp" | "oscilloscope" | "thermocouple_meter" | "anemometer", ranges: AccuracyRange[], due = "2099-01-01") => ({
    labId: lab!.id,
    kind,
    maker: "Testbench Meters",
    model: `${kind} ${tag}`,
    serialNumber: `${kind}-${randomUUID().slice(0, 8)}`,
    accuracy: ranges,
    calibratedOn: "2020-01-01",
    calibrationDueOn: due,
  });
  const [clamp, scope, thermometer, anemometer] = await db
    .insert(instruments)
    .values([
      instrument("current_clamp", [accuracy("current", "A", 4, 2, 0.01), accuracy("current", "A", 40, 1.5, 0.05)]),
      instrument("oscilloscope", [accuracy("voltage", "V", 400, 1.5, 0.5)]),
      instrument("thermocouple_meter", [accuracy("temperature", "°C", 1000, 0.5, 1)]),
      instrument("anemometer", [accuracy("air_velocity", "m/s", 30, 3, 0.1)], "2021-01-01"),
    ])
    .returning({ id: instruments.id });
  Object.assign(bench, {
    labId: lab!.id,
    toolId: tool!.id,
    protocolVersionId: version!.id,
    clampId: clamp!.id,
    scopeId: scope!.id,
    thermometerId: thermometer!.id,
    overdueAnemometerId: anemometer!.id,
  });
});

beforeEach(() => vi.mocked(enqueueAnalysis).mockClear());
afterAll(() => actAs(null));

function runFields(overrides: Record<string, string> = {}): Record<string, string> {
  return {
    labId: bench.labId,
    toolId: bench.toolId,
    protocolVersionId: bench.protocolVersionId,
    testedOn: "2025-06-02",
    unitSerialNumber: "HX700-0001",
    unitVoltageVariant: "230 V EU",
    unitSource: "bought",
    supplyVoltage: "230",
    supplyFrequencyHz: "50",
    ambientC: "23",
    temperatureSetpointC: "350",
    warmUpMinutes: "5",
    [`instrumentIds.${bench.clampId}`]: bench.clampId,
    [`instrumentIds.${bench.scopeId}`]: bench.scopeId,
    [`instrumentIds.${bench.thermometerId}`]: bench.thermometerId,
    [`instrumentIds.${bench.overdueAnemometerId}`]: bench.overdueAnemometerId,
    ...overrides,
  };
}

async function newRun(account: Account, overrides: Record<string, string> = {}): Promise<string> {
  actAs(account);
  const location = await redirectOf(createRun, form(runFields(overrides)));
  const id = /^\/workspace\/runs\/([0-9a-f-]{36})$/.exec(location)?.[1];
  if (!id) throw new Error(`unexpected redirect ${location}`);
  return id;
}

/** A capture already in storage and confirmed, as the upload handlers leave it. */
async function storedCapture(runId: string, body: string | Buffer, kind: "waveform" | "heat_up_log" = "waveform", fileName = "capture.csv") {
  const id = randomUUID();
  const objectKey = captureObjectKey({ runId, captureId: id, fileName });
  await putObject(objectKey, body, "text/csv");
  await db.insert(captures).values({ id, runId, kind, objectKey, fileName, declaredBytes: Buffer.byteLength(body), status: "uploaded", uploadedAt: new Date() });
  return { id, objectKey };
}

const orreryMapping = (captureId: string, overrides: Record<string, string> = {}) => ({
  captureId,
  currentColumn: "CH1",
  currentScale: "10",
  voltageColumn: "CH2",
  voltageScale: "1",
  timeColumn: "TIME",
  harmonicClass: "A",
  dmaxLimitPercent: "4",
  currentAccuracy: `${bench.clampId}:0`,
  voltageAccuracy: `${bench.scopeId}:0`,
  rule: "simple",
  ...overrides,
});

async function requestAnalysis(account: Account, action: ServerAction, fields: Record<string, string>): Promise<string> {
  actAs(account);
  const location = await redirectOf(action, form(fields));
  const id = /\?analysis=([0-9a-f-]{36})$/.exec(location)?.[1];
  if (!id) throw new Error(`unexpected redirect ${location}`);
  return id;
}

describe("test runs", () => {
  it("names each invalid field", async () => {
    actAs(reviewer);
    const result = await createRun(
      idleActionState,
      form({ labId: "nope", testedOn: "2025-13-40", unitSource: "loaned", supplyVoltage: "9000", supplyFrequencyHz: "55", ambientC: "warm", warmUpMinutes: "5" }),
    );
    expect(result.status).toBe("error");
    expect(result.fieldErrors).toMatchObject({
      labId: ["Choose the lab."],
      toolId: ["Choose the tool tested."],
      protocolVersionId: ["Choose the protocol."],
      instrumentIds: ["Choose at least one instrument."],
      unitSerialNumber: ["Enter the unit's serial number."],
      supplyVoltage: ["Supply voltage is between 90 and 260 V."],
      supplyFrequencyHz: ["Supply frequency is 50 or 60 Hz."],
      ambientC: ["The ambient temperature must be a number."],
    });
    expect(result.fieldErrors?.testedOn?.[0]).toMatch(/does not exist|YYYY-MM-DD/);
  });

  it("asks who loaned or gave the unit", async () => {
    actAs(reviewer);
    const result = await createRun(idleActionState, form(runFields({ unitSource: "loaned" })));
    expect(result.fieldErrors?.unitSourceNote).toEqual(["Say who loaned or gave the unit, and on what terms."]);
  });

  it("refuses a lab the reviewer does not belong to, and a protocol version that does not exist", async () => {
    const [otherLab] = await db.insert(labs).values({ slug: `far-lab-${randomUUID()}`, name: "Far lab", city: "Far", nominalVoltage: 120, frequencyHz: 60 }).returning();
    actAs(reviewer);
    expect((await createRun(idleActionState, form(runFields({ labId: otherLab!.id })))).fieldErrors?.labId).toEqual(["Choose one of your labs."]);
    expect((await createRun(idleActionState, form(runFields({ protocolVersionId: randomUUID() })))).fieldErrors?.protocolVersionId).toEqual([
      "That protocol version does not exist.",
    ]);
  });

  it("refuses readers and anonymous visitors", async () => {
    actAs(null);
    expect((await createRun(idleActionState, form(runFields()))).status).toBe("unauthenticated");
    actAs(reader);
    expect((await createRun(idleActionState, form(runFields()))).status).toBe("forbidden");
  });

  it("keeps the instruments' spec and calibration as they were, and warns when one was overdue", async () => {
    const runId = await newRun(reviewer);
    await db.update(instruments).set({ accuracy: [accuracy("current", "A", 40, 9, 9)], calibrationDueOn: "2099-12-31" }).where(eq(instruments.id, bench.clampId));
    const [kept] = await db.select().from(runInstruments).where(eq(runInstruments.instrumentId, bench.clampId)).limit(1);
    expect(kept?.snapshot.accuracy[0]).toMatchObject({ percentOfReading: 2, offset: 0.01 });
    await db.update(instruments).set({ accuracy: [accuracy("current", "A", 4, 2, 0.01), accuracy("current", "A", 40, 1.5, 0.05)], calibrationDueOn: "2099-01-01" }).where(eq(instruments.id, bench.clampId));
    const warnings = await listCalibrationWarnings({ runIds: [runId] });
    expect(warnings.map((warning) => warning.instrumentId)).toEqual([bench.overdueAnemometerId]);
  });

  it("lets only the run's reviewer and editors change it", async () => {
    const runId = await newRun(reviewer);
    const update = () => form({ ...runFields({ notes: "Changed." }), runId });
    actAs(otherReviewer);
    expect(await updateRun(idleActionState, update())).toMatchObject({ status: "error", message: "No run of yours has that id." });
    actAs(editor);
    expect((await updateRun(idleActionState, update())).status).toBe("ok");
    const [row] = await db.select({ notes: testRuns.notes }).from(testRuns).where(eq(testRuns.id, runId));
    expect(row?.notes).toBe("Changed.");
  });
});

describe("manual readings", () => {
  it("records repeats with their mean, uncertainty and verdict", async () => {
    const runId = await newRun(reviewer);
    actAs(reviewer);
    const result = await addManualReading(idleActionState, form({ runId, kind: "airflow", values: "118.2, 121.5 119.8", rule: "simple" }));
    expect(result.status).toBe("ok");
    const [reading] = await db.select().from(manualReadings).where(eq(manualReadings.runId, runId));
    expect(reading?.values).toEqual([118.2, 121.5, 119.8]);
    const [measurement] = await db.select().from(measurements).where(eq(measurements.manualReadingId, reading!.id));
    expect(measurement?.value).toBeCloseTo(119.8333, 3);
    // No instrument: U is the Type A term alone, s/√n, doubled.
    expect(measurement?.expandedUncertainty).toBeCloseTo(2 * (1.65025 / Math.sqrt(3)), 3);
    expect(measurement?.verdict).toMatchObject({ rated: 120, result: "meets rating", rule: "simple" });
  });

  it("says what is wrong with the readings", async () => {
    const runId = await newRun(reviewer);
    actAs(reviewer);
    const result = await addManualReading(idleActionState, form({ runId, kind: "airflow", values: "118, lots", instrumentId: randomUUID() }));
    expect(result.fieldErrors?.values).toEqual(["Readings are numbers separated by commas or spaces, e.g. 41.2, 40.8, 41.5."]);
    const notOnRun = await addManualReading(idleActionState, form({ runId, kind: "airflow", values: "118", instrumentId: randomUUID() }));
    expect(notOnRun.fieldErrors?.instrumentId).toEqual(["Choose one of this run's instruments."]);
  });

  it("refuses another reviewer's run, and lets an editor add and delete", async () => {
    const runId = await newRun(reviewer);
    actAs(otherReviewer);
    expect(await addManualReading(idleActionState, form({ runId, kind: "airflow", values: "120" }))).toMatchObject({ message: "No run of yours has that id." });
    actAs(editor);
    expect((await addManualReading(idleActionState, form({ runId, kind: "airflow", values: "120" }))).status).toBe("ok");
    const [reading] = await db.select({ id: manualReadings.id }).from(manualReadings).where(eq(manualReadings.runId, runId));
    actAs(otherReviewer);
    expect(await deleteManualReading(idleActionState, form({ readingId: reading!.id }))).toMatchObject({ message: "No reading of yours has that id." });
    actAs(reviewer);
    expect((await deleteManualReading(idleActionState, form({ readingId: reading!.id }))).status).toBe("ok");
    expect(await db.select().from(measurements).where(eq(measurements.manualReadingId, reading!.id))).toEqual([]);
  });
});

describe("capture uploads", () => {
  const request = (runId: string, overrides: Record<string, unknown> = {}) => ({ runId, kind: "waveform", fileName: "scope.csv", sizeBytes: 1200, ...overrides });

  it("validates the declared file before signing anything", async () => {
    const runId = await newRun(reviewer);
    actAs(reviewer);
    const response = await startUpload(jsonRequest("/api/captures", request(runId, { fileName: "scope.png", sizeBytes: 300 * 1024 * 1024, kind: "photo" })));
    expect(response.status).toBe(422);
    const { error } = (await response.json()) as { error: { fieldErrors: Record<string, string[]> } };
    expect(error.fieldErrors).toEqual({
      fileName: ["Captures are CSV, TSV or TXT exports."],
      sizeBytes: ["Captures up to 200 MB."],
      kind: ["Choose what the capture holds."],
    });
  });

  it("refuses anonymous visitors, readers and other reviewers", async () => {
    const runId = await newRun(reviewer);
    actAs(null);
    expect((await startUpload(jsonRequest("/api/captures", request(runId)))).status).toBe(401);
    actAs(reader);
    expect((await startUpload(jsonRequest("/api/captures", request(runId)))).status).toBe(403);
    actAs(otherReviewer);
    expect((await startUpload(jsonRequest("/api/captures", request(runId)))).status).toBe(404);
  });

  it("signs an upload, and confirms it only when storage holds the declared bytes", async () => {
    const runId = await newRun(reviewer);
    const body = await readFile(fixture);
    actAs(editor);
    const started = await startUpload(jsonRequest("/api/captures", request(runId, { sizeBytes: body.length })));
    expect(started.status).toBe(201);
    const { captureId, upload, confirmUrl } = (await started.json()) as { captureId: string; upload: { url: string; headers: Record<string, string> }; confirmUrl: string };
    expect(confirmUrl).toBe(`/api/captures/${captureId}/uploaded`);

    expect((await confirmUpload(jsonRequest(confirmUrl, {}), routeContext({ id: captureId }))).status).toBe(409);
    const put = await fetch(upload.url, { method: "PUT", headers: upload.headers, body });
    expect(put.status).toBe(200);
    actAs(otherReviewer);
    expect((await confirmUpload(jsonRequest(confirmUrl, {}), routeContext({ id: captureId }))).status).toBe(404);
    actAs(reviewer);
    const confirmed = await confirmUpload(jsonRequest(confirmUrl, {}), routeContext({ id: captureId }));
    expect(confirmed.status).toBe(200);
    expect(await confirmed.json()).toMatchObject({ status: "uploaded", mappingUrl: `/workspace/runs/${runId}/captures/${captureId}` });
    expect((await confirmUpload(jsonRequest(confirmUrl, {}), routeContext({ id: captureId }))).status).toBe(200);
  });

  it("discards an upload whose size differs from the declared one, row and object both", async () => {
    const runId = await newRun(reviewer);
    actAs(reviewer);
    const started = await startUpload(jsonRequest("/api/captures", request(runId, { sizeBytes: 10 })));
    const { captureId, confirmUrl } = (await started.json()) as { captureId: string; confirmUrl: string };
    const [row] = await db.select().from(captures).where(eq(captures.id, captureId));
    // The local fake does not check signatures, so a larger body can arrive; real S3 would refuse it.
    await putObject(row!.objectKey, "time,current\n0,1\n", "text/csv");
    const confirmed = await confirmUpload(jsonRequest(confirmUrl, {}), routeContext({ id: captureId }));
    expect(confirmed.status).toBe(422);
    expect(((await confirmed.json()) as { error: { message: string } }).error.message).toMatch(/where 10 were declared/);
    expect(await db.select().from(captures).where(eq(captures.id, captureId))).toEqual([]);
    expect(await statObject(row!.objectKey)).toBeNull();
  });

  it("cleans up abandoned uploads with their objects, and objects that have no row", async () => {
    const runId = await newRun(reviewer);
    const prefix = `captures/${runId}/`;
    const abandonedId = randomUUID();
    const abandonedKey = captureObjectKey({ runId, captureId: abandonedId, fileName: "half.csv" });
    await putObject(abandonedKey, "time,current\n", "text/csv");
    await db.insert(captures).values({ id: abandonedId, runId, kind: "waveform", objectKey: abandonedKey, fileName: "half.csv", declaredBytes: 99, createdAt: new Date(Date.now() - 2 * 3600_000) });
    const freshId = randomUUID();
    const freshKey = captureObjectKey({ runId, captureId: freshId, fileName: "now.csv" });
    await db.insert(captures).values({ id: freshId, runId, kind: "waveform", objectKey: freshKey, fileName: "now.csv", declaredBytes: 99 });
    const kept = await storedCapture(runId, "time,current\n0,1\n");
    const orphanKey = `${prefix}${randomUUID()}/orphan.csv`;
    await putObject(orphanKey, "time,current\n", "text/csv");

    expect(await cleanUpAbandonedUploads({ olderThan: new Date(Date.now() - 3600_000), prefix })).toEqual({ rows: 1, objects: 0 });
    expect(await db.select().from(captures).where(eq(captures.id, abandonedId))).toEqual([]);
    expect(await statObject(abandonedKey)).toBeNull();
    expect(await db.select({ id: captures.id }).from(captures).where(eq(captures.id, freshId))).toHaveLength(1);

    // Later, the orphan is old enough too; the confirmed capture and its object stay.
    expect(await cleanUpAbandonedUploads({ olderThan: new Date(Date.now() + 60_000), prefix })).toEqual({ rows: 1, objects: 1 });
    const listed = await getObjectStorageClient().send(new ListObjectsV2Command({ Bucket: objectStorageBucket(), Prefix: prefix }));
    expect((listed.Contents ?? []).map((object) => object.Key)).toEqual([kept.objectKey]);
  });
});

describe("analyses", () => {
  it("names what the mapping is missing", async () => {
    const runId = await newRun(reviewer);
    const capture = await storedCapture(runId, await readFile(fixture));
    actAs(reviewer);
    const result = await startWaveformAnalysis(idleActionState, form(orreryMapping(capture.id, { currentColumn: "", timeColumn: "", currentScale: "0", voltageColumn: "CH1" })));
    expect(result.fieldErrors).toMatchObject({
      currentColumn: ["Choose a column."],
      currentScale: ["The current scale must be above 0."],
      sampleIntervalSeconds: ["Choose a time column or give the sample interval."],
    });
    const foreign = await startWaveformAnalysis(idleActionState, form(orreryMapping(capture.id, { currentAccuracy: `${randomUUID()}:0` })));
    expect(foreign.fieldErrors?.currentAccuracy).toEqual(["That accuracy line is not one of this run's instruments."]);
  });

  it("refuses another reviewer's capture and lets an editor analyse it", async () => {
    const runId = await newRun(reviewer);
    const capture = await storedCapture(runId, await readFile(fixture));
    actAs(otherReviewer);
    expect(await startWaveformAnalysis(idleActionState, form(orreryMapping(capture.id)))).toMatchObject({ message: "No capture of yours has that id." });
    await requestAnalysis(editor, startWaveformAnalysis, orreryMapping(capture.id));
    expect(enqueueAnalysis).toHaveBeenCalledTimes(1);
  });

  it("stores exactly what analyzeCapture gives for the same file, with chart series and measurements", async () => {
    const runId = await newRun(reviewer);
    const capture = await storedCapture(runId, await readFile(fixture));
    const analysisId = await requestAnalysis(reviewer, startWaveformAnalysis, orreryMapping(capture.id));
    expect(enqueueAnalysis).toHaveBeenCalledWith({ analysisId });
    expect(await runCaptureAnalysis({ analysisId })).toBe("done");

    const [stored] = await db.select().from(analyses).where(eq(analyses.id, analysisId));
    const options = stored!.options as StoredAnalysisOptions;
    if (options.kind !== "waveform") throw new Error("expected a waveform analysis");
    const expected = await analyzeCapture({ path: fixture }, options.analysis);
    expect(stored!.status).toBe("done");
    expect(stored!.analysisVersion).toBe(expected.analysisVersion);
    expect(stored!.result).toEqual(JSON.parse(JSON.stringify(expected)));
    expect(options.analysis.rating).toMatchObject({ ratedPowerW: 720, currentAccuracy: { percentOfReading: 2, offset: 0.01 }, voltageAccuracy: { percentOfReading: 1.5, offset: 0.5 } });
    expect(stored!.displaySeries?.waveform?.current).toHaveLength(expected.capture.samples);
    expect(stored!.displaySeries?.halfCycles?.conducting.filter(Boolean)).toHaveLength(expected.halfCycles.conducting);
    expect(stored!.instrumentSnapshots.map((snapshot) => snapshot.kind).sort()).toEqual(["current_clamp", "oscilloscope"]);

    const rows = await db.select().from(measurements).where(eq(measurements.analysisId, analysisId));
    const power = rows.find((row) => row.kind === "power_input_full_demand");
    expect(power?.verdict).toMatchObject({ result: expected.verdict!.result, rated: 720 });
    expect(power?.expandedUncertainty).toBeCloseTo(expected.verdict!.expandedUncertainty, 3);
    expect(rows.find((row) => row.kind === "current")?.value).toBeCloseTo(expected.current.rms, 4);

    actAs(reviewer);
    const status = await getAnalysisStatus(new Request(`http://localhost/api/analyses/${analysisId}`), routeContext({ id: analysisId }));
    expect(await status.json()).toMatchObject({ id: analysisId, status: "done", analysisVersion: expected.analysisVersion });
  });

  it("stores a rejected capture as failed, with the message and the line", async () => {
    const runId = await newRun(reviewer);
    const lines = (await readFile(fixture, "utf8")).split("\n");
    lines[99] = "-8.0000E-02,oops,1.0";
    const capture = await storedCapture(runId, lines.join("\n"));
    const analysisId = await requestAnalysis(reviewer, startWaveformAnalysis, orreryMapping(capture.id));
    expect(await runCaptureAnalysis({ analysisId })).toBe("failed");
    const [stored] = await db.select().from(analyses).where(eq(analyses.id, analysisId));
    expect(stored).toMatchObject({ status: "failed", result: null, error: { line: 100, message: expect.stringMatching(/text in numbers: "oops" in column 2/) } });
    expect(await db.select().from(measurements).where(eq(measurements.analysisId, analysisId))).toEqual([]);
  });

  it("makes a new analysis for a new mapping and never rewrites a finished one", async () => {
    const runId = await newRun(reviewer);
    const capture = await storedCapture(runId, await readFile(fixture));
    const first = await requestAnalysis(reviewer, startWaveformAnalysis, orreryMapping(capture.id));
    await runCaptureAnalysis({ analysisId: first });
    const [before] = await db.select().from(analyses).where(eq(analyses.id, first));

    const second = await requestAnalysis(reviewer, startWaveformAnalysis, orreryMapping(capture.id, { rule: "guarded", currentAccuracy: `${bench.clampId}:1` }));
    expect(second).not.toBe(first);
    expect(await runCaptureAnalysis({ analysisId: second })).toBe("done");
    expect(await runCaptureAnalysis({ analysisId: first })).toBe("skipped");

    const [after] = await db.select().from(analyses).where(eq(analyses.id, first));
    expect(after).toEqual(before);
    const [next] = await db.select().from(analyses).where(eq(analyses.id, second));
    expect((next!.result as { verdict: { rule: string } }).verdict.rule).toBe("guarded");
    expect(await db.select({ id: measurements.id }).from(measurements).where(eq(measurements.analysisId, first))).toHaveLength(3);
  });

  it("analyses a heat-up log against the claimed heat-up time and the setpoint", async () => {
    const runId = await newRun(reviewer);
    const log = captureText(
      heatUpLogBlocks(
        { ambientC: 23, setpointC: 350, deadTimeS: 1.5, timeConstantS: 5.5, overshootC: 6, rippleC: 1, intervalS: 0.5, seconds: 90, noiseC: 0.3, seed: 9 },
        { header: ["Test logger"], columns: ["Elapsed (s)", "TC1 (°C)"], delimiter: "," },
      ),
    );
    const capture = await storedCapture(runId, log, "heat_up_log");
    const analysisId = await requestAnalysis(reviewer, startHeatUpAnalysis, {
      captureId: capture.id,
      temperatureColumn: "TC1 (°C)",
      temperatureScale: "1",
      timeColumn: "Elapsed (s)",
      setpointC: "350",
      bandC: "15",
      temperatureAccuracy: `${bench.thermometerId}:0`,
      rule: "simple",
    });
    expect(await runCaptureAnalysis({ analysisId })).toBe("done");
    const [stored] = await db.select().from(analyses).where(eq(analyses.id, analysisId));
    expect(stored!.result).toMatchObject({
      heatUp: { setpointC: 350, band: { lowerC: 335, upperC: 365 } },
      heatUpVerdict: { rated: 25, result: "meets rating" },
      temperatureVerdict: { rated: 350, result: "meets rating" },
    });
    expect(stored!.displaySeries?.heatUp?.temperatureC).toHaveLength(181);
    const kinds = (await db.select({ kind: measurements.kind }).from(measurements).where(eq(measurements.analysisId, analysisId))).map((row) => row.kind).sort();
    expect(kinds).toEqual(["heat_up_time", "temperature_stability", "temperature_vs_setpoint"]);
  });

  it("answers the live poll only to those who may see the run", async () => {
    const runId = await newRun(reviewer);
    const capture = await storedCapture(runId, await readFile(fixture));
    const analysisId = await requestAnalysis(reviewer, startWaveformAnalysis, orreryMapping(capture.id));
    const poll = () => getAnalysisStatus(new Request(`http://localhost/api/analyses/${analysisId}`), routeContext({ id: analysisId }));
    actAs(null);
    expect((await poll()).status).toBe(401);
    actAs(reader);
    expect((await poll()).status).toBe(403);
    actAs(otherReviewer);
    expect((await poll()).status).toBe(404);
    actAs(editor);
    expect(await (await poll()).json()).toMatchObject({ status: "queued", error: null });
    expect((await getAnalysisStatus(new Request("http://localhost/api/analyses/x"), routeContext({ id: "x" }))).status).toBe(422);
  });
});

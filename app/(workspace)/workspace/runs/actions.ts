"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { db } from "@/db";
import { failAnalysis, getCapture, getRunForAnalysis, insertAnalysis } from "@/db/queries/captures";
import {
  deleteManualReading as deleteManualReadingRow,
  getProtocolVersionForRun,
  getRun,
  insertManualReading,
  insertMeasurements,
  insertRun,
  isLabMember,
  labExists,
  listManualReadings,
  listRunInstruments,
  lockRunForEdit,
  replaceRunInstruments,
  snapshotInstruments,
  toolExists,
  updateRun as updateRunRow,
  type RunFields,
  type Viewer,
} from "@/db/queries/runs";
import { buildHeatUpOptions, buildWaveformOptions, type BuiltOptions } from "@/lib/analysis-options";
import { can } from "@/lib/authz";
import { analysisOptionsSchema } from "@/lib/bench/analysis";
import { mean } from "@/lib/bench/statistics";
import { UserFacingError } from "@/lib/errors";
import { guardedAction } from "@/lib/guarded-action";
import { enqueueAnalysis } from "@/lib/jobs";
import { measurementKindInfo } from "@/lib/measurement-kinds";
import { accuracyForReading, manualReadingFigures } from "@/lib/run-measurements";
import {
  heatUpMappingSchema,
  manualReadingDeleteSchema,
  manualReadingSchema,
  runFormSchema,
  runUpdateSchema,
  waveformMappingSchema,
  type RunForm,
} from "@/lib/validations/runs";

const notYourRun = () => new UserFacingError("No run of yours has that id.", 404);

function runFields(data: Omit<RunForm, "labId" | "toolId" | "protocolVersionId" | "instrumentIds">): RunFields {
  return {
    testedOn: data.testedOn,
    unit: {
      serialNumber: data.unitSerialNumber,
      firmware: data.unitFirmware ?? null,
      voltageVariant: data.unitVoltageVariant,
      source: data.unitSource,
      sourceNote: data.unitSourceNote ?? null,
    },
    conditions: {
      supplyVoltage: data.supplyVoltage,
      supplyFrequencyHz: data.supplyFrequencyHz,
      ambientC: data.ambientC,
      nozzle: data.nozzle ?? null,
      airflowSetpoint: data.airflowSetpoint ?? null,
      temperatureSetpointC: data.temperatureSetpointC ?? null,
      measuringDistanceMm: data.measuringDistanceMm ?? null,
      warmUpMinutes: data.warmUpMinutes,
      measuredSupplyVoltage: data.measuredSupplyVoltage ?? null,
    },
    notes: data.notes ?? "",
  };
}

const missingInstrument = { instrumentIds: ["One of the chosen instruments is no longer in the register."] };

export const createRun = guardedAction("(workspace)/workspace/runs/actions.ts#createRun", runFormSchema, async (data, user) => {
  const runId = await db.transaction(async (tx) => {
    const labAllowed = can(user.role, "workspace:edit-any")
      ? await labExists(tx, { labId: data.labId })
      : await isLabMember(tx, { labId: data.labId, userId: user.id });
    if (!labAllowed) throw new UserFacingError("Some fields need attention.", 422, { labId: ["Choose one of your labs."] });
    if (!(await toolExists(tx, { toolId: data.toolId }))) {
      throw new UserFacingError("Some fields need attention.", 422, { toolId: ["That tool is no longer in the catalogue."] });
    }
    // Versions are immutable and never deleted while a run points at one; this only guards against a forged id.
    if (!(await getProtocolVersionForRun(tx, { id: data.protocolVersionId }))) {
      throw new UserFacingError("Some fields need attention.", 422, { protocolVersionId: ["That protocol version does not exist."] });
    }
    const snapshots = await snapshotInstruments(tx, { ids: data.instrumentIds });
    if (snapshots.length !== new Set(data.instrumentIds).size) throw new UserFacingError("Some fields need attention.", 422, missingInstrument);
    const { id } = await insertRun(tx, {
      ...runFields(data),
      toolId: data.toolId,
      protocolVersionId: data.protocolVersionId,
      labId: data.labId,
      reviewerId: user.id,
    });
    await replaceRunInstruments(tx, { runId: id, snapshots });
    return id;
  });
  revalidatePath("/workspace/runs");
  redirect(`/workspace/runs/${runId}`);
});

export const updateRun = guardedAction("(workspace)/workspace/runs/actions.ts#updateRun", runUpdateSchema, async (data, user) => {
  await db.transaction(async (tx) => {
    if (!(await lockRunForEdit(tx, { id: data.runId, viewer: user }))) throw notYourRun();
    const readings = await listManualReadings({ runId: data.runId });
    const stillRead = readings.filter((reading) => reading.instrumentId && !data.instrumentIds.includes(reading.instrumentId));
    if (stillRead.length) {
      throw new UserFacingError("Some fields need attention.", 422, {
        instrumentIds: ["An instrument you unticked took manual readings on this run; delete those readings first."],
      });
    }
    const snapshots = await snapshotInstruments(tx, { ids: data.instrumentIds });
    if (snapshots.length !== new Set(data.instrumentIds).size) throw new UserFacingError("Some fields need attention.", 422, missingInstrument);
    await updateRunRow(tx, { id: data.runId, viewer: user, fields: runFields(data) });
    await replaceRunInstruments(tx, { runId: data.runId, snapshots });
  });
  revalidatePath(`/workspace/runs/${data.runId}`);
  return { status: "ok", message: "Run saved. Analyses already made keep the conditions and instruments they were made with." };
});

async function editableRun(runId: string, viewer: Viewer) {
  const run = await getRun({ id: runId, viewer });
  if (!run) throw notYourRun();
  return run;
}

export const addManualReading = guardedAction(
  "(workspace)/workspace/runs/actions.ts#addManualReading",
  manualReadingSchema,
  async ({ runId, kind, values, instrumentId, rule, note }, user) => {
    const run = await editableRun(runId, user);
    const unit = measurementKindInfo[kind].unit;
    const instrument = instrumentId ? (await listRunInstruments({ runId })).find((entry) => entry.instrumentId === instrumentId) : undefined;
    if (instrumentId && !instrument) {
      throw new UserFacingError("Some fields need attention.", 422, { instrumentId: ["Choose one of this run's instruments."] });
    }
    const figures = manualReadingFigures({
      kind,
      values,
      accuracy: instrument ? accuracyForReading(instrument.snapshot.accuracy, unit, mean(values)) : null,
      rule,
      ratings: {
        ratedPowerW: run.tool.ratedPowerW,
        applianceType: run.tool.applianceType,
        motorShareAboveHalf: run.tool.motorShareAboveHalf,
        ratedAirflowLpm: run.tool.ratedAirflowLpm,
        claimedHeatUpSeconds: run.tool.claimedHeatUpSeconds,
        temperatureSetpointC: run.conditions.temperatureSetpointC,
        tolerances: run.protocol.tolerances,
      },
    });
    await db.transaction(async (tx) => {
      if (!(await lockRunForEdit(tx, { id: runId, viewer: user }))) throw notYourRun();
      const reading = await insertManualReading(tx, { runId, kind, values, unit, instrumentId: instrumentId ?? null, note: note ?? "" });
      await insertMeasurements(tx, {
        runId,
        source: { manualReadingId: reading.id },
        drafts: [{ kind, value: figures.spread.mean, unit, expandedUncertainty: figures.uncertainty.expanded, verdict: figures.verdict }],
      });
    });
    revalidatePath(`/workspace/runs/${runId}`);
    return { status: "ok", message: `${measurementKindInfo[kind].label}: ${values.length} reading${values.length === 1 ? "" : "s"} recorded.` };
  },
);

export const deleteManualReading = guardedAction(
  "(workspace)/workspace/runs/actions.ts#deleteManualReading",
  manualReadingDeleteSchema,
  async ({ readingId }, user) => {
    const deleted = await db.transaction((tx) => deleteManualReadingRow(tx, { readingId, viewer: user }));
    if (!deleted) throw new UserFacingError("No reading of yours has that id.", 404);
    revalidatePath(`/workspace/runs/${deleted.runId}`);
    return { status: "ok", message: "Reading deleted." };
  },
);

type RunForAnalysis = NonNullable<Awaited<ReturnType<typeof getRunForAnalysis>>>;
type RunInstruments = Awaited<ReturnType<typeof listRunInstruments>>;

/**
 * Every request makes a new analysis row, so a changed mapping or instrument never rewrites an analysis a report may
 * cite. The job is queued after the row commits; if queueing fails the row is marked failed rather than left waiting.
 */
async function requestAnalysis(
  captureId: string,
  kind: "waveform" | "heat_up_log",
  viewer: Viewer,
  build: (run: RunForAnalysis, instruments: RunInstruments) => BuiltOptions,
) {
  const capture = await getCapture({ id: captureId, viewer });
  if (!capture) throw new UserFacingError("No capture of yours has that id.", 404);
  if (capture.status !== "uploaded") throw new UserFacingError("The capture's upload has not finished; upload it again.", 409);
  if (capture.kind !== kind) throw new UserFacingError("This mapping form does not fit the capture's kind.", 422);
  const [run, instruments] = await Promise.all([getRunForAnalysis({ runId: capture.runId }), listRunInstruments({ runId: capture.runId })]);
  if (!run) throw new UserFacingError("No run of yours has that id.", 404);
  const built = build(run, instruments);
  if (!built.ok) return { status: "error" as const, message: "Some fields need attention.", fieldErrors: built.fieldErrors };
  if (built.options.kind === "waveform") {
    const checked = analysisOptionsSchema.safeParse(built.options.analysis);
    if (!checked.success) throw new UserFacingError(`The analysis cannot run with these settings: ${checked.error.issues[0]?.message}`, 422);
  }
  const analysis = await db.transaction(async (tx) => {
    if (!(await lockRunForEdit(tx, { id: capture.runId, viewer }))) throw notYourRun();
    return insertAnalysis(tx, { captureId, options: built.options, instrumentSnapshots: built.instrumentSnapshots, requestedById: viewer.id });
  });
  try {
    await enqueueAnalysis({ analysisId: analysis.id });
  } catch (error) {
    console.error("could not queue analysis", analysis.id, error);
    await failAnalysis({ id: analysis.id, error: { message: "The analysis could not be queued; start it again.", line: null } });
  }
  revalidatePath(`/workspace/runs/${capture.runId}`);
  redirect(`/workspace/runs/${capture.runId}/captures/${captureId}?analysis=${analysis.id}`);
}

export const startWaveformAnalysis = guardedAction(
  "(workspace)/workspace/runs/actions.ts#startWaveformAnalysis",
  waveformMappingSchema,
  async (mapping, user) =>
    requestAnalysis(mapping.captureId, "waveform", user, (run, instruments) =>
      buildWaveformOptions({ mapping, conditions: run.conditions, tool: run.tool, instruments }),
    ),
);

export const startHeatUpAnalysis = guardedAction(
  "(workspace)/workspace/runs/actions.ts#startHeatUpAnalysis",
  heatUpMappingSchema,
  async (mapping, user) =>
    requestAnalysis(mapping.captureId, "heat_up_log", user, (run, instruments) =>
      buildHeatUpOptions({ mapping, tool: run.tool, tolerances: run.tolerances, instruments }),
    ),
);

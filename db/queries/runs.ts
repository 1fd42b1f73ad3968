import "server-only";
import { toolName } from "@/db/queries/catalogue";
import { instrumentColumns } from "@/db/queries/instruments";
import { and, asc, desc, eq, inArray, notInArray, sql, type SQL } from "drizzle-orm";
import type { PgSelect } from "drizzle-orm/pg-core";
import { db, type Transaction } from "@/db";
import {
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
  users,
  type InstrumentSnapshot,
  type MeasurementKind,
  type RunConditions,
  type TestedUnit,
} from "@/db/schema";
import { can, type Role } from "@/lib/authz";
import type { MeasurementDraft } from "@/lib/run-measurements";

export type Viewer = { id: string; role: Role };

/** Reviewers see and change only their own runs; editors every run. Every run query puts this in its WHERE. */
export function runScope(viewer: Viewer): SQL | undefined {
  return can(viewer.role, "workspace:edit-any") ? undefined : eq(testRuns.reviewerId, viewer.id);
}


/** What verdicts need of a tool: its ratings as the maker states them. */
export const toolRatingColumns = {
  ratedPowerW: tools.ratedPowerW,
  ratedVoltageMin: tools.ratedVoltageMin,
  ratedVoltageMax: tools.ratedVoltageMax,
  applianceType: tools.applianceType,
  motorShareAboveHalf: tools.motorShareAboveHalf,
  ratedAirflowLpm: tools.ratedAirflowLpm,
  claimedHeatUpSeconds: tools.claimedHeatUpSeconds,
};

/** Joins a run's tool, maker, lab, protocol version and reviewer, for the run list and the run page. */
function withRunContext<T extends PgSelect>(query: T) {
  return query
    .innerJoin(tools, eq(tools.id, testRuns.toolId))
    .innerJoin(makers, eq(makers.id, tools.makerId))
    .innerJoin(labs, eq(labs.id, testRuns.labId))
    .innerJoin(protocolVersions, eq(protocolVersions.id, testRuns.protocolVersionId))
    .innerJoin(protocols, eq(protocols.id, protocolVersions.protocolId))
    .innerJoin(users, eq(users.id, testRuns.reviewerId));
}

export async function listRuns({ viewer }: { viewer: Viewer }) {
  const query = db
    .select({
      id: testRuns.id,
      testedOn: testRuns.testedOn,
      toolName,
      toolSlug: tools.slug,
      labName: labs.name,
      protocolName: protocols.name,
      protocolVersion: protocolVersions.version,
      reviewerName: users.name,
      serialNumber: sql<string>`${testRuns.unit}->>'serialNumber'`,
    })
    .from(testRuns)
    .$dynamic();
  return withRunContext(query).where(runScope(viewer)).orderBy(desc(testRuns.testedOn), desc(testRuns.createdAt));
}

export type RunSummary = Awaited<ReturnType<typeof listRuns>>[number];

/** A run with what its pages and its analyses need: the tool's ratings and the protocol version it follows. */
export async function getRun({ id, viewer }: { id: string; viewer: Viewer }) {
  const query = db
    .select({
      id: testRuns.id,
      reviewerId: testRuns.reviewerId,
      reviewerName: users.name,
      testedOn: testRuns.testedOn,
      unit: testRuns.unit,
      conditions: testRuns.conditions,
      notes: testRuns.notes,
      lab: { id: labs.id, name: labs.name, nominalVoltage: labs.nominalVoltage, frequencyHz: labs.frequencyHz },
      tool: {
        id: tools.id,
        slug: tools.slug,
        name: toolName,
        category: tools.category,
        ...toolRatingColumns,
      },
      protocol: {
        versionId: protocolVersions.id,
        name: protocols.name,
        slug: protocols.slug,
        version: protocolVersions.version,
        requiredMeasurements: protocolVersions.requiredMeasurements,
        repeats: protocolVersions.repeats,
        tolerances: protocolVersions.tolerances,
        safetyCautions: protocolVersions.safetyCautions,
      },
    })
    .from(testRuns)
    .$dynamic();
  const [row] = await withRunContext(query).where(and(eq(testRuns.id, id), runScope(viewer))).limit(1);
  return row ?? null;
}

export type RunDetail = NonNullable<Awaited<ReturnType<typeof getRun>>>;

export async function listRunInstruments({ runId }: { runId: string }) {
  return db
    .select({ instrumentId: runInstruments.instrumentId, snapshot: runInstruments.snapshot })
    .from(runInstruments)
    .where(eq(runInstruments.runId, runId))
    .orderBy(asc(runInstruments.createdAt));
}

/**
 * Instruments a run used after their calibration fell due, from the snapshot the run keeps, so a later
 * recalibration of the instrument does not hide that this run's readings were taken out of calibration.
 */
export async function listCalibrationWarnings({ runIds }: { runIds: readonly string[] }) {
  if (runIds.length === 0) return [];
  return db
    .select({
      runId: runInstruments.runId,
      instrumentId: runInstruments.instrumentId,
      testedOn: testRuns.testedOn,
      maker: sql<string>`${runInstruments.snapshot}->>'maker'`,
      model: sql<string>`${runInstruments.snapshot}->>'model'`,
      serialNumber: sql<string>`${runInstruments.snapshot}->>'serialNumber'`,
      calibrationDueOn: sql<string>`${runInstruments.snapshot}->>'calibrationDueOn'`,
    })
    .from(runInstruments)
    .innerJoin(testRuns, eq(testRuns.id, runInstruments.runId))
    .where(
      and(
        inArray(runInstruments.runId, [...runIds]),
        sql`${testRuns.testedOn} > (${runInstruments.snapshot}->>'calibrationDueOn')::date`,
      ),
    );
}

export type CalibrationWarning = Awaited<ReturnType<typeof listCalibrationWarnings>>[number];

/** What the new-run form offers: the viewer's labs (every lab for editors), tools, each protocol's latest version, instruments. */
export async function getRunFormChoices({ viewer }: { viewer: Viewer }) {
  const allLabs = can(viewer.role, "workspace:edit-any");
  const [labRows, toolRows, versionRows, instrumentRows] = await Promise.all([
    db
      .selectDistinct({ id: labs.id, name: labs.name, nominalVoltage: labs.nominalVoltage, frequencyHz: labs.frequencyHz })
      .from(labs)
      .leftJoin(labMembers, eq(labMembers.labId, labs.id))
      .where(allLabs ? undefined : eq(labMembers.userId, viewer.id))
      .orderBy(asc(labs.name)),
    db
      .select({ id: tools.id, name: toolName, ratedVoltageMin: tools.ratedVoltageMin, ratedVoltageMax: tools.ratedVoltageMax })
      .from(tools)
      .innerJoin(makers, eq(makers.id, tools.makerId))
      .orderBy(asc(makers.name), asc(tools.model)),
    db
      .selectDistinctOn([protocolVersions.protocolId], {
        id: protocolVersions.id,
        protocolName: protocols.name,
        version: protocolVersions.version,
        conditions: protocolVersions.conditions,
      })
      .from(protocolVersions)
      .innerJoin(protocols, eq(protocols.id, protocolVersions.protocolId))
      .orderBy(protocolVersions.protocolId, desc(protocolVersions.version)),
    db
      .select({
        id: instruments.id,
        labId: instruments.labId,
        kind: instruments.kind,
        maker: instruments.maker,
        model: instruments.model,
        serialNumber: instruments.serialNumber,
        calibrationDueOn: instruments.calibrationDueOn,
      })
      .from(instruments)
      .orderBy(asc(instruments.kind), asc(instruments.maker), asc(instruments.model)),
  ]);
  return {
    labs: labRows,
    tools: toolRows,
    protocolVersions: versionRows.sort((a, b) => a.protocolName.localeCompare(b.protocolName)),
    instruments: instrumentRows,
  };
}

export type RunFormChoices = Awaited<ReturnType<typeof getRunFormChoices>>;

export async function isLabMember(tx: Transaction, { labId, userId }: { labId: string; userId: string }) {
  const [row] = await tx
    .select({ labId: labMembers.labId })
    .from(labMembers)
    .where(and(eq(labMembers.labId, labId), eq(labMembers.userId, userId)))
    .limit(1);
  return row !== undefined;
}

export async function labExists(tx: Transaction, { labId }: { labId: string }) {
  const [row] = await tx.select({ id: labs.id }).from(labs).where(eq(labs.id, labId)).limit(1);
  return row !== undefined;
}

export async function toolExists(tx: Transaction, { toolId }: { toolId: string }) {
  const [row] = await tx.select({ id: tools.id }).from(tools).where(eq(tools.id, toolId)).limit(1);
  return row !== undefined;
}

/** A share lock, so the version cannot disappear between this check and the insert that points at it. */
export async function getProtocolVersionForRun(tx: Transaction, { id }: { id: string }) {
  const [row] = await tx
    .select({ id: protocolVersions.id, conditions: protocolVersions.conditions })
    .from(protocolVersions)
    .where(eq(protocolVersions.id, id))
    .for("share")
    .limit(1);
  return row ?? null;
}

/** The instruments' spec and calibration as they are now: what a run keeps of them. */
export async function snapshotInstruments(tx: Transaction, { ids }: { ids: readonly string[] }) {
  if (ids.length === 0) return [];
  const rows = await tx
    .select(instrumentColumns)
    .from(instruments)
    .where(inArray(instruments.id, [...ids]))
    .for("share");
  return rows.map(({ id, ...snapshot }) => ({ instrumentId: id, snapshot: snapshot satisfies InstrumentSnapshot }));
}

export type RunFields = { testedOn: string; unit: TestedUnit; conditions: RunConditions; notes: string };

export async function insertRun(
  tx: Transaction,
  run: RunFields & { toolId: string; protocolVersionId: string; labId: string; reviewerId: string },
) {
  const [row] = await tx.insert(testRuns).values(run).returning({ id: testRuns.id });
  if (!row) throw new Error("run not inserted");
  return row;
}

export async function updateRun(tx: Transaction, { id, viewer, fields }: { id: string; viewer: Viewer; fields: RunFields }) {
  const [row] = await tx
    .update(testRuns)
    .set(fields)
    .where(and(eq(testRuns.id, id), runScope(viewer)))
    .returning({ id: testRuns.id });
  return row ?? null;
}

/** Keeps the snapshot of an instrument the run already had: what was recorded then stays recorded. */
export async function replaceRunInstruments(
  tx: Transaction,
  { runId, snapshots }: { runId: string; snapshots: { instrumentId: string; snapshot: InstrumentSnapshot }[] },
) {
  const ids = snapshots.map((entry) => entry.instrumentId);
  await tx
    .delete(runInstruments)
    .where(and(eq(runInstruments.runId, runId), ids.length ? notInArray(runInstruments.instrumentId, ids) : undefined));
  if (snapshots.length) {
    await tx
      .insert(runInstruments)
      .values(snapshots.map((entry) => ({ runId, ...entry })))
      .onConflictDoNothing();
  }
}

/** The run if the viewer may change it, locked against a concurrent edit for the rest of the transaction. */
export async function lockRunForEdit(tx: Transaction, { id, viewer }: { id: string; viewer: Viewer }) {
  const [row] = await tx
    .select({ id: testRuns.id })
    .from(testRuns)
    .where(and(eq(testRuns.id, id), runScope(viewer)))
    .for("update")
    .limit(1);
  return row ?? null;
}

export async function insertManualReading(
  tx: Transaction,
  reading: { runId: string; kind: MeasurementKind; values: number[]; unit: string; instrumentId: string | null; note: string },
) {
  const [row] = await tx.insert(manualReadings).values(reading).returning({ id: manualReadings.id });
  if (!row) throw new Error("reading not inserted");
  return row;
}

/** Scoped through the run, so a reviewer cannot remove a reading from another reviewer's run. Its measurement goes with it. */
export async function deleteManualReading(tx: Transaction, { readingId, viewer }: { readingId: string; viewer: Viewer }) {
  const [row] = await tx
    .delete(manualReadings)
    .where(
      and(
        eq(manualReadings.id, readingId),
        inArray(manualReadings.runId, tx.select({ id: testRuns.id }).from(testRuns).where(runScope(viewer))),
      ),
    )
    .returning({ id: manualReadings.id, runId: manualReadings.runId });
  return row ?? null;
}

export async function insertMeasurements(
  tx: Transaction,
  { runId, source, drafts }: { runId: string; source: { analysisId: string } | { manualReadingId: string }; drafts: readonly MeasurementDraft[] },
) {
  if (drafts.length === 0) return;
  await tx.insert(measurements).values(
    drafts.map((draft) => ({
      runId,
      ...source,
      source: "analysisId" in source ? ("analysis" as const) : ("manual" as const),
      kind: draft.kind,
      value: draft.value,
      unit: draft.unit,
      expandedUncertainty: draft.expandedUncertainty,
      verdict: draft.verdict as Record<string, unknown> | null,
    })),
  );
}

export async function listManualReadings({ runId }: { runId: string }) {
  return db
    .select({
      id: manualReadings.id,
      kind: manualReadings.kind,
      values: manualReadings.values,
      unit: manualReadings.unit,
      note: manualReadings.note,
      instrumentId: manualReadings.instrumentId,
      createdAt: manualReadings.createdAt,
      expandedUncertainty: measurements.expandedUncertainty,
      verdict: measurements.verdict,
    })
    .from(manualReadings)
    .leftJoin(measurements, eq(measurements.manualReadingId, manualReadings.id))
    .where(eq(manualReadings.runId, runId))
    .orderBy(asc(manualReadings.createdAt));
}

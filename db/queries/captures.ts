import "server-only";
import { and, desc, eq, inArray, lt, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import {
  analyses,
  captures,
  makers,
  measurements,
  protocolVersions,
  testRuns,
  tools,
  type DisplaySeries,
  type InstrumentSnapshot,
} from "@/db/schema";
import type { StoredAnalysisOptions } from "@/lib/analysis-options";
import { toolName } from "./catalogue";
import { runScope, toolRatingColumns, type Viewer } from "./runs";

const captureColumns = {
  id: captures.id,
  runId: captures.runId,
  kind: captures.kind,
  objectKey: captures.objectKey,
  fileName: captures.fileName,
  declaredBytes: captures.declaredBytes,
  status: captures.status,
  uploadedAt: captures.uploadedAt,
  createdAt: captures.createdAt,
};

export async function insertCapture(
  tx: Transaction,
  capture: { id: string; runId: string; kind: "waveform" | "heat_up_log"; objectKey: string; fileName: string; declaredBytes: number; createdById: string },
) {
  const [row] = await tx.insert(captures).values(capture).returning(captureColumns);
  if (!row) throw new Error("capture not inserted");
  return row;
}

/** The capture if the viewer may see (and so change) its run. */
export async function getCapture({ id, viewer }: { id: string; viewer: Viewer }) {
  const [row] = await db
    .select(captureColumns)
    .from(captures)
    .innerJoin(testRuns, eq(testRuns.id, captures.runId))
    .where(and(eq(captures.id, id), runScope(viewer)))
    .limit(1);
  return row ?? null;
}

/** Only an upload still awaited can be confirmed: the row is locked so the clean-up cannot delete it meanwhile. */
export async function lockAwaitedCapture(tx: Transaction, { id, viewer }: { id: string; viewer: Viewer }) {
  const [row] = await tx
    .select(captureColumns)
    .from(captures)
    .innerJoin(testRuns, eq(testRuns.id, captures.runId))
    .where(and(eq(captures.id, id), eq(captures.status, "awaiting_upload"), runScope(viewer)))
    .for("update", { of: captures })
    .limit(1);
  return row ?? null;
}

export async function markCaptureUploaded(tx: Transaction, { id }: { id: string }) {
  await tx.update(captures).set({ status: "uploaded", uploadedAt: new Date() }).where(and(eq(captures.id, id), eq(captures.status, "awaiting_upload")));
}

export async function deleteCaptureRow(tx: Transaction, { id }: { id: string }) {
  await tx.delete(captures).where(eq(captures.id, id));
}

/** Uploads begun before `olderThan` and never confirmed; locked, and skipped when a confirmation holds the row. */
export async function lockAbandonedCaptures(tx: Transaction, { olderThan, keyPrefix, limit }: { olderThan: Date; keyPrefix: string; limit: number }) {
  return tx
    .select({ id: captures.id, objectKey: captures.objectKey })
    .from(captures)
    .where(and(eq(captures.status, "awaiting_upload"), lt(captures.createdAt, olderThan), sql`starts_with(${captures.objectKey}, ${keyPrefix})`))
    .for("update", { skipLocked: true })
    .limit(limit);
}

export async function listCaptureKeys({ keys }: { keys: readonly string[] }) {
  if (keys.length === 0) return new Set<string>();
  const rows = await db.select({ objectKey: captures.objectKey }).from(captures).where(inArray(captures.objectKey, [...keys]));
  return new Set(rows.map((row) => row.objectKey));
}

/** A run's captures, each with its newest analysis. */
export async function listRunCaptures({ runId }: { runId: string }) {
  const latest = db
    .selectDistinctOn([analyses.captureId], { captureId: analyses.captureId, id: analyses.id, status: analyses.status })
    .from(analyses)
    .orderBy(analyses.captureId, desc(analyses.createdAt))
    .as("latest");
  return db
    .select({ ...captureColumns, latestAnalysisId: latest.id, latestAnalysisStatus: latest.status })
    .from(captures)
    .leftJoin(latest, eq(latest.captureId, captures.id))
    .where(eq(captures.runId, runId))
    .orderBy(desc(captures.createdAt));
}

export async function insertAnalysis(
  tx: Transaction,
  analysis: { captureId: string; options: StoredAnalysisOptions; instrumentSnapshots: InstrumentSnapshot[]; requestedById: string },
) {
  const [row] = await tx.insert(analyses).values(analysis).returning({ id: analyses.id });
  if (!row) throw new Error("analysis not inserted");
  return row;
}

const analysisSummaryColumns = {
  id: analyses.id,
  captureId: analyses.captureId,
  status: analyses.status,
  analysisVersion: analyses.analysisVersion,
  error: analyses.error,
  createdAt: analyses.createdAt,
  startedAt: analyses.startedAt,
  finishedAt: analyses.finishedAt,
};

export async function listCaptureAnalyses({ captureId }: { captureId: string }) {
  return db
    .select({ ...analysisSummaryColumns, options: analyses.options })
    .from(analyses)
    .where(eq(analyses.captureId, captureId))
    .orderBy(desc(analyses.createdAt));
}

/** Status for the live poll, scoped through the capture's run. */
export async function getAnalysisStatus({ id, viewer }: { id: string; viewer: Viewer }) {
  const [row] = await db
    .select(analysisSummaryColumns)
    .from(analyses)
    .innerJoin(captures, eq(captures.id, analyses.captureId))
    .innerJoin(testRuns, eq(testRuns.id, captures.runId))
    .where(and(eq(analyses.id, id), runScope(viewer)))
    .limit(1);
  return row ?? null;
}

export async function getAnalysis({ id, viewer }: { id: string; viewer: Viewer }) {
  const [row] = await db
    .select({
      ...analysisSummaryColumns,
      options: analyses.options,
      instrumentSnapshots: analyses.instrumentSnapshots,
      result: analyses.result,
      displaySeries: analyses.displaySeries,
    })
    .from(analyses)
    .innerJoin(captures, eq(captures.id, analyses.captureId))
    .innerJoin(testRuns, eq(testRuns.id, captures.runId))
    .where(and(eq(analyses.id, id), runScope(viewer)))
    .limit(1);
  return row ? { ...row, options: row.options as StoredAnalysisOptions } : null;
}

export async function listAnalysisMeasurements({ analysisId }: { analysisId: string }) {
  return db
    .select({
      id: measurements.id,
      kind: measurements.kind,
      value: measurements.value,
      unit: measurements.unit,
      expandedUncertainty: measurements.expandedUncertainty,
      verdict: measurements.verdict,
    })
    .from(measurements)
    .where(eq(measurements.analysisId, analysisId));
}

/**
 * Moves a queued analysis (or one whose worker died mid-run, which the queue retries) to running. Done and failed
 * analyses are never picked up again: their rows are final.
 */
export async function claimAnalysis({ id }: { id: string }) {
  const [row] = await db
    .update(analyses)
    .set({ status: "running", startedAt: new Date() })
    .where(and(eq(analyses.id, id), inArray(analyses.status, ["queued", "running"])))
    .returning({ id: analyses.id, captureId: analyses.captureId, options: analyses.options });
  if (!row) return null;
  const [capture] = await db
    .select({
      runId: captures.runId,
      kind: captures.kind,
      objectKey: captures.objectKey,
      declaredBytes: captures.declaredBytes,
      status: captures.status,
    })
    .from(captures)
    .where(eq(captures.id, row.captureId))
    .limit(1);
  if (!capture) return null;
  return { id: row.id, options: row.options as StoredAnalysisOptions, capture };
}

export async function completeAnalysis(
  tx: Transaction,
  { id, analysisVersion, result, displaySeries }: { id: string; analysisVersion: string; result: object; displaySeries: DisplaySeries },
) {
  const [row] = await tx
    .update(analyses)
    .set({ status: "done", analysisVersion, result: result as Record<string, unknown>, displaySeries, error: null, finishedAt: new Date() })
    .where(and(eq(analyses.id, id), eq(analyses.status, "running")))
    .returning({ id: analyses.id });
  return row ?? null;
}

export async function failAnalysis({ id, error }: { id: string; error: { message: string; line: number | null } }) {
  await db
    .update(analyses)
    .set({ status: "failed", error, finishedAt: new Date() })
    .where(and(eq(analyses.id, id), inArray(analyses.status, ["queued", "running"])));
}

/** What an analysis request needs of its run: conditions, the tool's ratings and the protocol's tolerances. */
export async function getRunForAnalysis({ runId }: { runId: string }) {
  const [row] = await db
    .select({
      conditions: testRuns.conditions,
      tolerances: protocolVersions.tolerances,
      tool: { name: toolName, ...toolRatingColumns },
    })
    .from(testRuns)
    .innerJoin(tools, eq(tools.id, testRuns.toolId))
    .innerJoin(makers, eq(makers.id, tools.makerId))
    .innerJoin(protocolVersions, eq(protocolVersions.id, testRuns.protocolVersionId))
    .where(eq(testRuns.id, runId))
    .limit(1);
  return row ?? null;
}

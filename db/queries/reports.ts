import "server-only";
import { toolName, toolRatedSpecColumns } from "@/db/queries/catalogue";
import { and, asc, desc, eq, inArray, like, notInArray, or, sql, type SQL } from "drizzle-orm";
import type { PgSelect } from "drizzle-orm/pg-core";
import { db, type Transaction } from "@/db";
import {
  analyses,
  captures,
  labs,
  makers,
  measurements,
  reportAnalyses,
  reportImages,
  reports,
  reportTools,
  testRuns,
  tools,
  users,
  type ReportStatus,
} from "@/db/schema";
import type { Viewer } from "@/db/queries/runs";
import { can } from "@/lib/authz";
import { assembleReportEmbeds, type ReportEmbeds, type ReportEmbedSources } from "@/lib/report-embeds";

/** Reviewers see and change only the reports they wrote; editors every report. Every report query puts this in its WHERE. */
export function reportScope(viewer: Viewer): SQL | undefined {
  return can(viewer.role, "workspace:edit-any") ? undefined : eq(reports.authorId, viewer.id);
}

/** A reviewer may change a report only before it goes to the desk, or when the desk sends it back. */
export const editableReportStatuses: readonly ReportStatus[] = ["draft", "changes_requested"];


/**
 * A report's citations with the analysis, capture, run, lab and tool each one points at, in label order: the one
 * join every view of a report's cited data starts from. Pass `select(columns).from(reportAnalyses).$dynamic()`.
 */
function joinCitations<Query extends PgSelect>(query: Query, reportId: string) {
  return query
    .innerJoin(analyses, eq(analyses.id, reportAnalyses.analysisId))
    .innerJoin(captures, eq(captures.id, analyses.captureId))
    .innerJoin(testRuns, eq(testRuns.id, captures.runId))
    .innerJoin(labs, eq(labs.id, testRuns.labId))
    .innerJoin(tools, eq(tools.id, testRuns.toolId))
    .innerJoin(makers, eq(makers.id, tools.makerId))
    .where(eq(reportAnalyses.reportId, reportId))
    .orderBy(asc(reportAnalyses.label));
}

export async function listReports({ viewer }: { viewer: Viewer }) {
  const rows = await db
    .select({
      id: reports.id,
      title: reports.title,
      status: reports.status,
      updatedAt: reports.updatedAt,
      authorName: users.name,
      tools: sql<string>`coalesce((select string_agg(${makers.name} || ' ' || ${tools.model}, ' vs ' order by ${reportTools.position})
        from ${reportTools} join ${tools} on ${tools.id} = ${reportTools.toolId} join ${makers} on ${makers.id} = ${tools.makerId}
        where ${reportTools.reportId} = ${reports.id}), '')`,
      citations: sql<number>`(select count(*)::int from ${reportAnalyses} where ${reportAnalyses.reportId} = ${reports.id})`,
    })
    .from(reports)
    .innerJoin(users, eq(users.id, reports.authorId))
    .where(reportScope(viewer))
    .orderBy(desc(reports.updatedAt));
  return rows.map((row) => ({ ...row, updatedAt: row.updatedAt.toISOString() }));
}

export type ReportListRow = Awaited<ReturnType<typeof listReports>>[number];

/** The tools a report may cover. */
export async function listToolChoices() {
  return db.select({ id: tools.id, name: toolName }).from(tools).innerJoin(makers, eq(makers.id, tools.makerId)).orderBy(asc(makers.name), asc(tools.model));
}

export async function getReport({ id, viewer }: { id: string; viewer: Viewer }) {
  const [report] = await db
    .select({
      id: reports.id,
      slug: reports.slug,
      title: reports.title,
      status: reports.status,
      bodyMdx: reports.bodyMdx,
      disclosure: reports.disclosure,
      submittedAt: reports.submittedAt,
      updatedAt: reports.updatedAt,
      authorId: reports.authorId,
      authorName: users.name,
    })
    .from(reports)
    .innerJoin(users, eq(users.id, reports.authorId))
    .where(and(eq(reports.id, id), reportScope(viewer)))
    .limit(1);
  if (!report) return null;
  const [reportToolRows, citations, images] = await Promise.all([
    db
      .select({ id: tools.id, slug: tools.slug, name: toolName, position: reportTools.position })
      .from(reportTools)
      .innerJoin(tools, eq(tools.id, reportTools.toolId))
      .innerJoin(makers, eq(makers.id, tools.makerId))
      .where(eq(reportTools.reportId, id))
      .orderBy(asc(reportTools.position)),
    joinCitations(
      db
        .select({
          label: reportAnalyses.label,
          analysisId: analyses.id,
          status: analyses.status,
          finishedAt: analyses.finishedAt,
          captureKind: captures.kind,
          captureFileName: captures.fileName,
          runId: testRuns.id,
          testedOn: testRuns.testedOn,
          unit: testRuns.unit,
          toolName,
        })
        .from(reportAnalyses)
        .$dynamic(),
      id,
    ),
    db
      .select({ id: reportImages.id, name: reportImages.name, altText: reportImages.altText, width: reportImages.width, height: reportImages.height })
      .from(reportImages)
      .where(eq(reportImages.reportId, id))
      .orderBy(asc(reportImages.name)),
  ]);
  return { ...report, tools: reportToolRows, citations, images };
}

export type ReportDetail = NonNullable<Awaited<ReturnType<typeof getReport>>>;

/**
 * Finished analyses a report may cite: of runs on the report's tools, made by the report's author (a report cites
 * its own bench work), newest first. Re-analyses appear beside the analyses they supersede, so a label can be
 * repointed deliberately.
 */
export async function listCitableAnalyses({ authorId, toolIds }: { authorId: string; toolIds: readonly string[] }) {
  if (toolIds.length === 0) return [];
  return db
    .select({
      analysisId: analyses.id,
      finishedAt: analyses.finishedAt,
      analysisVersion: analyses.analysisVersion,
      captureKind: captures.kind,
      captureFileName: captures.fileName,
      testedOn: testRuns.testedOn,
      toolSlug: tools.slug,
      toolName,
    })
    .from(analyses)
    .innerJoin(captures, eq(captures.id, analyses.captureId))
    .innerJoin(testRuns, eq(testRuns.id, captures.runId))
    .innerJoin(tools, eq(tools.id, testRuns.toolId))
    .innerJoin(makers, eq(makers.id, tools.makerId))
    .where(and(eq(analyses.status, "done"), eq(testRuns.reviewerId, authorId), inArray(testRuns.toolId, [...toolIds])))
    .orderBy(desc(testRuns.testedOn), desc(analyses.finishedAt));
}

export type CitableAnalysis = Awaited<ReturnType<typeof listCitableAnalyses>>[number];

export async function findFreeReportSlug(tx: Transaction, { base }: { base: string }) {
  const rows = await tx
    .select({ slug: reports.slug })
    .from(reports)
    .where(or(eq(reports.slug, base), like(reports.slug, `${base.replace(/[\\%_]/g, (match) => `\\${match}`)}-%`)));
  return new Set(rows.map((row) => row.slug));
}

export async function insertReport(tx: Transaction, { slug, title, authorId, disclosure }: { slug: string; title: string; authorId: string; disclosure: string }) {
  const [row] = await tx.insert(reports).values({ slug, title, authorId, disclosure }).returning({ id: reports.id });
  if (!row) throw new Error("report not inserted");
  return row;
}

export async function replaceReportTools(tx: Transaction, { reportId, toolIds }: { reportId: string; toolIds: readonly string[] }) {
  await tx.delete(reportTools).where(eq(reportTools.reportId, reportId));
  await tx.insert(reportTools).values(toolIds.map((toolId, position) => ({ reportId, toolId, position })));
}

export async function countExistingTools(tx: Transaction, { toolIds }: { toolIds: readonly string[] }) {
  const rows = await tx.select({ id: tools.id }).from(tools).where(inArray(tools.id, [...toolIds]));
  return rows.length;
}

/**
 * Locks a report the viewer may change, in a state that allows changes; null when it is not theirs, gone, or with
 * the desk. Scope and state are in the WHERE clause, so a reviewer can never reach another reviewer's report.
 */
export async function lockEditableReport(tx: Transaction, { id, viewer }: { id: string; viewer: Viewer }) {
  const [row] = await tx
    .select({ id: reports.id, authorId: reports.authorId, status: reports.status, bodyMdx: reports.bodyMdx })
    .from(reports)
    .where(and(eq(reports.id, id), reportScope(viewer), inArray(reports.status, [...editableReportStatuses])))
    .for("update");
  return row ?? null;
}

export async function updateReportFields(
  tx: Transaction,
  { id, fields }: { id: string; fields: { title: string; disclosure: string; bodyMdx: string } },
) {
  await tx.update(reports).set(fields).where(and(eq(reports.id, id), inArray(reports.status, [...editableReportStatuses])));
}

/** A tool taken off the report takes the citations of its runs with it. */
export async function deleteCitationsOffTools(tx: Transaction, { reportId, toolIds }: { reportId: string; toolIds: readonly string[] }) {
  const offTools = tx
    .select({ id: analyses.id })
    .from(analyses)
    .innerJoin(captures, eq(captures.id, analyses.captureId))
    .innerJoin(testRuns, eq(testRuns.id, captures.runId))
    .where(notInArray(testRuns.toolId, [...toolIds]));
  await tx.delete(reportAnalyses).where(and(eq(reportAnalyses.reportId, reportId), inArray(reportAnalyses.analysisId, offTools)));
}

export async function listReportToolIds(tx: Transaction, { reportId }: { reportId: string }) {
  const rows = await tx.select({ toolId: reportTools.toolId }).from(reportTools).where(eq(reportTools.reportId, reportId));
  return rows.map((row) => row.toolId);
}

/** The analysis, if the report may cite it: finished, of a run by the report's author on one of the report's tools. */
export async function findCitableAnalysis(
  tx: Transaction,
  { analysisId, authorId, toolIds }: { analysisId: string; authorId: string; toolIds: readonly string[] },
) {
  if (toolIds.length === 0) return null;
  const [row] = await tx
    .select({ id: analyses.id })
    .from(analyses)
    .innerJoin(captures, eq(captures.id, analyses.captureId))
    .innerJoin(testRuns, eq(testRuns.id, captures.runId))
    .where(
      and(eq(analyses.id, analysisId), eq(analyses.status, "done"), eq(testRuns.reviewerId, authorId), inArray(testRuns.toolId, [...toolIds])),
    )
    .limit(1);
  return row ?? null;
}

export async function findCitationOfAnalysis(tx: Transaction, { reportId, analysisId }: { reportId: string; analysisId: string }) {
  const [row] = await tx
    .select({ label: reportAnalyses.label })
    .from(reportAnalyses)
    .where(and(eq(reportAnalyses.reportId, reportId), eq(reportAnalyses.analysisId, analysisId)))
    .limit(1);
  return row ?? null;
}

/** Cites an analysis under a label; a label already in use is repointed, which is how a re-analysis enters a report. */
export async function upsertCitation(tx: Transaction, { reportId, analysisId, label }: { reportId: string; analysisId: string; label: string }) {
  await tx.delete(reportAnalyses).where(and(eq(reportAnalyses.reportId, reportId), eq(reportAnalyses.label, label)));
  await tx.insert(reportAnalyses).values({ reportId, analysisId, label });
}

export async function deleteCitation(tx: Transaction, { reportId, label }: { reportId: string; label: string }) {
  const deleted = await tx
    .delete(reportAnalyses)
    .where(and(eq(reportAnalyses.reportId, reportId), eq(reportAnalyses.label, label)))
    .returning({ label: reportAnalyses.label });
  return deleted.length > 0;
}

export async function reportImageNameTaken(tx: Transaction, { reportId, name }: { reportId: string; name: string }) {
  const [row] = await tx
    .select({ id: reportImages.id })
    .from(reportImages)
    .where(and(eq(reportImages.reportId, reportId), eq(reportImages.name, name)))
    .limit(1);
  return Boolean(row);
}

export async function insertReportImage(
  tx: Transaction,
  image: { reportId: string; name: string; objectKey: string; altText: string; width: number; height: number },
) {
  const [row] = await tx.insert(reportImages).values(image).returning({ id: reportImages.id });
  if (!row) throw new Error("report image not inserted");
  return row;
}

export async function deleteReportImageRow(tx: Transaction, { reportId, imageId }: { reportId: string; imageId: string }) {
  const [row] = await tx
    .delete(reportImages)
    .where(and(eq(reportImages.id, imageId), eq(reportImages.reportId, reportId)))
    .returning({ objectKey: reportImages.objectKey });
  return row ?? null;
}

/** What the image handler needs to decide who may see a picture: drafts are private to their author and the desk. */
export async function getReportImageForServing({ imageId }: { imageId: string }) {
  const [row] = await db
    .select({ objectKey: reportImages.objectKey, reportStatus: reports.status, authorId: reports.authorId })
    .from(reportImages)
    .innerJoin(reports, eq(reports.id, reportImages.reportId))
    .where(eq(reportImages.id, imageId))
    .limit(1);
  return row ?? null;
}

export async function markReportSubmitted(tx: Transaction, { id }: { id: string }) {
  const [row] = await tx
    .update(reports)
    .set({ status: "submitted", submittedAt: new Date() })
    .where(and(eq(reports.id, id), inArray(reports.status, [...editableReportStatuses])))
    .returning({ id: reports.id });
  return row ?? null;
}

/** What submission checks beyond the body: images whose alt text is blank. */
export async function listImagesWithoutAltText(tx: Transaction, { reportId }: { reportId: string }) {
  return tx
    .select({ name: reportImages.name })
    .from(reportImages)
    .where(and(eq(reportImages.reportId, reportId), sql`btrim(${reportImages.altText}) = ''`));
}

/**
 * Everything a report's embedded figures draw from: its cited analyses (exactly those, never a newer re-analysis),
 * the measurements those analyses produced plus the manual readings of the same runs, its tools' ratings and its
 * images. Takes a transaction so publishing can freeze exactly what it checked. Call only after checking the viewer
 * may see the report.
 */
export async function loadReportEmbedSources(tx: Transaction, { reportId }: { reportId: string }): Promise<ReportEmbedSources> {
  const [cited, toolRows, imageRows] = await Promise.all([
    joinCitations(
      tx
        .select({
          label: reportAnalyses.label,
          analysisId: analyses.id,
          status: analyses.status,
          analysisVersion: analyses.analysisVersion,
          result: analyses.result,
          displaySeries: analyses.displaySeries,
          captureKind: captures.kind,
          captureFileName: captures.fileName,
          runId: testRuns.id,
          testedOn: testRuns.testedOn,
          labName: labs.name,
          toolId: tools.id,
          toolSlug: tools.slug,
          toolName,
        })
        .from(reportAnalyses)
        .$dynamic(),
      reportId,
    ),
    tx
      .select({
        id: tools.id,
        slug: tools.slug,
        name: toolName,
        ...toolRatedSpecColumns,
      })
      .from(reportTools)
      .innerJoin(tools, eq(tools.id, reportTools.toolId))
      .innerJoin(makers, eq(makers.id, tools.makerId))
      .where(eq(reportTools.reportId, reportId))
      .orderBy(asc(reportTools.position)),
    tx
      .select({ id: reportImages.id, name: reportImages.name, altText: reportImages.altText, width: reportImages.width, height: reportImages.height })
      .from(reportImages)
      .where(eq(reportImages.reportId, reportId))
      .orderBy(asc(reportImages.name)),
  ]);

  const analysisIds = cited.map((row) => row.analysisId);
  const runIds = [...new Set(cited.map((row) => row.runId))];
  const measurementRows = runIds.length
    ? await tx
        .select({
          runId: measurements.runId,
          analysisId: measurements.analysisId,
          kind: measurements.kind,
          source: measurements.source,
          value: measurements.value,
          unit: measurements.unit,
          expandedUncertainty: measurements.expandedUncertainty,
          verdict: measurements.verdict,
        })
        .from(measurements)
        .where(
          and(
            inArray(measurements.runId, runIds),
            or(eq(measurements.source, "manual"), analysisIds.length ? inArray(measurements.analysisId, analysisIds) : sql`false`),
          ),
        )
        .orderBy(asc(measurements.kind), asc(measurements.createdAt))
    : [];

  return { analyses: cited, tools: toolRows, measurements: measurementRows, images: imageRows };
}

/** The figures' data for a report as it stands now (a draft, or what the desk is about to approve). */
export async function loadReportEmbeds({ reportId }: { reportId: string }): Promise<ReportEmbeds> {
  // One read-only snapshot, so the figures and the measurements beside them come from the same moment.
  return assembleReportEmbeds(await db.transaction((tx) => loadReportEmbedSources(tx, { reportId }), { accessMode: "read only" }));
}

/** The names a report's body may use: its citation labels, its image names and its tools' slugs. */
export async function listReportReferenceNames(tx: Transaction, { reportId }: { reportId: string }) {
  const [labels, images, toolSlugs] = await Promise.all([
    tx.select({ label: reportAnalyses.label }).from(reportAnalyses).where(eq(reportAnalyses.reportId, reportId)),
    tx.select({ name: reportImages.name }).from(reportImages).where(eq(reportImages.reportId, reportId)),
    tx.select({ slug: tools.slug }).from(reportTools).innerJoin(tools, eq(tools.id, reportTools.toolId)).where(eq(reportTools.reportId, reportId)),
  ]);
  return { analysisLabels: labels.map((row) => row.label), imageNames: images.map((row) => row.name), toolSlugs: toolSlugs.map((row) => row.slug) };
}

import "server-only";
import { and, asc, eq, inArray, isNotNull, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { readableStatuses } from "@/db/queries/editorial";
import { reportRevisions, reports, reportTools, tools, type FrozenReportContent } from "@/db/schema";
import {
  flattenPublishedResults,
  listPublishedAnalyses,
  compareResults,
  type FrozenResultContent,
  type PublishedAnalysis,
  type PublishedResult,
  type PublishedRevisionSource,
} from "@/lib/published-results";

// Published results as readers see them: each readable report's CURRENT published revision, flattened from its frozen
// content, never from live runs. Retracted reports stay in, flagged, so a page can mark or leave out their figures.

/**
 * The part of the frozen content result rows read, built in the database: the cited analyses without their stored
 * results and chart series, the runs without instruments, which together are nearly all of a revision's bytes.
 */
const resultContent = sql<FrozenResultContent>`jsonb_build_object(
  'title', ${reportRevisions.content}->'title',
  'tools', ${reportRevisions.content}->'tools',
  'measurements', ${reportRevisions.content}->'measurements',
  'runs', coalesce((select jsonb_agg(run - 'instruments' - 'unit') from jsonb_array_elements(${reportRevisions.content}->'runs') as run), '[]'::jsonb),
  'analyses', coalesce((select jsonb_agg(cited - 'result' - 'displaySeries') from jsonb_array_elements(${reportRevisions.content}->'analyses') as cited), '[]'::jsonb)
)`;

function citesTool(toolSlug: string): SQL {
  return sql`exists (select 1 from ${reportTools} join ${tools} on ${tools.id} = ${reportTools.toolId} where ${reportTools.reportId} = ${reports.id} and ${tools.slug} = ${toolSlug})`;
}

/** Readable reports matching `where`, each with its current published revision and the given part of its content. */
async function listCurrentRevisions<Content>({ content, where }: { content: SQL<Content>; where: SQL }): Promise<PublishedRevisionSource<Content>[]> {
  const rows = await db
    .select({
      slug: reports.slug,
      status: reports.status,
      retractionReason: reports.retractionReason,
      revisionId: reportRevisions.id,
      revisionNumber: reportRevisions.number,
      revisionKind: reportRevisions.kind,
      publishedAt: reportRevisions.publishedAt,
      content,
    })
    .from(reports)
    .innerJoin(reportRevisions, eq(reportRevisions.id, reports.publishedRevisionId))
    .where(and(inArray(reports.status, [...readableStatuses]), eq(reportRevisions.status, "published"), isNotNull(reportRevisions.publishedAt), where))
    .orderBy(asc(reportRevisions.publishedAt), asc(reports.slug));
  return rows.map((row) => ({
    report: { slug: row.slug, status: row.status === "retracted" ? "retracted" : "published", retractionReason: row.retractionReason },
    // Text, not Date: pages cache these rows, and a cache hands back JSON.
    revision: { id: row.revisionId, number: row.revisionNumber, kind: row.revisionKind, publishedAt: (row.publishedAt ?? new Date(0)).toISOString() },
    content: row.content,
  }));
}

/** One tool's result rows of these revisions, in the catalogue's order. */
function toolResults(revisions: PublishedRevisionSource<FrozenResultContent>[], toolSlug: string): PublishedResult[] {
  return revisions.flatMap((revision) => flattenPublishedResults(revision, { toolSlug })).sort(compareResults);
}

/** Every published result for one tool across all readable reports and protocol versions, retracted ones flagged. */
export async function listPublishedResultsForTool({ toolSlug }: { toolSlug: string }): Promise<PublishedResult[]> {
  return toolResults(await listCurrentRevisions({ content: resultContent, where: citesTool(toolSlug) }), toolSlug);
}

/** The result rows of one readable report's current published revision; empty when the report is not readable. */
export async function listPublishedResultsForReport({ slug }: { slug: string }): Promise<PublishedResult[]> {
  const revisions = await listCurrentRevisions({ content: resultContent, where: eq(reports.slug, slug) });
  return revisions.flatMap((revision) => flattenPublishedResults(revision));
}

/**
 * A tool's published results and the finished analyses readable reports cite for it, with their figures and chart
 * series, from one read of the revisions, which the analyses need whole anyway.
 */
export async function listPublishedFiguresForTool({ toolSlug }: { toolSlug: string }): Promise<{ results: PublishedResult[]; analyses: PublishedAnalysis[] }> {
  const revisions = await listCurrentRevisions({ content: sql<FrozenReportContent>`${reportRevisions.content}`, where: citesTool(toolSlug) });
  return {
    results: toolResults(revisions, toolSlug),
    analyses: revisions.flatMap((revision) => listPublishedAnalyses(revision, { toolSlug })),
  };
}

import "server-only";
import { and, desc, eq, inArray, isNotNull, sql } from "drizzle-orm";
import { db } from "@/db";
import { frozenVerdictResults, readableStatuses } from "@/db/queries/editorial";
import { reportRevisions, reports, tools } from "@/db/schema";

// Lists drawn from every published report at once, for the Atom feed and the sitemap. They read the
// frozen revisions (titles, authors and tool names as published), never the working copies.

const frozenTitle = sql<string>`${reportRevisions.content}->>'title'`;
const frozenAuthorName = sql<string>`${reportRevisions.content}->'author'->>'name'`;
const frozenToolNames = sql<string[]>`jsonb_path_query_array(${reportRevisions.content}, '$.tools[*].name')`;

/** Every published revision (first publications, corrections, amendments), newest first, with its report's state. */
export async function listPublishedRevisionEvents({ limit }: { limit: number }) {
  const rows = await db
    .select({
      slug: reports.slug,
      number: reportRevisions.number,
      kind: reportRevisions.kind,
      changeNote: reportRevisions.changeNote,
      publishedAt: reportRevisions.publishedAt,
      title: frozenTitle,
      authorName: frozenAuthorName,
      toolNames: frozenToolNames,
      verdictResults: frozenVerdictResults,
    })
    .from(reportRevisions)
    .innerJoin(reports, eq(reports.id, reportRevisions.reportId))
    .where(and(eq(reportRevisions.status, "published"), isNotNull(reportRevisions.publishedAt), inArray(reports.status, [...readableStatuses])))
    .orderBy(desc(reportRevisions.publishedAt), desc(reportRevisions.number))
    .limit(limit);
  return rows.map((row) => ({ ...row, publishedAt: row.publishedAt! }));
}

/** Retractions, newest first, with the title and author of the revision readers still see under the banner. */
export async function listRetractionEvents({ limit }: { limit: number }) {
  const rows = await db
    .select({
      slug: reports.slug,
      retractedAt: reports.retractedAt,
      reason: reports.retractionReason,
      title: frozenTitle,
      authorName: frozenAuthorName,
    })
    .from(reports)
    .innerJoin(reportRevisions, eq(reportRevisions.id, reports.publishedRevisionId))
    .where(and(eq(reports.status, "retracted"), isNotNull(reports.retractedAt)))
    .orderBy(desc(reports.retractedAt))
    .limit(limit);
  return rows.map((row) => ({ ...row, retractedAt: row.retractedAt!, reason: row.reason ?? "" }));
}

/** Every readable report with the last time its page changed (a new revision or the retraction). */
export async function listReadableReportPages() {
  return db
    .select({
      slug: reports.slug,
      lastModified: sql<Date>`greatest(${reportRevisions.publishedAt}, ${reports.retractedAt})`.mapWith(reports.retractedAt),
    })
    .from(reports)
    .innerJoin(reportRevisions, eq(reportRevisions.id, reports.publishedRevisionId))
    .where(inArray(reports.status, [...readableStatuses]))
    .orderBy(reports.slug);
}

/** Every tool page, with the last time its specification changed. */
export async function listToolPages() {
  return db.select({ slug: tools.slug, lastModified: tools.updatedAt }).from(tools).orderBy(tools.slug);
}

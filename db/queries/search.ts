import "server-only";
import { and, count, desc, eq, inArray, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { reportRevisions, reports, searchableBodyText } from "@/db/schema";
import { matchEnd, matchStart } from "@/lib/search-snippet";
import type { ReportSearch } from "@/lib/validations/search";

export const reportSearchPageSize = 10;

// The reader's words go to PostgreSQL as a bound parameter and through websearch_to_tsquery, which accepts any text
// (quotes, or, -word) without a syntax error, so nothing typed can change the statement or make it fail.
const englishQuery = (q: string) => sql`websearch_to_tsquery('english', ${q})`;

/**
 * The body as the snippet shows it: the searchable text, with each Markdown heading ended by a dash so that headings
 * and paragraphs do not run together into one sentence once the line breaks are gone.
 */
const snippetText = (body: SQL) => searchableBodyText(sql`regexp_replace(${body}, '^(#{1,6}[ \\t]+[^\\n]*)$', '\\1 —', 'gn')`);

const snippetOptions = `StartSel=${matchStart}, StopSel=${matchEnd}, MaxFragments=2, MinWords=12, MaxWords=30, FragmentDelimiter=" … "`;
const titleOptions = `StartSel=${matchStart}, StopSel=${matchEnd}, HighlightAll=true`;

/**
 * Published reports whose current revision matches the words, best first (ts_rank over the weighted title, tools and
 * body), with the title and a body snippet marked where the words matched. Only the revision readers see can match:
 * drafts, revisions waiting on the desk and superseded revisions never do. Retracted reports still match, flagged,
 * since their pages stay readable with the reason.
 */
export async function searchPublishedReports({ q, page }: ReportSearch) {
  if (!q) return { hits: [], total: 0, page, perPage: reportSearchPageSize };
  const query = englishQuery(q);
  const matching = and(
    inArray(reports.status, ["published", "retracted"]),
    eq(reportRevisions.status, "published"),
    sql`${reportRevisions.searchVector} @@ ${query}`,
  );
  const rank = sql<number>`ts_rank(${reportRevisions.searchVector}, ${query})`;
  // Ranked and cut to one page first, so ts_headline (the costly part) runs only on the rows shown.
  const ranked = db
    .select({
      slug: reports.slug,
      status: reports.status,
      firstPublishedAt: reports.firstPublishedAt,
      revisionNumber: reportRevisions.number,
      revisionKind: reportRevisions.kind,
      revisedAt: reportRevisions.publishedAt,
      title: sql<string>`${reportRevisions.content}->>'title'`.as("title"),
      authorName: sql<string>`${reportRevisions.content}->'author'->>'name'`.as("author_name"),
      toolNames: sql<string[]>`array(select jsonb_array_elements_text(jsonb_path_query_array(${reportRevisions.content}, '$.tools[*].name')))`.as("tool_names"),
      bodyMdx: reportRevisions.bodyMdx,
      rank: rank.as("rank"),
    })
    .from(reports)
    .innerJoin(reportRevisions, eq(reportRevisions.id, reports.publishedRevisionId))
    .where(matching)
    .orderBy(desc(rank), desc(reportRevisions.publishedAt), desc(reports.id))
    .limit(reportSearchPageSize)
    .offset((page - 1) * reportSearchPageSize)
    .as("ranked");
  const [hits, [total]] = await Promise.all([
    db
      .select({
        slug: ranked.slug,
        status: ranked.status,
        firstPublishedAt: ranked.firstPublishedAt,
        revisionNumber: ranked.revisionNumber,
        revisionKind: ranked.revisionKind,
        revisedAt: ranked.revisedAt,
        authorName: ranked.authorName,
        toolNames: ranked.toolNames,
        title: ranked.title,
        markedTitle: sql<string>`ts_headline('english', ${ranked.title}, ${query}, ${titleOptions})`,
        snippet: sql<string>`ts_headline('english', ${snippetText(sql`${ranked.bodyMdx}`)}, ${query}, ${snippetOptions})`,
      })
      .from(ranked)
      .orderBy(desc(ranked.rank), desc(ranked.revisedAt), desc(ranked.slug)),
    db
      .select({ value: count() })
      .from(reports)
      .innerJoin(reportRevisions, eq(reportRevisions.id, reports.publishedRevisionId))
      .where(matching),
  ]);
  const iso = (date: Date | null) => (date ? date.toISOString() : null);
  return {
    // Dates as text: search results are cached, and a cache hands back JSON.
    hits: hits.map((hit) => ({ ...hit, firstPublishedAt: iso(hit.firstPublishedAt), revisedAt: iso(hit.revisedAt) })),
    total: total?.value ?? 0,
    page,
    perPage: reportSearchPageSize,
  };
}

export type ReportSearchHit = Awaited<ReturnType<typeof searchPublishedReports>>["hits"][number];

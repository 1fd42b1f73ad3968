import "server-only";
import { unstable_cache } from "next/cache";
import { listTools } from "@/db/queries/catalogue";
import { listReadableReports } from "@/db/queries/editorial";
import {
  listPublishedRevisionEvents,
  listReadableReportPages,
  listRetractionEvents,
  listToolPages,
} from "@/db/queries/published-listings";
import { renderAtomFeed } from "@/lib/atom-feed";
import { publishedListsMaxAgeSeconds, publishedReportsCacheTag } from "@/lib/editorial";
import { openDataLicence } from "@/lib/open-data";
import { reportFeedEntries, reportFeedTitle } from "@/lib/report-feed";

// The lists readers get from every published report at once, cached under one tag that the desk's publish, correct
// and retract actions clear. A cache hands back JSON, so dates travel as ISO text and are revived here.

const cacheOptions = { tags: [publishedReportsCacheTag], revalidate: publishedListsMaxAgeSeconds };

export const feedEntryLimit = 50;

/** The Atom document itself is cached: every fetch between two publications is the same bytes. */
export const loadReportFeedXml = unstable_cache(
  async (origin: string) => {
    const [revisions, retractions] = await Promise.all([
      listPublishedRevisionEvents({ limit: feedEntryLimit }),
      listRetractionEvents({ limit: feedEntryLimit }),
    ]);
    return renderAtomFeed({
      id: `${origin}/feed.xml`,
      title: reportFeedTitle,
      subtitle: "New bench reports on mains-powered heating tools, their corrections and amendments, and retractions.",
      selfLink: `${origin}/feed.xml`,
      alternateLink: `${origin}/reports`,
      authorName: "Benchplate",
      rights: openDataLicence.attribution,
      entries: reportFeedEntries({ origin, revisions, retractions, limit: feedEntryLimit }),
    });
  },
  ["report-feed"],
  cacheOptions,
);

export const loadSitemapPages = unstable_cache(
  async () => {
    const [reports, tools] = await Promise.all([listReadableReportPages(), listToolPages()]);
    const iso = (date: Date | null) => (date ? date.toISOString() : null);
    return {
      reports: reports.map((report) => ({ slug: report.slug, lastModified: iso(report.lastModified) })),
      tools: tools.map((tool) => ({ slug: tool.slug, lastModified: iso(tool.lastModified) })),
    };
  },
  ["sitemap-pages"],
  cacheOptions,
);

const cachedLatestReports = unstable_cache((limit: number) => listReadableReports({ limit }), ["latest-reports"], cacheOptions);

/** The newest reports with their verdicts, for the home page. */
export async function loadLatestReports({ limit }: { limit: number }) {
  const rows = await cachedLatestReports(limit);
  const revive = (value: Date | string | null) => (value === null ? null : new Date(value));
  return rows.map((row) => ({ ...row, firstPublishedAt: revive(row.firstPublishedAt), revisedAt: revive(row.revisedAt) }));
}

/** Tools with results in current published reports, the newest results first. */
export const loadToolsWithNewestResults = unstable_cache(
  async (limit: number) => (await listTools({ published: "yes", sort: "newestResult", page: 1, perPage: limit })).tools,
  ["tools-newest-results"],
  cacheOptions,
);

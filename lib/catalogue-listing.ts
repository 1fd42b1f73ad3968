import "server-only";
import { unstable_cache } from "next/cache";
import { cache } from "react";
import { getToolBySlug, listCatalogueMakers, listTools } from "@/db/queries/catalogue";
import { searchPublishedReports } from "@/db/queries/search";
import { publishedListsMaxAgeSeconds, publishedReportsCacheTag } from "@/lib/editorial";
import type { CatalogueQuery } from "@/lib/validations/catalogue";
import type { ReportSearch } from "@/lib/validations/search";

// The catalogue and the report search, cached per query. A page of the catalogue changes when a tool is edited (the
// workspace's tool actions clear the catalogue tag) or when a report is published, corrected or retracted (the desk's
// actions clear the published-reports tag); the age limit covers revisions the worker makes live on schedule.

export const catalogueCacheTag = "catalogue";

const catalogueCache = { tags: [catalogueCacheTag, publishedReportsCacheTag], revalidate: publishedListsMaxAgeSeconds };

/** One page of the catalogue; the page and GET /api/tools both read it here, so they agree. */
export function loadCataloguePage(query: CatalogueQuery) {
  return unstable_cache(() => listTools(query), ["catalogue-page", JSON.stringify(query)], catalogueCache)();
}

export function loadCatalogueMakers() {
  return unstable_cache(() => listCatalogueMakers(), ["catalogue-makers"], catalogueCache)();
}

export function loadReportSearch(search: ReportSearch) {
  return unstable_cache(() => searchPublishedReports(search), ["report-search", search.q, String(search.page)], {
    tags: [publishedReportsCacheTag],
    revalidate: publishedListsMaxAgeSeconds,
  })();
}

/** One tool, read once per request (by slug, as React's cache compares arguments by identity): a page and its metadata share it. */
export const loadToolBySlug = cache((slug: string) => getToolBySlug({ slug }));

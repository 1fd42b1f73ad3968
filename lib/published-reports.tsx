import "server-only";
import { unstable_cache } from "next/cache";
import { cache } from "react";
import { embedComponents } from "@/components/report-embeds/embed-components";
import { getPublishedRevision, getReadableReport } from "@/db/queries/editorial";
import { reportCacheTag } from "@/lib/editorial";
import { renderSafeTree } from "@/lib/mdx/render-tree";
import { readStoredTree } from "@/lib/mdx/stored";
import { assembleReportEmbeds } from "@/lib/report-embeds";

/**
 * A readable report's changing columns, read once per request: a page and its generateMetadata share the row. Never
 * cached across requests, so a retraction or a new revision shows at once.
 */
export const loadReadableReport = cache((slug: string) => getReadableReport({ slug }));

/**
 * A published revision, read once and cached: a published revision never changes, so its id is a key that cannot go
 * stale; the report's tag clears it on the desk's actions all the same. The report pages and the open-data downloads
 * share this entry.
 */
export function loadPublishedRevision({ slug, reportId, revisionId }: { slug: string; reportId: string; revisionId: string }) {
  return unstable_cache(() => getPublishedRevision({ reportId, revisionId }), ["published-revision", revisionId], {
    tags: [reportCacheTag(slug)],
  })();
}

// Per request, by primitive arguments (React's cache compares them by identity): a page and its metadata render once.
const renderRevisionForReaders = cache(async (slug: string, reportId: string, revisionId: string) => {
  const revision = await loadPublishedRevision({ slug, reportId, revisionId });
  if (!revision?.compiledMdx) return null;
  const embeds = assembleReportEmbeds(revision.content);
  const body = renderSafeTree(readStoredTree(revision.compiledMdx), embedComponents(embeds));
  return { revision, embeds, body };
});

/** A published revision ready to show, its stored body run with its frozen figures. Nothing here compiles MDX. */
export function loadRevisionForReaders({ slug, reportId, revisionId }: { slug: string; reportId: string; revisionId: string }) {
  return renderRevisionForReaders(slug, reportId, revisionId);
}

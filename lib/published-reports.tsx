import "server-only";
import { unstable_cache } from "next/cache";
import { embedComponents } from "@/components/report-embeds/embed-components";
import { getPublishedRevision } from "@/db/queries/editorial";
import { reportCacheTag } from "@/lib/editorial";
import { renderSafeTree } from "@/lib/mdx/render-tree";
import { readStoredTree } from "@/lib/mdx/stored";
import { assembleReportEmbeds } from "@/lib/report-embeds";

/**
 * A published revision ready to show: read once and cached (a published revision never changes, so its id is a
 * key that cannot go stale; the report's tag clears it on the desk's actions all the same), its stored body run with
 * its frozen figures. Nothing here compiles MDX.
 */
export async function loadRevisionForReaders({ slug, reportId, revisionId }: { slug: string; reportId: string; revisionId: string }) {
  const revision = await unstable_cache(() => getPublishedRevision({ reportId, revisionId }), ["published-revision", revisionId], {
    tags: [reportCacheTag(slug)],
  })();
  if (!revision?.compiledMdx) return null;
  const embeds = assembleReportEmbeds(revision.content);
  const body = renderSafeTree(readStoredTree(revision.compiledMdx), embedComponents(embeds));
  return { revision, embeds, body };
}

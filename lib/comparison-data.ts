import "server-only";
import { unstable_cache } from "next/cache";
import { listPublishedFiguresForTool } from "@/db/queries/published-results";
import { chooseComparisonSide, type ComparisonSide } from "@/lib/comparison";
import { publishedListsMaxAgeSeconds, publishedReportsCacheTag } from "@/lib/editorial";

/**
 * What the compare page shows of one tool, cached per tool: only a publication, correction or retraction changes it,
 * and the desk's actions clear the published-reports tag on each. The age limit covers scheduled revisions, which the
 * worker makes live from a process that cannot reach this cache.
 */
export function loadComparisonSide(toolSlug: string): Promise<ComparisonSide> {
  return unstable_cache(
    async () => {
      const side = chooseComparisonSide(await listPublishedFiguresForTool({ toolSlug }));
      // The page draws a waveform analysis's conduction strip, never the waveform itself, whose envelope is most of it.
      const halfCycles = side.waveform?.displaySeries?.halfCycles;
      return side.waveform ? { ...side, waveform: { ...side.waveform, displaySeries: halfCycles ? { halfCycles } : null } } : side;
    },
    ["comparison-side", toolSlug],
    { tags: [publishedReportsCacheTag], revalidate: publishedListsMaxAgeSeconds },
  )();
}

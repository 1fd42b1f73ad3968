import type { Metadata } from "next";
import { unstable_cache } from "next/cache";
import Link from "next/link";
import { notFound } from "next/navigation";
import { AccessoryList } from "@/components/accessory-list";
import { FigureList } from "@/components/figure-list";
import { ReportCards } from "@/components/published-report/report-cards";
import { listReadableReports } from "@/db/queries/editorial";
import { listPublishedResultsForTool } from "@/db/queries/published-results";
import { listToolPhotos } from "@/db/queries/tool-photos";
import { loadToolBySlug } from "@/lib/catalogue-listing";
import { publishedListsMaxAgeSeconds, publishedReportsCacheTag } from "@/lib/editorial";
import { formatFrequencies, formatOptional, formatPrice, formatRange, formatRatedVoltage } from "@/lib/format";
import { toolCategoryLabels } from "@/lib/validations/catalogue";
import { applianceTypeLabels, motorShareLabel } from "@/lib/validations/tool";
import { PublishedResultsTable } from "./_components/published-results-table";
import { ToolPhotoGallery } from "./_components/tool-photo-gallery";

/**
 * The tool's published results change only when a report on it is published, corrected or retracted: the desk's
 * actions clear the published-reports tag on each, and the age limit covers revisions the worker makes live.
 */
function loadToolResults(toolSlug: string) {
  return unstable_cache(() => listPublishedResultsForTool({ toolSlug }), ["tool-results", toolSlug], {
    tags: [publishedReportsCacheTag],
    revalidate: publishedListsMaxAgeSeconds,
  })();
}

export async function generateMetadata({ params }: PageProps<"/tools/[slug]">): Promise<Metadata> {
  const tool = await loadToolBySlug((await params).slug);
  return { title: tool ? `${tool.maker} ${tool.model}` : "Tool not found" };
}

export default async function ToolPage({ params }: PageProps<"/tools/[slug]">) {
  const { slug } = await params;
  const [tool, photos, reports, results] = await Promise.all([
    loadToolBySlug(slug),
    listToolPhotos({ toolSlug: slug }),
    listReadableReports({ toolSlug: slug }),
    loadToolResults(slug),
  ]);
  if (!tool) notFound();
  const ratings: [string, string][] = [
    ["Rated power input", `${tool.ratedPowerW} W`],
    ["Rated voltage", formatRatedVoltage(tool.ratedVoltageMin, tool.ratedVoltageMax)],
    ["Rated frequency", formatFrequencies(tool.ratedFrequenciesHz)],
    ["Rated airflow", formatOptional(tool.ratedAirflowLpm, "L/min")],
    ["Temperature range", formatRange(tool.temperatureMinC, tool.temperatureMaxC, "°C")],
    ["Claimed heat-up time", formatOptional(tool.claimedHeatUpSeconds, "s")],
    ["Appliance type (IEC 60335-1)", applianceTypeLabels[tool.applianceType]],
    ...(tool.applianceType === "combined" ? [["Motor's share of rated power", motorShareLabel(tool.motorShareAboveHalf)] as [string, string]] : []),
    ["Price", formatPrice(tool.priceMinor, tool.currency)],
  ];
  return (
    <article className="space-y-8">
      <header className="space-y-2">
        <p className="text-sm font-semibold uppercase tracking-widest text-copper">{toolCategoryLabels[tool.category]}</p>
        <h1 className="font-serif text-4xl sm:text-display">
          {tool.maker} {tool.model}
        </h1>
        <p className="max-w-2xl font-serif text-lg text-ink-soft">{tool.summary}</p>
        <p>
          <Link href={`/compare?a=${encodeURIComponent(tool.slug)}`} className="font-semibold text-copper underline underline-offset-4 hover:text-copper-deep">
            Compare with another tool
          </Link>
        </p>
      </header>
      {photos.length ? <ToolPhotoGallery photos={photos} /> : null}
      <section aria-labelledby="ratings-heading" className="max-w-2xl">
        <h2 id="ratings-heading" className="mb-3 font-serif text-2xl">
          Ratings as the maker states them
        </h2>
        <FigureList rows={ratings} />
      </section>
      {tool.accessories.length ? (
        <section aria-labelledby="accessories-heading" className="max-w-2xl">
          <h2 id="accessories-heading" className="mb-3 font-serif text-2xl">
            In the box
          </h2>
          <AccessoryList accessories={tool.accessories} className="space-y-1 pl-6" />
        </section>
      ) : null}
      <PublishedResultsTable results={results} />
      {reports.length ? (
        <section aria-labelledby="reports-heading" className="space-y-3">
          <h2 id="reports-heading" className="font-serif text-2xl">
            Bench reports on this tool
          </h2>
          <ReportCards reports={reports} headingLevel={3} />
        </section>
      ) : null}
    </article>
  );
}

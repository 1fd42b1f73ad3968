import Link from "next/link";
import type { ReadableReportSummary } from "@/db/queries/editorial";
import { VerdictSummary } from "@/components/published-report/verdict-summary";
import { formatDate } from "@/lib/format";
import { revisionKindLabels } from "@/lib/validations/editorial";

/** Published reports as cards: what they cover, who wrote them, and whether they were corrected or retracted. */
export function ReportCards({ reports, headingLevel = 2 }: { reports: ReadableReportSummary[]; headingLevel?: 2 | 3 }) {
  const Heading = headingLevel === 2 ? "h2" : "h3";
  return (
    <ul className="grid gap-4 md:grid-cols-2">
      {reports.map((report) => (
        <li key={report.slug} className="flex flex-col gap-2 rounded border border-rule bg-paper-raised p-4">
          <p className="text-xs uppercase tracking-wide text-ink-faint">{report.tools}</p>
          <Heading className="font-serif text-xl">
            <Link href={`/reports/${report.slug}`} className="hover:text-copper">
              {report.title}
            </Link>
          </Heading>
          <p className="text-sm text-ink-soft">
            By {report.authorName}
            {report.firstPublishedAt ? ` · published ${formatDate(report.firstPublishedAt)}` : ""}
          </p>
          <VerdictSummary results={report.verdictResults} retracted={report.status === "retracted"} />
          <p className="flex flex-wrap gap-2 text-xs">
            {report.status === "retracted" ? <span className="rounded bg-verdict-above px-2 py-0.5 font-semibold text-white">Retracted</span> : null}
            {report.revisionKind !== "original" ? (
              <span className="rounded border border-rule px-2 py-0.5">
                {revisionKindLabels[report.revisionKind]} (revision {report.revisionNumber}){report.revisedAt ? `, ${formatDate(report.revisedAt)}` : ""}
              </span>
            ) : null}
          </p>
        </li>
      ))}
    </ul>
  );
}

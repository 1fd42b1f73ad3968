import Link from "next/link";
import { formatDate } from "@/lib/format";
import type { PublishedReportRef, PublishedRunContext } from "@/lib/published-results";

// Three columns (what, one tool, the other) fit a phone when they wrap, so these tables need no sideways scrolling.
export const compareTableClass = "w-full text-left text-sm";
export const compareHeadClass = "bg-paper-sunk text-xs uppercase tracking-wide text-ink-soft";

/** Where a figure came from: the report (and its revision) and the run, linked so a reader can check it. */
export function SourceLine({ report, run }: { report: PublishedReportRef; run: PublishedRunContext | null }) {
  return (
    <span className="block text-xs text-ink-faint">
      <Link href={`/reports/${report.slug}/revisions/${report.revisionNumber}`} className="underline decoration-rule underline-offset-2 hover:text-copper">
        {report.title}
      </Link>
      , revision {report.revisionNumber} of {formatDate(new Date(report.publishedAt))}
      {run ? ` · run of ${run.testedOn} at ${run.labName}` : ""}
    </span>
  );
}

import Link from "next/link";
import type { ReactNode } from "react";
import { formatDate } from "@/lib/format";
import type { PublishedReportRef, PublishedRunContext } from "@/lib/published-results";
import type { CompareSide } from "@/lib/validations/compare";

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

/** A row of a side-by-side table; `words` marks values that are words, set in the text face instead of the figures' one. */
export type SideBySideRow<T> = { label: string; value: (side: T) => ReactNode; words?: true };

/** What, then one column per tool, each value read from that tool's side; "—" where a tool has nothing to read. */
export function SideBySideTable<T>({ caption, rows, a, b, names }: { caption: string; rows: SideBySideRow<T>[]; a: T | null; b: T | null; names: Record<CompareSide, string> }) {
  return (
    <table className={compareTableClass}>
      <caption className="sr-only">{caption}</caption>
      <thead className={compareHeadClass}>
        <tr>
          <td className="px-3 py-2" />
          <th scope="col" className="px-3 py-2">{names.a}</th>
          <th scope="col" className="px-3 py-2">{names.b}</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((row) => (
          <tr key={row.label} className="border-t border-rule align-top">
            <th scope="row" className="px-3 py-2 font-semibold">{row.label}</th>
            {[a, b].map((side, index) => (
              <td key={index} className={`${row.words ? "" : "figure "}px-3 py-2`}>
                {side === null ? "—" : row.value(side)}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

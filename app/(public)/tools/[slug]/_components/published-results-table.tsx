import Link from "next/link";
import type { ReactNode } from "react";
import { conditionLines } from "@/components/published-report/runs-measured";
import { embedHeadClass } from "@/components/report-embeds/embed-figure";
import { decimalsForUncertainty, formatLimits, formatMeasured, formatNumber } from "@/components/report-embeds/figure-format";
import { VerdictBadge } from "@/components/report-embeds/verdict-badge";
import { TableScroller } from "@/components/ui/table-scroller";
import { formatDate } from "@/lib/format";
import { groupResultsByQuantity, type PublishedResult, type ResultGroup } from "@/lib/published-results";

const ruleLabels = { simple: "simple acceptance", guarded: "guarded acceptance (w = U)" } as const;

const linkClass = "underline decoration-rule underline-offset-4 hover:text-copper";

function ReportCell({ result: { report } }: { result: PublishedResult }) {
  return (
    <>
      <Link href={`/reports/${report.slug}`} className={`font-semibold ${linkClass}`}>
        {report.title}
      </Link>
      <span className="block text-xs">
        <Link href={`/reports/${report.slug}/revisions/${report.revisionNumber}`} className={linkClass}>
          revision {report.revisionNumber}
        </Link>
        , {formatDate(new Date(report.publishedAt))}
      </span>
      {report.retracted ? <span className="mt-1 inline-block rounded bg-verdict-above px-2 py-0.5 text-xs font-semibold text-white">Retracted</span> : null}
    </>
  );
}

function MeasuredCell({ result }: { result: PublishedResult }) {
  return (
    <>
      <span className={`figure whitespace-nowrap ${result.report.retracted ? "line-through" : ""}`}>
        {formatMeasured(result.value, result.expandedUncertainty, result.unit)}
      </span>
      {result.verdict?.normalizedTo ? <span className="block text-xs">normalised to {result.verdict.normalizedTo} V</span> : null}
      <span className="block text-xs">{result.analysis ? `capture analysis “${result.analysis.label}”` : "manual readings"}</span>
    </>
  );
}

function VerdictCell({ result: { verdict, unit } }: { result: PublishedResult }) {
  if (!verdict) return <>not judged</>;
  return (
    <>
      <VerdictBadge result={verdict.result} />
      <span className="figure block text-xs">
        limits {formatLimits(verdict.acceptanceLower, verdict.acceptanceUpper, unit, decimalsForUncertainty(verdict.expandedUncertainty))}
      </span>
      <span className="block text-xs">{ruleLabels[verdict.rule]}</span>
    </>
  );
}

function SupplyCell({ result: { run } }: { result: PublishedResult }) {
  const [supply, ...conditions] = conditionLines(run.conditions);
  return (
    <>
      <span className="figure">{supply?.[1]}</span>
      <span className="block text-xs">{conditions.map(([label, value]) => `${label.toLowerCase()} ${value}`).join(" · ")}</span>
    </>
  );
}

type Column = { header: string; width: string; render: (result: PublishedResult) => ReactNode };

// The columns once, for the wide table and for the phone's stacked cards alike; the report heads each row.
const reportColumn: Column = { header: "Report", width: "w-[19%]", render: (result) => <ReportCell result={result} /> };
const figureColumns: Column[] = [
  { header: "Rated", width: "w-[8%]", render: (result) => <span className="figure whitespace-nowrap">{result.verdict ? `${formatNumber(result.verdict.rated)} ${result.unit}` : "—"}</span> },
  { header: "Measured ± U (k = 2)", width: "w-[15%]", render: (result) => <MeasuredCell result={result} /> },
  { header: "Verdict", width: "w-[14%]", render: (result) => <VerdictCell result={result} /> },
  {
    header: "Tested",
    width: "w-[10%]",
    render: ({ run }) => (
      <>
        <span className="figure whitespace-nowrap">{run.testedOn}</span>
        <span className="block text-xs">{run.labName}</span>
      </>
    ),
  },
  {
    header: "Protocol",
    width: "w-[12%]",
    render: ({ run }) => (
      <>
        {run.protocol.name}
        <span className="block text-xs">version {run.protocol.version}</span>
      </>
    ),
  },
  { header: "Supply and conditions", width: "w-[22%]", render: (result) => <SupplyCell result={result} /> },
];

// A report may hold several results of one quantity on one run (a manual reading beside a capture's), hence the index.
const resultKey = (result: PublishedResult, index: number) => `${result.report.slug}-${result.run.id}-${index}`;

function mutedIfRetracted(result: PublishedResult): string {
  return result.report.retracted ? "bg-paper-sunk text-ink-faint" : "";
}

function QuantityResults({ group }: { group: ResultGroup }) {
  const headingId = `results-${group.kind}`;
  return (
    <section aria-labelledby={headingId} className="space-y-2">
      <h3 id={headingId} className="font-serif text-xl">
        {group.quantity}
      </h3>
      <TableScroller label={`${group.quantity}: every published result`} className="hidden rounded border border-rule bg-paper-raised md:block">
        <table className="w-full min-w-[56rem] table-fixed text-left text-sm">
          <caption className="sr-only">{group.quantity}: every published result</caption>
          <thead className={embedHeadClass}>
            <tr>
              {[reportColumn, ...figureColumns].map((column) => (
                <th key={column.header} scope="col" className={`px-3 py-2 ${column.width}`}>
                  {column.header}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {group.results.map((result, index) => (
              <tr key={resultKey(result, index)} className={`border-t border-rule align-top ${mutedIfRetracted(result)}`}>
                <th scope="row" className="px-3 py-2 text-left font-normal">
                  {reportColumn.render(result)}
                </th>
                {figureColumns.map((column) => (
                  <td key={column.header} className="px-3 py-2">
                    {column.render(result)}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </TableScroller>
      <ol className="space-y-3 md:hidden">
        {group.results.map((result, index) => (
          <li key={resultKey(result, index)} className={`rounded border border-rule bg-paper-raised p-3 text-sm ${mutedIfRetracted(result)}`}>
            <div>{reportColumn.render(result)}</div>
            <dl className="mt-2 grid grid-cols-[minmax(6rem,auto)_1fr] gap-x-3 gap-y-2">
              {figureColumns.map((column) => (
                <div key={column.header} className="contents">
                  <dt className="text-xs uppercase tracking-wide text-ink-soft">{column.header}</dt>
                  <dd>{column.render(result)}</dd>
                </div>
              ))}
            </dl>
          </li>
        ))}
      </ol>
    </section>
  );
}

/**
 * Every published result for a tool, grouped by quantity: what each report's current revision froze, across reports
 * and protocol versions. Results of retracted reports stay for the record, struck through and marked.
 */
export function PublishedResultsTable({ results }: { results: PublishedResult[] }) {
  const groups = groupResultsByQuantity(results);
  const reportCount = new Set(results.map((result) => result.report.slug)).size;
  const retracted = [...new Map(results.filter((result) => result.report.retracted).map((result) => [result.report.slug, result.report])).values()];
  return (
    <section aria-labelledby="results-heading" className="space-y-6">
      <div className="space-y-2">
        <h2 id="results-heading" className="font-serif text-2xl">
          Every published result
        </h2>
        {groups.length === 0 ? (
          <p className="text-ink-soft">No report with measurements of this tool has been published yet.</p>
        ) : (
          <p className="max-w-3xl text-sm text-ink-soft">
            {results.length} {results.length === 1 ? "result" : "results"} from {reportCount} published {reportCount === 1 ? "report" : "reports"}, each as the
            report&apos;s current revision froze it. Measured values carry their expanded uncertainty U (k = 2); runs differ in protocol version, supply and
            conditions, so read those before comparing two results.
          </p>
        )}
      </div>
      {retracted.length ? (
        <div role="note" className="max-w-3xl border-l-4 border-verdict-above bg-paper-raised px-4 py-3 text-sm">
          <p className="font-semibold">Results of retracted reports are kept for the record, struck through and marked Retracted. Do not rely on them.</p>
          <ul className="mt-1 list-disc space-y-1 pl-5 text-ink-soft">
            {retracted.map((report) => (
              <li key={report.slug}>
                <Link href={`/reports/${report.slug}`} className={linkClass}>
                  {report.title}
                </Link>
                : {report.retractionReason ?? "no reason was given"}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {groups.map((group) => (
        <QuantityResults key={group.kind} group={group} />
      ))}
    </section>
  );
}

import Link from "next/link";
import { ReportCards } from "@/components/published-report/report-cards";
import { RequestStatusBadge } from "@/components/request-status-badge";
import { listMeasurementRequests } from "@/db/queries/measurement-requests";
import { formatDate } from "@/lib/format";
import { loadLatestReports, loadToolsWithNewestResults } from "@/lib/reader-lists";
import { catalogueDefaultPerPage, catalogueSearchParams, toolCategoryLabels } from "@/lib/validations/catalogue";

const homeListLengths = { reports: 4, requests: 5, tools: 6 } as const;

const newestResultsCatalogue = `/tools?${catalogueSearchParams({ published: "yes", sort: "newestResult", page: 1, perPage: catalogueDefaultPerPage })}`;

const sectionLink = "text-sm font-semibold text-copper underline-offset-4 hover:underline";

export default async function HomePage() {
  const [reports, tools, { requests }] = await Promise.all([
    loadLatestReports({ limit: homeListLengths.reports }),
    loadToolsWithNewestResults(homeListLengths.tools),
    // Read on every request, not cached: vote counts move with every vote, and the query is one short indexed list.
    listMeasurementRequests({ status: "wanted", page: 1, perPage: homeListLengths.requests, viewerId: null }),
  ]);
  return (
    <div className="space-y-12">
      <section className="max-w-3xl space-y-4">
        <p className="text-sm font-semibold uppercase tracking-widest text-copper">Bench-tested, with the numbers shown</p>
        <h1 className="font-serif text-4xl sm:text-display">What the rating plate says, and what the bench measured</h1>
        <p className="font-serif text-lg text-ink-soft">
          Reviewers test hot-air rework stations, soldering stations and heat guns under a written protocol, capture current and
          voltage on the bench, and publish true RMS current, real power, burst-fire patterns, harmonics and the flicker a tool can
          cause on a shared supply, each judged against its rating with the measurement uncertainty stated.
        </p>
      </section>

      <section aria-labelledby="latest-reports-heading" className="space-y-4">
        <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
          <h2 id="latest-reports-heading" className="font-serif text-2xl">
            Latest reports
          </h2>
          <p className="flex flex-wrap gap-x-4">
            <Link href="/reports" className={sectionLink}>
              All reports
            </Link>
            <a href="/feed.xml" className={sectionLink}>
              Atom feed of reports and corrections
            </a>
          </p>
        </div>
        {reports.length === 0 ? <p className="text-ink-soft">Nothing is published yet.</p> : <ReportCards reports={reports} headingLevel={3} />}
      </section>

      <div className="grid gap-12 lg:grid-cols-2">
        <section aria-labelledby="wanted-heading" className="space-y-4">
          <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
            <h2 id="wanted-heading" className="font-serif text-2xl">
              Most-wanted measurements
            </h2>
            <Link href="/requests" className={sectionLink}>
              All requests
            </Link>
          </div>
          {requests.length === 0 ? (
            <p className="text-ink-soft">No reader is waiting on a measurement right now.</p>
          ) : (
            <ol className="divide-y divide-rule rounded border border-rule bg-paper-raised">
              {requests.map((request) => (
                <li key={request.id} className="flex gap-4 px-4 py-3">
                  <p className="flex min-w-14 flex-col items-center text-sm">
                    <span className="figure text-lg leading-tight">{request.voteCount}</span>
                    <span className="text-xs text-ink-faint">{request.voteCount === 1 ? "vote" : "votes"}</span>
                  </p>
                  <div className="min-w-0 flex-1 space-y-1">
                    <div className="flex flex-wrap items-center gap-2">
                      <h3 className="font-serif text-lg">
                        <Link href={`/requests/${request.id}`} className="hover:text-copper">
                          {request.toolName}
                        </Link>
                      </h3>
                      <RequestStatusBadge status={request.status} />
                    </div>
                    <p className="line-clamp-2 text-sm text-ink-soft">{request.whatToMeasure}</p>
                  </div>
                </li>
              ))}
            </ol>
          )}
        </section>

        <section aria-labelledby="newest-results-heading" className="space-y-4">
          <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
            <h2 id="newest-results-heading" className="font-serif text-2xl">
              Tools with the newest results
            </h2>
            <Link href={newestResultsCatalogue} className={sectionLink}>
              All tested tools
            </Link>
          </div>
          {tools.length === 0 ? (
            <p className="text-ink-soft">No tool has published results yet.</p>
          ) : (
            <ul className="divide-y divide-rule rounded border border-rule bg-paper-raised">
              {tools.map((tool) => (
                <li key={tool.slug} className="space-y-1 px-4 py-3">
                  <h3 className="font-serif text-lg">
                    <Link href={`/tools/${tool.slug}`} className="hover:text-copper">
                      {tool.maker} {tool.model}
                    </Link>
                  </h3>
                  <p className="text-sm text-ink-soft">
                    {toolCategoryLabels[tool.category]}
                    {tool.newestResultAt ? ` · results of ${formatDate(new Date(tool.newestResultAt))}` : ""} ·{" "}
                    <span className="whitespace-nowrap">
                      <span className="figure">{tool.publishedReports}</span> {tool.publishedReports === 1 ? "report" : "reports"}
                    </span>
                  </p>
                </li>
              ))}
            </ul>
          )}
        </section>
      </div>
    </div>
  );
}

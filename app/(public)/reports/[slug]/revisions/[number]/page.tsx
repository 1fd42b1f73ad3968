import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ReportArticle } from "@/components/published-report/report-article";
import { RetractionBanner, RevisionNotice } from "@/components/published-report/revision-notices";
import { RevisionHistory } from "@/components/published-report/revision-history";
import { getReadableReport, listPublishedRevisions } from "@/db/queries/editorial";
import { formatDate } from "@/lib/format";
import { loadRevisionForReaders } from "@/lib/published-reports";

export const metadata: Metadata = { title: "Report revision" };

/** One revision at its own address, with the numbers it published, however the report changed since. */
export default async function ReportRevisionPage({ params }: PageProps<"/reports/[slug]/revisions/[number]">) {
  const { slug, number } = await params;
  const report = await getReadableReport({ slug });
  if (!report) notFound();
  const revisions = await listPublishedRevisions({ reportId: report.id });
  const entry = revisions.find((candidate) => String(candidate.number) === number);
  if (!entry) notFound();
  const shown = await loadRevisionForReaders({ slug, reportId: report.id, revisionId: entry.id });
  if (!shown) notFound();
  const current = entry.id === report.publishedRevisionId;
  return (
    <div className="space-y-10">
      <ReportArticle
        content={shown.revision.content}
        embeds={shown.embeds}
        body={shown.body}
        retracted={report.status === "retracted"}
        meta={<>Revision {entry.number}, published {formatDate(new Date(shown.revision.publishedAt))}</>}
        notices={
          <>
            {report.status === "retracted" ? <RetractionBanner retractedAt={report.retractedAt} reason={report.retractionReason} /> : null}
            <div role="note" className="max-w-3xl rounded border border-rule bg-paper-sunk px-4 py-3 text-sm">
              {current ? (
                <>This is the current revision. </>
              ) : (
                <>
                  <strong>An earlier revision.</strong> Its figures are as they were published then.{" "}
                </>
              )}
              <Link href={`/reports/${slug}`} className="text-copper underline">
                Read the report as it stands
              </Link>
            </div>
            <RevisionNotice slug={slug} revision={shown.revision} />
          </>
        }
      />
      <RevisionHistory slug={slug} revisions={revisions} current={entry.number} />
    </div>
  );
}

import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { MakerReplies } from "@/components/published-report/maker-replies";
import { OpenDataDownloads } from "@/components/published-report/open-data-downloads";
import { ReportArticle } from "@/components/published-report/report-article";
import { RetractionBanner, RevisionNotice } from "@/components/published-report/revision-notices";
import { RevisionHistory } from "@/components/published-report/revision-history";
import { listMakerReplies, listPublishedRevisions } from "@/db/queries/editorial";
import { formatDate } from "@/lib/format";
import { loadReadableReport, loadRevisionForReaders } from "@/lib/published-reports";
import { CommentsSection } from "./_components/comments-section";

export async function generateMetadata({ params }: PageProps<"/reports/[slug]">): Promise<Metadata> {
  const report = await loadReadableReport((await params).slug);
  if (!report) return { title: "Report not found" };
  const shown = await loadRevisionForReaders({ slug: report.slug, reportId: report.id, revisionId: report.publishedRevisionId });
  return { title: shown ? `${report.status === "retracted" ? "Retracted: " : ""}${shown.revision.content.title}` : "Report" };
}

export default async function ReportPage({ params }: PageProps<"/reports/[slug]">) {
  const report = await loadReadableReport((await params).slug);
  if (!report) notFound();
  const [shown, revisions, replies] = await Promise.all([
    loadRevisionForReaders({ slug: report.slug, reportId: report.id, revisionId: report.publishedRevisionId }),
    listPublishedRevisions({ reportId: report.id }),
    listMakerReplies({ reportId: report.id }),
  ]);
  if (!shown) notFound();
  const { revision } = shown;
  return (
    <div className="space-y-10">
      <ReportArticle
        content={revision.content}
        embeds={shown.embeds}
        body={shown.body}
        retracted={report.status === "retracted"}
        downloads={<OpenDataDownloads slug={report.slug} revisionNumber={revision.number} retracted={report.status === "retracted"} />}
        meta={
          <>
            Published {report.firstPublishedAt ? formatDate(report.firstPublishedAt) : ""}
            {revision.number > 1 ? ` · revision ${revision.number} of ${formatDate(new Date(revision.publishedAt))}` : ""}
          </>
        }
        notices={
          <>
            {report.status === "retracted" ? <RetractionBanner retractedAt={report.retractedAt} reason={report.retractionReason} /> : null}
            <RevisionNotice slug={report.slug} revision={revision} />
          </>
        }
      />
      <RevisionHistory slug={report.slug} revisions={revisions} current={revision.number} />
      <MakerReplies replies={replies} />
      <CommentsSection report={report} />
    </div>
  );
}

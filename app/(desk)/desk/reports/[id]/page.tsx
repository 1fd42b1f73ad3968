import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { MakerReplies } from "@/components/published-report/maker-replies";
import { ReportArticle } from "@/components/published-report/report-article";
import { RetractionBanner } from "@/components/published-report/revision-notices";
import { RevisionDiffView } from "@/components/published-report/revision-diff-view";
import { embedComponents } from "@/components/report-embeds/embed-components";
import { db } from "@/db";
import { getDeskReport, getPublishedRevision, listDecisions, listMakerReplies, listRevisionsForDesk } from "@/db/queries/editorial";
import { freezeReport } from "@/lib/editorial";
import { formatDateTime } from "@/lib/format";
import { renderSafeMdx } from "@/lib/mdx/render";
import { assembleReportEmbeds } from "@/lib/report-embeds";
import { bodyChanges, changedFigures } from "@/lib/revision-diff";
import { requirePagePermission } from "@/lib/session";
import { revisionKindLabels } from "@/lib/validations/editorial";
import { DecisionForms, MakerReplyForm, RetractForm } from "./_components/decision-forms";
import { DecisionHistory } from "./_components/decision-history";

export const metadata: Metadata = { title: "Report on the desk" };

const statusWords = {
  draft: "a draft the reviewer has not submitted",
  submitted: "submitted for review",
  changes_requested: "sent back to the reviewer",
  published: "published",
  retracted: "retracted",
} as const;

export default async function DeskReportPage({ params }: PageProps<"/desk/reports/[id]">) {
  const { id } = await params;
  await requirePagePermission("desk:use", `/desk/reports/${id}`);
  const report = /^[0-9a-f-]{36}$/i.test(id) ? await getDeskReport({ id }) : null;
  if (!report) notFound();
  const [decisions, revisions, replies] = await Promise.all([listDecisions({ reportId: id }), listRevisionsForDesk({ reportId: id }), listMakerReplies({ reportId: id })]);
  const open = revisions.find((revision) => revision.status === "pending" || revision.status === "scheduled") ?? null;
  const waiting = report.status === "submitted" || (report.status === "published" && open !== null);

  // What approval would publish: the report frozen now, exactly as the approve action freezes it.
  const preview = waiting ? await db.transaction((tx) => freezeReport(tx, { reportId: id }), { accessMode: "read only" }) : null;
  const previewEmbeds = preview ? assembleReportEmbeds(preview.content) : null;
  const published = report.publishedRevisionId ? await getPublishedRevision({ reportId: id, revisionId: report.publishedRevisionId }) : null;

  return (
    <div className="space-y-8">
      <header className="space-y-2">
        <p className="text-sm text-ink-faint">
          <Link href="/desk" className="underline hover:text-copper">
            Editor&apos;s desk
          </Link>{" "}
          · {report.tools} · by {report.authorName}
        </p>
        <h1 className="font-serif text-3xl">{report.title}</h1>
        <p role="status" className="text-ink-soft">
          This report is {statusWords[report.status]}
          {open?.status === "scheduled" && open.scheduledFor ? `; revision ${open.number} is scheduled for ${formatDateTime(open.scheduledFor)}` : ""}
          {open?.status === "pending" && open.kind !== "original" ? `; revision ${open.number} (${revisionKindLabels[open.kind].toLowerCase()}) waits for a decision` : ""}.
          {report.status === "published" || report.status === "retracted" ? (
            <>
              {" "}
              <Link href={`/reports/${report.slug}`} className="text-copper underline">
                Read it as published
              </Link>
            </>
          ) : null}
        </p>
      </header>

      {waiting ? <DecisionForms reportId={report.id} isRevision={report.status === "published"} /> : null}

      <div className="grid gap-6 lg:grid-cols-2">
        <DecisionHistory decisions={decisions} />
        <section aria-labelledby="revisions-heading" className="space-y-2">
          <h2 id="revisions-heading" className="font-serif text-2xl">
            Revisions
          </h2>
          {revisions.length === 0 ? (
            <p className="text-sm text-ink-soft">None yet: approval makes revision 1.</p>
          ) : (
            <ol className="divide-y divide-rule rounded border border-rule bg-paper-raised text-sm">
              {revisions.map((revision) => (
                <li key={revision.id} className="px-4 py-2">
                  <strong>Revision {revision.number}</strong> · {revisionKindLabels[revision.kind]} · {revision.status}
                  {revision.publishedAt ? ` ${formatDateTime(revision.publishedAt)}` : ""} · proposed by {revision.proposedByName ?? "a deleted account"}
                  <span className="block text-ink-soft">{revision.changeNote}</span>
                </li>
              ))}
            </ol>
          )}
        </section>
      </div>

      {report.status === "published" ? (
        <div className="grid items-start gap-4 lg:grid-cols-2">
          <RetractForm reportId={report.id} />
          <MakerReplyForm reportId={report.id} />
        </div>
      ) : report.status === "retracted" ? (
        <MakerReplyForm reportId={report.id} />
      ) : null}
      <MakerReplies replies={replies} />

      {preview && previewEmbeds && published && open ? (
        <section aria-labelledby="proposed-changes-heading" className="space-y-3">
          <h2 id="proposed-changes-heading" className="font-serif text-2xl">
            What revision {open.number} changes
          </h2>
          <p className="text-sm">Change note: {open.changeNote}</p>
          <RevisionDiffView
            from={published.number}
            to={open.number}
            figures={changedFigures(published.content, preview.content)}
            body={bodyChanges(published.bodyMdx, preview.bodyMdx)}
          />
        </section>
      ) : null}

      {preview && previewEmbeds ? (
        <section aria-label="The report as it would be published" className="rounded border-2 border-dashed border-rule p-4">
          <p className="mb-4 text-sm font-semibold uppercase tracking-wide text-ink-faint">As readers would see it once approved</p>
          <ReportArticle
            content={preview.content}
            embeds={previewEmbeds}
            body={renderSafeMdx(preview.bodyMdx, { embeds: embedComponents(previewEmbeds) }).content}
            meta={<>Not published yet</>}
          />
        </section>
      ) : report.status === "retracted" ? (
        <RetractionBanner retractedAt={report.retractedAt} reason={report.retractionReason} />
      ) : null}
    </div>
  );
}

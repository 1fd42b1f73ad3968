import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { RevisionDiffView } from "@/components/published-report/revision-diff-view";
import { getReadableReport, listPublishedRevisions } from "@/db/queries/editorial";
import { loadRevisionForReaders } from "@/lib/published-reports";
import { bodyChanges, changedFigures } from "@/lib/revision-diff";

export const metadata: Metadata = { title: "Changes between revisions" };

export default async function RevisionDiffPage({ params, searchParams }: PageProps<"/reports/[slug]/diff">) {
  const [{ slug }, query] = await Promise.all([params, searchParams]);
  const report = await getReadableReport({ slug });
  if (!report) notFound();
  const revisions = await listPublishedRevisions({ reportId: report.id });
  const latest = revisions.at(-1);
  const to = revisions.find((revision) => String(revision.number) === (typeof query.to === "string" ? query.to : String(latest?.number)));
  const from = revisions.find((revision) => String(revision.number) === (typeof query.from === "string" ? query.from : String((to?.number ?? 1) - 1)));
  if (!from || !to || from.number === to.number) {
    return (
      <section className="max-w-3xl space-y-3">
        <h1 className="font-serif text-3xl">Changes between revisions</h1>
        <p className="text-ink-soft">
          {revisions.length < 2 ? "This report has only one revision." : "Choose two different revisions of this report."}{" "}
          <Link href={`/reports/${slug}`} className="text-copper underline">
            Back to the report
          </Link>
        </p>
      </section>
    );
  }
  const [before, after] = await Promise.all([
    loadRevisionForReaders({ slug, reportId: report.id, revisionId: from.id }),
    loadRevisionForReaders({ slug, reportId: report.id, revisionId: to.id }),
  ]);
  if (!before || !after) notFound();
  return (
    <section className="space-y-6">
      <header className="max-w-3xl space-y-2">
        <p className="text-sm">
          <Link href={`/reports/${slug}`} className="text-copper underline">
            {after.revision.content.title}
          </Link>
        </p>
        <h1 className="font-serif text-3xl">
          Changes from revision {from.number} to revision {to.number}
        </h1>
        <p className="whitespace-pre-line text-ink-soft">Revision {to.number}: {to.changeNote}</p>
      </header>
      <RevisionDiffView
        from={from.number}
        to={to.number}
        figures={changedFigures(before.revision.content, after.revision.content)}
        body={bodyChanges(before.revision.bodyMdx, after.revision.bodyMdx)}
      />
    </section>
  );
}

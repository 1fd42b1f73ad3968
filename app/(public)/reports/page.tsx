import type { Metadata } from "next";
import Link from "next/link";
import { listReadableReports } from "@/db/queries/editorial";
import { formatDate } from "@/lib/format";
import { revisionKindLabels } from "@/lib/validations/editorial";

export const metadata: Metadata = { title: "Reports" };

export default async function ReportsPage() {
  const reports = await listReadableReports();
  return (
    <section className="space-y-6">
      <header className="max-w-3xl space-y-2">
        <h1 className="font-serif text-4xl">Reports</h1>
        <p className="font-serif text-lg text-ink-soft">
          Every published bench report, newest first. A corrected report says so at the top and keeps each earlier revision; a retracted one stays readable
          with the reason.
        </p>
      </header>
      <ul className="grid gap-4 md:grid-cols-2">
        {reports.map((report) => (
          <li key={report.slug} className="flex flex-col gap-2 rounded border border-rule bg-paper-raised p-4">
            <p className="text-xs uppercase tracking-wide text-ink-faint">{report.tools}</p>
            <h2 className="font-serif text-xl">
              <Link href={`/reports/${report.slug}`} className="hover:text-copper">
                {report.title}
              </Link>
            </h2>
            <p className="text-sm text-ink-soft">
              By {report.authorName}
              {report.firstPublishedAt ? ` · published ${formatDate(report.firstPublishedAt)}` : ""}
            </p>
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
      {reports.length === 0 ? <p className="text-ink-soft">Nothing is published yet.</p> : null}
    </section>
  );
}

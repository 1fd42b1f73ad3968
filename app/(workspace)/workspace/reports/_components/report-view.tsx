import Link from "next/link";
import { embedComponents } from "@/components/report-embeds/embed-components";
import { loadReportEmbeds, type ReportDetail } from "@/db/queries/reports";
import { listCalibrationWarnings } from "@/db/queries/runs";
import { renderSafeMdx } from "@/lib/mdx/render";
import { CalibrationWarnings } from "./calibration-warnings";
import { reportStatusLabels } from "./report-status";

/** The saved report as a reader will see it: the same sanitised MDX and the same embeds as the live preview. */
export async function ReportView({ report }: { report: ReportDetail }) {
  const [embeds, warnings] = await Promise.all([
    loadReportEmbeds({ reportId: report.id }),
    listCalibrationWarnings({ runIds: [...new Set(report.citations.map((citation) => citation.runId))] }),
  ]);
  const { content } = renderSafeMdx(report.bodyMdx, { embeds: embedComponents(embeds) });
  const toolOfRun = new Map(report.citations.map((citation) => [citation.runId, citation.toolName]));
  return (
    <article className="space-y-6">
      <header className="space-y-2">
        <p className="text-sm text-ink-faint">
          {reportStatusLabels[report.status]} · <Link href={`/workspace/reports/${report.id}`} className="underline hover:text-copper">back to the report&apos;s page</Link>
        </p>
        <h1 className="font-serif text-display">{report.title}</h1>
        <p className="text-ink-soft">
          By {report.authorName} · {report.tools.map((tool) => tool.name).join(" vs ")}
        </p>
      </header>
      <CalibrationWarnings warnings={warnings} toolOfRun={toolOfRun} />
      <div className="prose prose-stone max-w-3xl font-serif prose-headings:font-serif">{content}</div>
      <section aria-labelledby="disclosure-heading" className="max-w-3xl rounded border border-rule bg-paper-raised px-4 py-3 text-sm">
        <h2 id="disclosure-heading" className="font-semibold">Disclosure</h2>
        <p className="mt-1 whitespace-pre-line text-ink-soft">{report.disclosure || "No disclosure written yet."}</p>
      </section>
    </article>
  );
}

import Link from "next/link";
import type { ReactNode } from "react";
import { SafetyNotice } from "@/components/safety-notice";
import { SpecTable } from "@/components/report-embeds/spec-table";
import { VerdictTable } from "@/components/report-embeds/verdict-table";
import type { FrozenReportContent } from "@/db/schema";
import type { ReportEmbeds } from "@/lib/report-embeds";
import { RunsMeasured } from "./runs-measured";

/**
 * A report as readers see it, drawn only from a revision's frozen content: the title and byline, the notices the page
 * needs (correction, retraction), the body, every verdict, how the runs were made, the safety cautions (the standard
 * notice and the protocol's own) and the disclosure. The desk shows a report waiting for approval through the same component.
 */
export function ReportArticle({
  content,
  embeds,
  body,
  meta,
  notices,
  retracted = false,
  downloads,
}: {
  content: FrozenReportContent;
  embeds: ReportEmbeds;
  body: ReactNode;
  meta: ReactNode;
  notices?: ReactNode;
  /** A retracted report keeps its figures for the record; every verdict says it was withdrawn. */
  retracted?: boolean;
  /** The measurements as open data, offered right under the verdicts they download. */
  downloads?: ReactNode;
}) {
  const judged = Object.values(embeds.analyses).filter((analysis) => analysis.verdicts.length > 0);
  const cautions = [...new Set(content.runs.map((run) => run.protocol.safetyCautions.trim()).filter(Boolean))];
  return (
    <article className="space-y-8">
      <header className="max-w-3xl space-y-3">
        <p className="text-sm font-semibold uppercase tracking-widest text-copper">{retracted ? "Retracted bench report" : "Bench report"}</p>
        <h1 className="font-serif text-4xl sm:text-display">{content.title}</h1>
        <p className="text-ink-soft">
          By {content.author.name} ·{" "}
          {content.tools.map((tool, index) => (
            <span key={tool.id}>
              {index > 0 ? " vs " : null}
              <Link href={`/tools/${tool.slug}`} className="underline decoration-rule underline-offset-4 hover:text-copper">
                {tool.name}
              </Link>
            </span>
          ))}
        </p>
        <div className="text-sm text-ink-faint">{meta}</div>
      </header>
      {notices}
      <div className="prose prose-stone max-w-3xl font-serif prose-headings:font-serif">{body}</div>

      <section aria-labelledby="verdicts-heading" className="space-y-2">
        <h2 id="verdicts-heading" className="font-serif text-2xl">
          Every verdict{retracted ? " (retracted)" : ""}
        </h2>
        {retracted ? (
          <p role="note" className="max-w-3xl border-l-4 border-verdict-above bg-copper-wash px-4 py-3 text-sm font-semibold text-copper-deep">
            Retracted with the report: the results and verdicts below are kept for the record only. Do not rely on them or compare them with other
            tools.
          </p>
        ) : null}
        <p className="max-w-3xl text-sm text-ink-soft">
          Each rating judged with the measured value, its expanded uncertainty (k = 2), the tolerance and the decision rule, exactly as they stood when this
          revision was approved.
        </p>
        {judged.map((analysis) => (
          <VerdictTable key={analysis.label} rows={analysis.verdicts} caption={`${analysis.tool.name}: analysis “${analysis.label}”`} />
        ))}
        {embeds.tools.map((tool) => (
          <SpecTable key={tool.slug} tool={tool} />
        ))}
        <ul className="space-y-1 text-sm">
          {embeds.tools.map((tool) => (
            <li key={tool.slug}>
              <Link href={`/tools/${tool.slug}#results-heading`} className="text-copper underline underline-offset-4 hover:text-copper-deep">
                Every published result for {tool.name}, across reports and protocol versions
              </Link>
            </li>
          ))}
        </ul>
      </section>
      {downloads}

      <RunsMeasured runs={content.runs} />

      <section aria-labelledby="cautions-heading" className="max-w-3xl space-y-2">
        <h2 id="cautions-heading" className="font-serif text-2xl">
          Safety
        </h2>
        <SafetyNotice />
        {cautions.length ? <p className="text-sm font-semibold">The protocol&apos;s own cautions:</p> : null}
        {cautions.map((caution) => (
          <p key={caution} className="whitespace-pre-line border-l-4 border-copper bg-copper-wash/60 px-4 py-3 text-sm text-ink-soft">
            {caution}
          </p>
        ))}
      </section>

      <section aria-labelledby="disclosure-heading" className="max-w-3xl rounded border border-rule bg-paper-raised px-4 py-3 text-sm">
        <h2 id="disclosure-heading" className="font-semibold">
          Disclosure
        </h2>
        <p className="mt-1 whitespace-pre-line text-ink-soft">{content.disclosure || "The reviewer declared no tie to the maker."}</p>
      </section>
    </article>
  );
}

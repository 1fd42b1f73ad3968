import type { ReactNode } from "react";
import { TableScroller } from "@/components/ui/table-scroller";

/**
 * The frame every embedded figure shares: a title and where the data came from, the drawing (hidden from screen
 * readers, which get the summary and the table instead), a one-paragraph summary in words, and optionally the data as
 * a table behind a disclosure.
 */
export function EmbedFigure({
  title,
  source,
  summary,
  table,
  children,
}: {
  title: string;
  source: string;
  summary: ReactNode;
  table?: ReactNode;
  children?: ReactNode;
}) {
  return (
    <figure className="not-prose my-6 rounded border border-rule bg-paper-raised p-4 font-sans">
      <figcaption className="mb-3">
        <span className="block font-serif text-lg text-ink">{title}</span>
        <span className="block text-xs text-ink-faint">{source}</span>
      </figcaption>
      {children ? <div aria-hidden="true">{children}</div> : null}
      <p className="mt-3 text-sm text-ink-soft">{summary}</p>
      {table ? (
        <details className="mt-2 text-sm">
          <summary className="cursor-pointer font-semibold text-ink">Data as a table</summary>
          <TableScroller label={`${title}: data`} className="mt-2">
            {table}
          </TableScroller>
        </details>
      ) : null}
    </figure>
  );
}

export const embedTableClass = "w-full min-w-[32rem] text-left text-sm";
export const embedHeadClass = "bg-paper-sunk text-xs uppercase tracking-wide text-ink-soft";

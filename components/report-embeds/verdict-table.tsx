import { EmptyTableRow } from "@/components/ui/empty-table-row";
import { TableScroller } from "@/components/ui/table-scroller";
import type { VerdictRow } from "@/lib/report-embeds";
import { embedHeadClass } from "./embed-figure";
import { decimalsForUncertainty, formatLimits, formatMeasured, formatNumber } from "./figure-format";
import { VerdictBadge } from "./verdict-badge";

const ruleLabels = { simple: "simple acceptance", guarded: "guarded acceptance (w = U)" } as const;

/** Each rating judged, with every number behind the verdict: usable on run pages as well as in reports. */
export function VerdictTable({ rows, caption }: { rows: VerdictRow[]; caption: string }) {
  return (
    <TableScroller label={caption} className="not-prose my-6 rounded border border-rule bg-paper-raised font-sans">
      <table className="w-full min-w-[48rem] text-left text-sm">
        <caption className="px-3 py-2 text-left font-serif text-lg text-ink">{caption}</caption>
        <thead className={embedHeadClass}>
          <tr>
            <th scope="col" className="px-3 py-2">Quantity</th>
            <th scope="col" className="px-3 py-2">Rated</th>
            <th scope="col" className="px-3 py-2">Measured ± U (k = 2)</th>
            <th scope="col" className="px-3 py-2">Tolerance limits</th>
            <th scope="col" className="px-3 py-2">Acceptance limits</th>
            <th scope="col" className="px-3 py-2">Decision rule</th>
            <th scope="col" className="px-3 py-2">Verdict</th>
          </tr>
        </thead>
        <tbody>
          {rows.map(({ quantity, unit, verdict }) => {
            const judged = verdict.normalized ?? verdict.measured;
            const decimals = decimalsForUncertainty(verdict.expandedUncertainty);
            return (
              <tr key={quantity} className="border-t border-rule align-top">
                <th scope="row" className="px-3 py-2 font-semibold">
                  {quantity}
                  <span className="block text-xs font-normal text-ink-faint">{verdict.tolerance.row ?? verdict.tolerance.description ?? ""} · {verdict.tolerance.source}</span>
                </th>
                <td className="figure px-3 py-2">{formatNumber(verdict.rated)} {unit}</td>
                <td className="figure px-3 py-2">
                  {formatMeasured(judged, verdict.expandedUncertainty, unit)}
                  {verdict.normalizedTo ? (
                    <span className="block text-xs text-ink-faint">
                      normalised to {verdict.normalizedTo} V from {formatNumber(verdict.measured)} {unit}
                    </span>
                  ) : null}
                </td>
                <td className="figure px-3 py-2">{formatLimits(verdict.lower, verdict.upper, unit, decimals)}</td>
                <td className="figure px-3 py-2">{formatLimits(verdict.acceptanceLower, verdict.acceptanceUpper, unit, decimals)}</td>
                <td className="px-3 py-2">{ruleLabels[verdict.rule]}</td>
                <td className="px-3 py-2">
                  <VerdictBadge result={verdict.result} />
                </td>
              </tr>
            );
          })}
          {rows.length === 0 ? (
            <EmptyTableRow columns={7} padding="py-4">No rating was judged in this analysis.</EmptyTableRow>
          ) : null}
        </tbody>
      </table>
    </TableScroller>
  );
}

import { decimalsForUncertainty, formatLimits, formatMeasured, formatNumber } from "@/components/report-embeds/figure-format";
import { VerdictBadge } from "@/components/report-embeds/verdict-badge";
import type { QuantityPair } from "@/lib/comparison";
import type { PublishedResult } from "@/lib/published-results";
import type { CompareSide } from "@/lib/validations/compare";
import { compareHeadClass, compareTableClass, SourceLine } from "./compare-table";
import { UncertaintyBars, type UncertaintyBarRow } from "./uncertainty-bars";

export const sideColorClass: Record<CompareSide, string> = { a: "text-copper", b: "text-verdigris" };

function barRow(side: CompareSide, result: PublishedResult): UncertaintyBarRow {
  return {
    key: side,
    colorClass: sideColorClass[side],
    value: result.value,
    expandedUncertainty: result.expandedUncertainty,
    rated: result.verdict?.rated ?? null,
    lower: result.verdict?.lower ?? null,
    upper: result.verdict?.upper ?? null,
  };
}

function ResultCells({ result, unit }: { result: PublishedResult | null; unit: string }) {
  if (!result) {
    return (
      <td colSpan={4} className="px-3 py-2 text-ink-faint">
        Not measured in a published report
      </td>
    );
  }
  const { verdict } = result;
  const decimals = decimalsForUncertainty(result.expandedUncertainty ?? verdict?.expandedUncertainty ?? 0);
  return (
    <>
      <td className="figure px-3 py-2">{verdict ? `${formatNumber(verdict.rated)} ${unit}` : "—"}</td>
      <td className="figure px-3 py-2">
        {formatMeasured(result.value, result.expandedUncertainty, unit)}
        {verdict?.normalizedTo ? <span className="block text-xs text-ink-faint">normalised to {verdict.normalizedTo} V</span> : null}
        <SourceLine report={result.report} run={result.run} />
      </td>
      <td className="figure px-3 py-2">{verdict ? formatLimits(verdict.lower, verdict.upper, unit, decimals) : "—"}</td>
      <td className="px-3 py-2">{verdict ? <VerdictBadge result={verdict.result} /> : <span className="text-ink-faint">no rating to judge</span>}</td>
    </>
  );
}

/**
 * Each quantity either tool has a published result for: rated against measured ± U (k = 2) with the tolerance and the
 * verdict, as a table, and the same figures drawn as uncertainty bars on one scale.
 */
export function QuantityComparison({ pairs, names }: { pairs: QuantityPair[]; names: Record<CompareSide, string> }) {
  if (pairs.length === 0) return <p className="text-ink-soft">Neither tool has a published measurement yet.</p>;
  return (
    <div className="space-y-6">
      <p className="flex flex-wrap items-center gap-x-4 gap-y-1 text-xs text-ink-soft" aria-hidden="true">
        <span className="flex items-center gap-1">
          <span className="inline-block size-3 rounded-full bg-copper" /> {names.a}
        </span>
        <span className="flex items-center gap-1">
          <span className="inline-block size-3 rounded-full bg-verdigris" /> {names.b}
        </span>
        <span className="flex items-center gap-1">
          <span className="inline-block h-3 w-0.5 bg-ink" /> rated value
        </span>
        <span className="flex items-center gap-1">
          <span className="inline-block h-3 w-5 bg-verdigris-wash" /> tolerance band
        </span>
        <span>bars: measured ± U (k = 2)</span>
      </p>
      {pairs.map((pair) => {
        const bars = (["a", "b"] as const).flatMap((side) => {
          const result = pair[side];
          return result ? [barRow(side, result)] : [];
        });
        return (
          <section key={pair.kind} aria-labelledby={`quantity-${pair.kind}`} className="rounded border border-rule bg-paper-raised p-4">
            <h3 id={`quantity-${pair.kind}`} className="font-serif text-lg">
              {pair.quantity}
            </h3>
            <div className="mt-2 overflow-x-auto">
              <table className={compareTableClass}>
                <caption className="sr-only">
                  {pair.quantity}: rated against measured for each tool
                </caption>
                <thead className={compareHeadClass}>
                  <tr>
                    <th scope="col" className="px-3 py-2">Tool</th>
                    <th scope="col" className="px-3 py-2">Rated</th>
                    <th scope="col" className="px-3 py-2">Measured ± U (k = 2)</th>
                    <th scope="col" className="px-3 py-2">Tolerance limits</th>
                    <th scope="col" className="px-3 py-2">Verdict</th>
                  </tr>
                </thead>
                <tbody>
                  {(["a", "b"] as const).map((side) => (
                    <tr key={side} className="border-t border-rule align-top">
                      <th scope="row" className="px-3 py-2 font-semibold">
                        <span className={`mr-1 inline-block size-2.5 rounded-full ${side === "a" ? "bg-copper" : "bg-verdigris"}`} aria-hidden="true" />
                        {names[side]}
                      </th>
                      <ResultCells result={pair[side]} unit={pair.unit} />
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
            <div className="mt-3">
              <UncertaintyBars rows={bars} unit={pair.unit} />
            </div>
          </section>
        );
      })}
    </div>
  );
}

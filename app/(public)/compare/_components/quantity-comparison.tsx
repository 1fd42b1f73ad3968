import { decimalsForUncertainty, formatLimits, formatMeasured, formatNumber } from "@/components/report-embeds/figure-format";
import { VerdictBadge } from "@/components/report-embeds/verdict-badge";
import type { QuantityPair } from "@/lib/comparison";
import type { PublishedResult } from "@/lib/published-results";
import type { CompareSide } from "@/lib/validations/compare";
import { SourceLine } from "./compare-table";
import { UncertaintyBars, type UncertaintyBarRow } from "./uncertainty-bars";

function barRow(side: CompareSide, result: PublishedResult): UncertaintyBarRow {
  return {
    side,
    value: result.value,
    expandedUncertainty: result.expandedUncertainty,
    rated: result.verdict?.rated ?? null,
    lower: result.verdict?.lower ?? null,
    upper: result.verdict?.upper ?? null,
  };
}

function ResultCard({ side, name, result, unit }: { side: CompareSide; name: string; result: PublishedResult | null; unit: string }) {
  const verdict = result?.verdict ?? null;
  const decimals = decimalsForUncertainty(result?.expandedUncertainty ?? verdict?.expandedUncertainty ?? 0);
  return (
    <div className={`rounded border border-rule border-l-4 p-3 ${side === "a" ? "border-l-copper" : "border-l-verdigris"}`}>
      <p className="font-semibold">{name}</p>
      {!result ? (
        <p className="mt-1 text-sm text-ink-faint">Not measured in a published report</p>
      ) : (
        <>
          <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
            <dt className="text-ink-soft">Measured ± U (k = 2)</dt>
            <dd>
              <span className="figure font-medium">{formatMeasured(result.value, result.expandedUncertainty, unit)}</span>
              {verdict?.normalizedTo ? <span className="block text-xs text-ink-faint">normalised to {verdict.normalizedTo} V</span> : null}
            </dd>
            <dt className="text-ink-soft">Rated</dt>
            {verdict ? <dd className="figure">{`${formatNumber(verdict.rated)} ${unit}`}</dd> : <dd className="text-ink-faint">no rating to judge against</dd>}
            {verdict ? (
              <>
                <dt className="text-ink-soft">Tolerance limits</dt>
                <dd className="figure">{formatLimits(verdict.lower, verdict.upper, unit, decimals)}</dd>
                <dt className="text-ink-soft">Verdict</dt>
                <dd>
                  <VerdictBadge result={verdict.result} />
                </dd>
              </>
            ) : null}
          </dl>
          <div className="mt-2">
            <SourceLine report={result.report} run={result.run} />
          </div>
        </>
      )}
    </div>
  );
}

/**
 * Each quantity either tool has a published result for: rated against measured ± U (k = 2) with the tolerance and the
 * verdict, the two tools side by side in words and figures, and the same figures drawn as uncertainty bars on one scale.
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
            <div className="mt-3 grid gap-3 md:grid-cols-2">
              {(["a", "b"] as const).map((side) => (
                <ResultCard key={side} side={side} name={names[side]} result={pair[side]} unit={pair.unit} />
              ))}
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

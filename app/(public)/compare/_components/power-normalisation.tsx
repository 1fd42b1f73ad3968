import { formatMeasured, formatNumber } from "@/components/report-embeds/figure-format";
import { VerdictBadge } from "@/components/report-embeds/verdict-badge";
import type { CatalogueTool } from "./catalogue-side-by-side";
import { formatRatedVoltage } from "@/lib/format";
import type { PublishedAnalysis, PublishedResult } from "@/lib/published-results";
import type { CompareSide } from "@/lib/validations/compare";
import { SourceLine } from "./compare-table";

export type PowerSide = { name: string; tool: CatalogueTool; result: PublishedResult | null; waveform: PublishedAnalysis | null };

/**
 * Why the bench code judged a power input as measured instead of at the rated voltage. The frozen verdict keeps the
 * numbers, not the note, so the reason is read from where the figure came from, as lib/bench/verdict decides it.
 */
function notNormalisedReason(result: PublishedResult, waveform: PublishedAnalysis | null): string {
  if (result.source === "manual") return "it was read by hand on a power meter, and a reading by hand is judged as read";
  const analysis = waveform?.analysisId === result.analysis?.id ? waveform : null;
  if (analysis?.waveform && analysis.waveform.voltage === null) {
    return "the capture had no voltage channel, so the power is an estimate from the nominal voltage";
  }
  return "the load did not behave as a fixed resistance while conducting (power factor below the limit for P ∝ U²), so scaling by voltage would not hold";
}

function PowerCard({ side, power }: { side: CompareSide; power: PowerSide }) {
  const { result, tool, name } = power;
  const supply = result ? (result.run.conditions.measuredSupplyVoltage ?? result.run.conditions.supplyVoltage) : null;
  return (
    <div className={`rounded border border-rule bg-paper-raised p-4 ${side === "a" ? "border-t-4 border-t-copper" : "border-t-4 border-t-verdigris"}`}>
      <h3 className="font-serif text-lg">{name}</h3>
      <p className="text-xs text-ink-faint">
        Rated {tool.ratedPowerW} W at {formatRatedVoltage(tool.ratedVoltageMin, tool.ratedVoltageMax)}
      </p>
      {!result ? (
        <p className="mt-3 text-sm text-ink-soft">No published power input at full demand.</p>
      ) : (
        <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
          <dt className="text-ink-soft">Measured at full demand</dt>
          <dd className="figure">
            {result.verdict ? `${formatNumber(result.verdict.measured)} W` : formatMeasured(result.value, result.expandedUncertainty, result.unit)}
            {supply !== null ? <span className="text-ink-faint"> on a {formatNumber(supply)} V supply</span> : null}
          </dd>
          {result.verdict?.normalized !== null && result.verdict?.normalizedTo ? (
            <>
              <dt className="text-ink-soft">At its own rated voltage</dt>
              <dd className="figure">
                {formatMeasured(result.verdict.normalized, result.verdict.expandedUncertainty, "W")} at {result.verdict.normalizedTo} V
              </dd>
            </>
          ) : (
            <>
              <dt className="text-ink-soft">At its own rated voltage</dt>
              <dd>Not normalised: {notNormalisedReason(result, power.waveform)}.</dd>
            </>
          )}
          {result.verdict ? (
            <>
              <dt className="text-ink-soft">Verdict</dt>
              <dd>
                <VerdictBadge result={result.verdict.result} />
              </dd>
            </>
          ) : null}
        </dl>
      )}
      {result ? (
        <div className="mt-2">
          <SourceLine report={result.report} run={result.run} />
        </div>
      ) : null}
    </div>
  );
}

/**
 * Power input judged fairly: each tool at ITS OWN rated voltage (P·(U_r/U)² for a resistive load), since two tools
 * rated for different mains cannot be compared at one voltage. Where a figure could not be normalised, the card says
 * why and gives it as measured.
 */
export function PowerNormalisation({ a, b }: { a: PowerSide; b: PowerSide }) {
  return (
    <div className="grid gap-4 md:grid-cols-2">
      <PowerCard side="a" power={a} />
      <PowerCard side="b" power={b} />
    </div>
  );
}

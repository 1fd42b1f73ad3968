import { formatNumber } from "@/components/report-embeds/figure-format";
import { VerdictBadge } from "@/components/report-embeds/verdict-badge";
import type { EmbedAnalysis } from "@/lib/report-embeds";

function headline(analysis: EmbedAnalysis): string {
  if (analysis.status !== "done") return `analysis ${analysis.status}`;
  const { waveform, heatUp } = analysis;
  if (waveform) {
    const power = waveform.power ? `${formatNumber(waveform.power.whileConducting)} W while conducting` : "no voltage channel";
    return `${formatNumber(waveform.current.rms)} A RMS, ${power}, duty ${formatNumber(waveform.halfCycles.duty * 100, 3)} %, THD ${formatNumber(waveform.harmonics.thdPercent, 3)} %`;
  }
  if (heatUp) return `in the band after ${heatUp.bandEntryS === null ? "never" : `${formatNumber(heatUp.bandEntryS, 3)} s`}, overshoot ${formatNumber(heatUp.overshootC, 3)} °C`;
  return "no figures readable";
}

/** A cited analysis in one line, with its verdicts: enough for the desk to see what a report claims before opening it. */
export function KeyFigures({ analyses }: { analyses: EmbedAnalysis[] }) {
  if (analyses.length === 0) return <p className="text-sm text-ink-soft">Cites no analysis.</p>;
  return (
    <ul className="space-y-1 text-sm">
      {analyses.map((analysis) => (
        <li key={analysis.label} className="flex flex-wrap items-baseline gap-x-2 gap-y-1">
          <span className="font-semibold">{analysis.label}</span>
          <span className="figure text-ink-soft">{headline(analysis)}</span>
          {analysis.verdicts.map((row) => (
            <span key={row.quantity} className="inline-flex items-center gap-1 text-xs">
              {row.quantity}: <VerdictBadge result={row.verdict.result} />
            </span>
          ))}
        </li>
      ))}
    </ul>
  );
}

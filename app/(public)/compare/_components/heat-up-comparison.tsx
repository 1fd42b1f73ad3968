import { formatNumber } from "@/components/report-embeds/figure-format";
import { WhenNearView } from "@/components/report-embeds/lazy-plots";
import type { HeatUpFigures } from "@/lib/report-embeds";
import type { PublishedAnalysis } from "@/lib/published-results";
import type { CompareSide } from "@/lib/validations/compare";
import { SideBySideTable, SourceLine, type SideBySideRow } from "./compare-table";
import { LazyHeatUpOverlay } from "./lazy-charts";

export type HeatUpSide = { name: string; heatUp: PublishedAnalysis | null; claimedSeconds: number | null };

/** The tools' colours in the drawings, matching the copper and verdigris of the rest of the page. */
export const sideStroke: Record<CompareSide, string> = { a: "#a5481f", b: "#2c6e68" };

const seconds = (value: number | null) => (value === null ? "—" : `${formatNumber(value, 3)} s`);
const celsius = (value: number) => `${formatNumber(value, 4)} °C`;

const figureRows: { label: string; value: (figures: HeatUpFigures) => string }[] = [
  { label: "Setpoint", value: (figures) => celsius(figures.setpointC) },
  { label: "Started at", value: (figures) => celsius(figures.startTemperatureC) },
  { label: "Band", value: (figures) => `${celsius(figures.band.lowerC)} to ${celsius(figures.band.upperC)}` },
  { label: "In the band for good after", value: (figures) => (figures.bandEntryS === null ? "never settled" : seconds(figures.bandEntryS)) },
  { label: "t63.2", value: (figures) => seconds(figures.t63S) },
  { label: "t90", value: (figures) => seconds(figures.t90S) },
  { label: "Overshoot", value: (figures) => `${formatNumber(figures.overshootC, 3)} °C` },
  { label: "Steady state (spread s)", value: (figures) => `${celsius(figures.finalTemperatureC)} (${formatNumber(figures.steadyState.standardDeviation, 2)} °C)` },
];

const heatUpRows: SideBySideRow<HeatUpSide>[] = [
  ...figureRows.map(({ label, value }) => ({ label, value: (side: HeatUpSide) => (side.heatUp?.heatUp ? value(side.heatUp.heatUp) : "—") })),
  { label: "Claimed heat-up time", value: (side) => seconds(side.claimedSeconds) },
  { label: "From", value: (side) => (side.heatUp ? <SourceLine report={side.heatUp.report} run={side.heatUp.run} /> : "—"), words: true },
];

function entrySentence(side: HeatUpSide): string {
  const figures = side.heatUp?.heatUp;
  if (!figures) return `${side.name} has no published heat-up log.`;
  return figures.bandEntryS === null
    ? `${side.name} never settled in its band around ${formatNumber(figures.setpointC, 4)} °C.`
    : `${side.name} went from ${formatNumber(figures.startTemperatureC, 3)} °C into its band around ${formatNumber(figures.setpointC, 4)} °C for good after ${seconds(figures.bandEntryS)}.`;
}

/** Both heat-up curves on one chart (drawn in the browser, after the page), with every figure as a table. */
export function HeatUpComparison({ a, b }: { a: HeatUpSide; b: HeatUpSide }) {
  const sides = { a, b };
  const traces = (["a", "b"] as const).flatMap((side) => {
    const series = sides[side].heatUp?.displaySeries?.heatUp;
    return series ? [{ key: side, name: sides[side].name, color: sideStroke[side], timeS: series.timeS, temperatureC: series.temperatureC }] : [];
  });
  if (traces.length === 0) return <p className="text-ink-soft">Neither tool has a published heat-up log.</p>;
  const setpoints = [...new Set((["a", "b"] as const).flatMap((side) => (sides[side].heatUp?.heatUp ? [sides[side].heatUp.heatUp.setpointC] : [])))];
  return (
    <figure className="rounded border border-rule bg-paper-raised p-4">
      <figcaption className="font-serif text-lg">Temperature from switch-on, both tools</figcaption>
      <div aria-hidden="true" className="mt-3">
        <WhenNearView height="h-72">
          <LazyHeatUpOverlay traces={traces} setpointsC={setpoints} />
        </WhenNearView>
      </div>
      <p className="mt-3 text-sm text-ink-soft">
        {entrySentence(a)} {entrySentence(b)} Dashed: the setpoint{setpoints.length > 1 ? "s" : ""}.
      </p>
      <div className="mt-3">
        <SideBySideTable caption="Heat-up figures of both tools" rows={heatUpRows} a={a} b={b} names={{ a: a.name, b: b.name }} />
      </div>
    </figure>
  );
}

import { EmptyTableRow } from "@/components/ui/empty-table-row";
import { TableScroller } from "@/components/ui/table-scroller";
import { formatFrequencies, formatRange, formatRatedVoltage } from "@/lib/format";
import type { EmbedMeasurement, EmbedTool } from "@/lib/report-embeds";
import { embedHeadClass } from "./embed-figure";
import { formatMeasured, formatNumber } from "./figure-format";
import { VerdictBadge } from "./verdict-badge";

// Which maker's rating each measured quantity answers.
function ratedFigure(tool: EmbedTool, measurement: EmbedMeasurement): string {
  const { ratings } = tool;
  switch (measurement.kind) {
    case "power_input_full_demand":
      return `${formatNumber(ratings.ratedPowerW)} W`;
    case "airflow":
      return ratings.ratedAirflowLpm === null ? "not stated" : `${formatNumber(ratings.ratedAirflowLpm)} L/min`;
    case "heat_up_time":
      return ratings.claimedHeatUpSeconds === null ? "not stated" : `${formatNumber(ratings.claimedHeatUpSeconds)} s`;
    case "temperature_vs_setpoint":
      return formatRange(ratings.temperatureMinC, ratings.temperatureMaxC, "°C");
    default:
      return "—";
  }
}

/** The maker's ratings beside what the cited runs measured, each measurement with its uncertainty and verdict. */
export function SpecTable({ tool }: { tool: EmbedTool }) {
  return (
    <TableScroller label={`Rated against measured: ${tool.name}`} className="not-prose my-6 rounded border border-rule bg-paper-raised font-sans">
      <table className="w-full min-w-[36rem] text-left text-sm">
        <caption className="px-3 py-2 text-left font-serif text-lg text-ink">
          Rated against measured: {tool.name}
          <span className="block font-sans text-xs text-ink-faint">
            Rated {formatRatedVoltage(tool.ratings.ratedVoltageMin, tool.ratings.ratedVoltageMax)}, {formatFrequencies(tool.ratings.ratedFrequenciesHz)}.
          </span>
        </caption>
        <thead className={embedHeadClass}>
          <tr>
            <th scope="col" className="px-3 py-2">Quantity</th>
            <th scope="col" className="px-3 py-2">Maker&apos;s figure</th>
            <th scope="col" className="px-3 py-2">Measured ± U (k = 2)</th>
            <th scope="col" className="px-3 py-2">Source</th>
            <th scope="col" className="px-3 py-2">Verdict</th>
          </tr>
        </thead>
        <tbody>
          {tool.measurements.map((measurement, index) => (
            <tr key={`${measurement.kind}-${index}`} className="border-t border-rule">
              <th scope="row" className="px-3 py-2 font-semibold">{measurement.quantity}</th>
              <td className="figure px-3 py-2">{ratedFigure(tool, measurement)}</td>
              <td className="figure px-3 py-2">{formatMeasured(measurement.value, measurement.expandedUncertainty, measurement.unit)}</td>
              <td className="px-3 py-2">{measurement.source === "analysis" ? "capture analysis" : "manual readings"}</td>
              <td className="px-3 py-2">{measurement.verdict ? <VerdictBadge result={measurement.verdict.result} /> : "not judged"}</td>
            </tr>
          ))}
          {tool.measurements.length === 0 ? (
            <EmptyTableRow columns={5} padding="py-4">The analyses this report cites measured nothing on this tool yet.</EmptyTableRow>
          ) : null}
        </tbody>
      </table>
    </TableScroller>
  );
}

import type { ReactNode } from "react";
import { ConductionStrip } from "@/components/report-embeds/conduction-strip";
import { EmbedFigure } from "@/components/report-embeds/embed-figure";
import { formatMeasured, formatNumber } from "@/components/report-embeds/figure-format";
import { HarmonicPlot } from "@/components/report-embeds/harmonic-chart";
import { HeatUpPlot } from "@/components/report-embeds/heat-up-curve";
import { VerdictTable } from "@/components/report-embeds/verdict-table";
import { WaveformPlot } from "@/components/report-embeds/waveform-chart";
import type { DisplaySeries } from "@/db/schema";
import type { CaptureAnalysis } from "@/lib/bench/analysis";
import { storedVerdictSchema, type VerdictRow } from "@/lib/report-embeds";
import type { HeatUpLogResult } from "@/lib/run-measurements";

type Figure = {
  label: string;
  /** Where the number sits in the stored result, so a test can compare the page with the analysis JSON. */
  path: string;
  value: number | null | undefined;
  unit?: string;
  digits?: number;
  /** Shown multiplied by this (a share as a percentage); data-value keeps the stored number. */
  scale?: number;
  note?: ReactNode;
};

function FigureList({ title, figures, children }: { title: string; figures: Figure[]; children?: ReactNode }) {
  return (
    <section className="rounded border border-rule bg-paper-raised">
      <h3 className="border-b border-rule bg-paper-sunk px-4 py-2 text-xs font-semibold uppercase tracking-wide text-ink-soft">{title}</h3>
      <dl className="divide-y divide-rule text-sm">
        {figures.map((figure) => (
          <div key={figure.path} className="grid grid-cols-[minmax(0,1fr)_auto] gap-x-4 px-4 py-2">
            <dt className="text-ink-soft">{figure.label}</dt>
            <dd className="figure text-right" data-figure={figure.path} data-value={figure.value === null || figure.value === undefined ? "" : String(figure.value)}>
              {formatNumber(figure.value === null || figure.value === undefined ? figure.value : figure.value * (figure.scale ?? 1), figure.digits ?? 4)}
              {figure.unit && figure.value !== null && figure.value !== undefined ? ` ${figure.unit}` : ""}
            </dd>
            {figure.note ? <dd className="col-span-2 text-xs text-ink-faint">{figure.note}</dd> : null}
          </div>
        ))}
      </dl>
      {children ? <div className="border-t border-rule px-4 py-2 text-sm text-ink-soft">{children}</div> : null}
    </section>
  );
}

function Notes({ title, items }: { title: string; items: string[] }) {
  if (items.length === 0) return null;
  return (
    <section className="text-sm">
      <h3 className="font-semibold">{title}</h3>
      <ul className="mt-1 list-disc space-y-1 pl-5 text-ink-soft">
        {items.map((item) => (
          <li key={item}>{item}</li>
        ))}
      </ul>
    </section>
  );
}

function verdictRows(entries: { quantity: string; unit: string; verdict: unknown }[]): VerdictRow[] {
  return entries.flatMap(({ quantity, unit, verdict }) => {
    const parsed = storedVerdictSchema.safeParse(verdict);
    return parsed.success ? [{ quantity, unit, verdict: parsed.data }] : [];
  });
}

const firingLabels: Record<CaptureAnalysis["halfCycles"]["firing"], string> = {
  continuous: "continuous (every half-cycle conducts)",
  none: "none (no half-cycle conducts)",
  "whole-cycle": "burst-fire (whole cycles at zero crossings)",
  "half-cycle": "half-cycle firing",
};

function WaveformFigures({ result, series }: { result: CaptureAnalysis; series: DisplaySeries | null }) {
  const { current, voltage, power, estimatedPower, halfCycles, harmonics, flicker, verdict } = result;
  const above = harmonics.orders.filter((order) => order.withinLimit === false);
  return (
    <div className="space-y-6">
      {verdict ? (
        <div className="space-y-2">
          <VerdictTable rows={verdictRows([{ quantity: "Power input at full demand", unit: "W", verdict }])} caption="Power input against the rating (IEC 60335-1 clause 10.1)" />
          <p className="text-sm text-ink-soft">
            {verdict.normalizationNote} {verdict.tolerance.assumption ?? ""}
          </p>
          {verdict.ends ? (
            <ul className="figure text-xs text-ink-soft">
              {verdict.ends.map((end) => (
                <li key={end.voltage}>
                  At {end.voltage} V: {formatMeasured(end.normalized, end.expandedUncertainty, "W")} ({end.result})
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : (
        <p className="rounded border border-rule bg-paper-raised px-4 py-3 text-sm">No power-input verdict: {result.verdictUnavailableReason ?? "no rating given"}.</p>
      )}

      <div className="grid gap-4 lg:grid-cols-2">
        <FigureList
          title="Supply and capture"
          figures={[
            { label: `Mains frequency (from the ${result.frequencySource})`, path: "frequencyHz", value: result.frequencyHz, unit: "Hz", digits: 6 },
            { label: "Nominal supply", path: "nominalVoltage", value: result.nominalVoltage, unit: `V, ${result.nominalFrequencyHz} Hz` },
            { label: "Sample rate", path: "sampleRateHz", value: result.sampleRateHz, unit: "S/s", digits: 6 },
            { label: "Samples", path: "capture.samples", value: result.capture.samples, digits: 12 },
            { label: "Duration", path: "capture.durationSeconds", value: result.capture.durationSeconds, unit: "s" },
          ]}
        >
          Current from “{result.capture.columns.current}” × {result.capture.scales.current}
          {result.capture.columns.voltage ? `, voltage from “${result.capture.columns.voltage}” × ${result.capture.scales.voltage}` : ", no voltage channel"}; time from the{" "}
          {result.capture.timeSource}.
        </FigureList>
        <FigureList
          title="Current"
          figures={[
            { label: "True RMS", path: "current.rms", value: current.rms, unit: "A" },
            { label: "Peak", path: "current.peak", value: current.peak, unit: "A" },
            { label: "Crest factor", path: "current.crestFactor", value: current.crestFactor },
            { label: "DC component", path: "current.dc", value: current.dc, unit: "A" },
            { label: "RMS while conducting", path: "halfCycles.currentRmsWhileConducting", value: halfCycles.currentRmsWhileConducting, unit: "A" },
          ]}
        />
        {voltage ? (
          <FigureList
            title="Voltage"
            figures={[
              { label: "True RMS", path: "voltage.rms", value: voltage.rms, unit: "V" },
              { label: "Peak", path: "voltage.peak", value: voltage.peak, unit: "V" },
              { label: "RMS while conducting", path: "voltage.rmsWhileConducting", value: voltage.rmsWhileConducting, unit: "V" },
            ]}
          />
        ) : null}
        {power ? (
          <FigureList
            title="Power"
            figures={[
              { label: "Real power (mean over the record)", path: "power.real", value: power.real, unit: "W" },
              { label: "Apparent power", path: "power.apparent", value: power.apparent, unit: "VA" },
              { label: "Power factor", path: "power.factor", value: power.factor, digits: 3 },
              { label: "Power while conducting", path: "power.whileConducting", value: power.whileConducting, unit: "W" },
              { label: "Power factor while conducting", path: "power.factorWhileConducting", value: power.factorWhileConducting, digits: 3 },
            ]}
          />
        ) : estimatedPower ? (
          <FigureList
            title="Power (estimate, no voltage channel)"
            figures={[
              { label: "Mean power (estimate)", path: "estimatedPower.mean", value: estimatedPower.mean, unit: "W" },
              { label: "Power while conducting (estimate)", path: "estimatedPower.whileConducting", value: estimatedPower.whileConducting, unit: "W" },
            ]}
          >
            {estimatedPower.basis}.
          </FigureList>
        ) : null}
        <FigureList
          title="Half-cycles and firing"
          figures={[
            { label: "Half-cycles", path: "halfCycles.count", value: halfCycles.count, digits: 12 },
            { label: "Conducting", path: "halfCycles.conducting", value: halfCycles.conducting, digits: 12 },
            { label: "Duty", path: "halfCycles.duty", value: halfCycles.duty, scale: 100, unit: "%" },
            { label: "Switchings per minute", path: "halfCycles.switchesPerMinute", value: halfCycles.switchesPerMinute, unit: "/min" },
            { label: "Longest off", path: "halfCycles.longestOffSeconds", value: halfCycles.longestOffSeconds, unit: "s" },
          ]}
        >
          Firing: {firingLabels[halfCycles.firing]}
          {halfCycles.asymmetric ? ". ASYMMETRIC: " : ". "}
          {halfCycles.asymmetricNote}
        </FigureList>
        <FigureList
          title={`Harmonics (indicative, Class ${harmonics.class})`}
          figures={[
            { label: "Fundamental", path: "harmonics.fundamentalAmps", value: harmonics.fundamentalAmps, unit: "A" },
            { label: "THD", path: "harmonics.thdPercent", value: harmonics.thdPercent, unit: "%" },
          ]}
        >
          {harmonics.applicable
            ? above.length === 0
              ? `Every order within its IEC 61000-3-2 limit (${harmonics.windows} windows of ${harmonics.windowCycles} cycles).`
              : `Above the limit at order ${above.map((order) => `${order.order} (${formatNumber(order.amps)} A > ${formatNumber(order.limitAmps)} A)`).join(", ")}.`
            : `Limits not applicable: ${harmonics.notApplicableReason}.`}
        </FigureList>
        {flicker ? (
          <FigureList
            title="Flicker on the reference impedance (IEC 61000-3-3)"
            figures={[
              { label: "Pst", path: "flicker.pst", value: flicker.pst, digits: 3, note: `limit ${flicker.pstLimit}` },
              { label: "dc", path: "flicker.dcPercent", value: flicker.dcPercent, unit: "%", digits: 3, note: `limit ${flicker.dcLimitPercent} %` },
              { label: "dmax", path: "flicker.dmaxPercent", value: flicker.dmaxPercent, unit: "%", digits: 3, note: `limit ${flicker.dmaxLimitPercent} %` },
              { label: "Tmax (d above 3.3 %)", path: "flicker.tmaxSeconds", value: flicker.tmaxSeconds, unit: "s", digits: 3, note: `limit ${flicker.tmaxLimitSeconds} s` },
              { label: "Voltage changes per minute", path: "flicker.changesPerMinute", value: flicker.changesPerMinute, unit: "/min" },
            ]}
          >
            Supply impedance {flicker.impedance.resistanceOhm} + j{flicker.impedance.reactanceOhm} Ω ({flicker.impedance.source}).
          </FigureList>
        ) : (
          <p className="rounded border border-rule bg-paper-raised px-4 py-3 text-sm">Flicker not estimated: {result.flickerUnavailableReason}.</p>
        )}
      </div>

      {series?.waveform ? (
        <EmbedFigure
          title="Current and voltage"
          source={`Min/max envelope of ${formatNumber(result.capture.samples, 12)} samples, ${series.waveform.timeS.length} points drawn`}
          summary={`Current ${formatNumber(current.rms)} A RMS, ${formatNumber(current.peak)} A peak${voltage ? `; voltage ${formatNumber(voltage.rms)} V RMS` : ""}.`}
        >
          <WaveformPlot timeS={series.waveform.timeS} current={series.waveform.current} voltage={series.waveform.voltage} />
        </EmbedFigure>
      ) : null}
      {series?.halfCycles ? (
        <EmbedFigure
          title="Conduction map"
          source={`${series.halfCycles.conducting.length} half-cycles of ${formatNumber(series.halfCycles.halfCycleSeconds * 1000, 3)} ms`}
          summary={`${halfCycles.conducting} of ${halfCycles.count} half-cycles conduct (duty ${formatNumber(halfCycles.duty * 100, 3)} %), ${formatNumber(
            halfCycles.switchesPerMinute,
            3,
          )} switchings per minute, ${firingLabels[halfCycles.firing]}.`}
        >
          <ConductionStrip conducting={series.halfCycles.conducting} halfCycleSeconds={series.halfCycles.halfCycleSeconds} />
        </EmbedFigure>
      ) : null}
      <EmbedFigure
        title="Harmonic currents against the Class limits"
        source={harmonics.method}
        summary={`Fundamental ${formatNumber(harmonics.fundamentalAmps)} A, THD ${formatNumber(harmonics.thdPercent, 3)} %: ${harmonics.status}.`}
        table={
          <table className="w-full min-w-[24rem] text-left text-sm">
            <thead className="bg-paper-sunk text-xs uppercase tracking-wide text-ink-soft">
              <tr>
                <th scope="col" className="px-3 py-1">Order</th>
                <th scope="col" className="px-3 py-1 text-right">Measured (A)</th>
                <th scope="col" className="px-3 py-1 text-right">Limit (A)</th>
                <th scope="col" className="px-3 py-1">Within</th>
              </tr>
            </thead>
            <tbody>
              {harmonics.orders.map((order) => (
                <tr key={order.order} className="border-t border-rule">
                  <th scope="row" className="px-3 py-1">{order.order}</th>
                  <td className="figure px-3 py-1 text-right">{formatNumber(order.amps)}</td>
                  <td className="figure px-3 py-1 text-right">{formatNumber(order.limitAmps)}</td>
                  <td className="px-3 py-1">{order.withinLimit === null ? "no limit" : order.withinLimit ? "yes" : "NO"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        }
      >
        <HarmonicPlot orders={harmonics.orders.map(({ order, amps, limitAmps }) => ({ order, amps, limitAmps }))} />
      </EmbedFigure>
      <Notes title="Warnings" items={result.warnings} />
      <Notes title="How these figures were made" items={[...result.assumptions, ...(flicker?.assumptions ?? [])]} />
    </div>
  );
}

function HeatUpFigures({ result, series }: { result: HeatUpLogResult; series: DisplaySeries | null }) {
  const { heatUp } = result;
  const rows = verdictRows([
    { quantity: "Heat-up time", unit: "s", verdict: result.heatUpVerdict },
    { quantity: "Temperature at setpoint", unit: "°C", verdict: result.temperatureVerdict },
  ]);
  const missing = [result.heatUpVerdictUnavailableReason, result.temperatureVerdictUnavailableReason].filter((reason) => reason !== null);
  return (
    <div className="space-y-6">
      <VerdictTable rows={rows} caption="Heat-up and temperature against the claims and the protocol" />
      <Notes title="Not judged" items={missing} />
      <div className="grid gap-4 lg:grid-cols-2">
        <FigureList
          title="Heat-up"
          figures={[
            { label: "Setpoint", path: "heatUp.setpointC", value: heatUp.setpointC, unit: "°C" },
            { label: "Start temperature", path: "heatUp.startTemperatureC", value: heatUp.startTemperatureC, unit: "°C" },
            {
              label: `Heat-up time (band entry, ${heatUp.band.description})`,
              path: "heatUp.bandEntryS",
              value: heatUp.bandEntryS,
              unit: "s",
              note: `U = ${formatNumber(result.heatUpTime.expandedUncertaintyS, 2)} s (k = 2): ${result.heatUpTime.basis}.`,
            },
            { label: "t63.2", path: "heatUp.t63S", value: heatUp.t63S, unit: "s" },
            { label: "t90", path: "heatUp.t90S", value: heatUp.t90S, unit: "s" },
            { label: "Overshoot", path: "heatUp.overshootC", value: heatUp.overshootC, unit: "°C" },
          ]}
        />
        <FigureList
          title="Steady state"
          figures={[
            {
              label: "Settled temperature",
              path: "heatUp.finalTemperatureC",
              value: heatUp.finalTemperatureC,
              unit: "°C",
              note:
                result.steadyTemperature.expandedUncertaintyC === null
                  ? "No thermometer accuracy chosen: no uncertainty stated."
                  : `U = ${formatNumber(result.steadyTemperature.expandedUncertaintyC, 2)} °C (k = 2) from the thermometer's accuracy.`,
            },
            { label: "Offset from setpoint", path: "heatUp.steadyState.offsetFromSetpointC", value: heatUp.steadyState.offsetFromSetpointC, unit: "°C" },
            { label: "Standard deviation (stability)", path: "heatUp.steadyState.standardDeviation", value: heatUp.steadyState.standardDeviation, unit: "°C" },
            { label: "Lowest", path: "heatUp.steadyState.min", value: heatUp.steadyState.min, unit: "°C" },
            { label: "Highest", path: "heatUp.steadyState.max", value: heatUp.steadyState.max, unit: "°C" },
          ]}
        >
          Steady state: {heatUp.steadyState.basis}.
        </FigureList>
      </div>
      {series?.heatUp ? (
        <EmbedFigure
          title="Heat-up curve"
          source={`${formatNumber(result.capture.samples, 12)} readings from “${result.capture.columns.temperature}”, ${series.heatUp.timeS.length} drawn`}
          summary={`From ${formatNumber(heatUp.startTemperatureC)} °C to ${formatNumber(heatUp.finalTemperatureC)} °C; in the band after ${formatNumber(heatUp.bandEntryS)} s.`}
        >
          <HeatUpPlot
            timeS={series.heatUp.timeS}
            temperatureC={series.heatUp.temperatureC}
            setpointC={series.heatUp.setpointC}
            band={{ lowerC: heatUp.band.lowerC, upperC: heatUp.band.upperC }}
            bandEntryS={heatUp.bandEntryS}
          />
        </EmbedFigure>
      ) : null}
    </div>
  );
}

/** Every figure of a finished analysis, labelled with its unit; each carries the stored number it shows. */
export function AnalysisFigures({
  kind,
  result,
  series,
}: {
  kind: "waveform" | "heat_up_log";
  result: CaptureAnalysis | HeatUpLogResult;
  series: DisplaySeries | null;
}) {
  return kind === "waveform" ? (
    <WaveformFigures result={result as CaptureAnalysis} series={series} />
  ) : (
    <HeatUpFigures result={result as HeatUpLogResult} series={series} />
  );
}

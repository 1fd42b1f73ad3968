import type { ReactNode } from "react";
import { MdxProblemNote } from "@/components/mdx/mdx-problem-note";
import { SafetyNotice } from "@/components/safety-notice";
import type { EmbedComponents } from "@/lib/mdx/render-tree";
import type { EmbedAnalysis, ReportEmbeds } from "@/lib/report-embeds";
import { ConductionStrip, conductionRuns } from "./conduction-strip";
import { EmbedFigure, embedHeadClass, embedTableClass } from "./embed-figure";
import { formatNumber } from "./figure-format";
import { LazyHarmonicPlot, LazyHeatUpPlot, LazyWaveformPlot } from "./lazy-plots";
import { SpecTable } from "./spec-table";
import { VerdictTable } from "./verdict-table";

// Binds the components a report's MDX may use to that report's cited data. Shared by the saved report (server) and
// the live preview (browser), so both show the same thing for the same text.

function sourceLine(analysis: EmbedAnalysis): string {
  return `Analysis “${analysis.label}” of ${analysis.captureFileName}: ${analysis.tool.name}, run of ${analysis.run.testedOn} at ${analysis.run.labName}${
    analysis.analysisVersion ? `, analysis code ${analysis.analysisVersion}` : ""
  }.`;
}

const statusNotes: Record<EmbedAnalysis["status"], string> = {
  queued: "is waiting for the analysis worker",
  running: "is being analysed",
  failed: "failed; repoint the label to a finished analysis",
  done: "",
};

export function embedComponents(embeds: ReportEmbeds): EmbedComponents {
  const withAnalysis =
    (label: string | undefined, draw: (analysis: EmbedAnalysis) => ReactNode): ReactNode => {
      const analysis = label === undefined ? undefined : embeds.analyses[label];
      if (!analysis) return <MdxProblemNote message={`This report cites no analysis labelled “${label ?? ""}”.`} />;
      if (analysis.status !== "done") return <MdxProblemNote message={`Analysis “${analysis.label}” ${statusNotes[analysis.status]}.`} />;
      return draw(analysis);
    };
  const notInAnalysis = (analysis: EmbedAnalysis, what: string) => (
    <MdxProblemNote message={`Analysis “${analysis.label}” (${analysis.captureKind === "waveform" ? "a waveform" : "a heat-up log"}) has no ${what}.`} />
  );

  return {
    VerdictTable: ({ analysis: label }: { analysis?: string }) =>
      withAnalysis(label, (analysis) => <VerdictTable rows={analysis.verdicts} caption={`Verdicts: ${analysis.tool.name} (${analysis.label})`} />),

    WaveformChart: ({ analysis: label }: { analysis?: string }) =>
      withAnalysis(label, (analysis) => {
        const series = analysis.displaySeries?.waveform;
        const figures = analysis.waveform;
        if (!series || !figures) return notInAnalysis(analysis, "waveform");
        const voltage = figures.voltage ? `; voltage ${formatNumber(figures.voltage.rms)} V RMS` : "; no voltage channel";
        return (
          <EmbedFigure
            title={`Current waveform: ${analysis.tool.name}`}
            source={sourceLine(analysis)}
            summary={`Over ${formatNumber(figures.capture.durationSeconds, 3)} s at ${formatNumber(figures.frequencyHz, 5)} Hz: current ${formatNumber(
              figures.current.rms,
            )} A RMS, ${formatNumber(figures.current.peak)} A peak, crest factor ${formatNumber(figures.current.crestFactor, 3)}${voltage}${
              figures.power ? `; real power ${formatNumber(figures.power.real)} W, power factor ${formatNumber(figures.power.factor, 3)}` : ""
            }. The chart shows each stretch's minimum and maximum, downsampled for display.`}
          >
            <LazyWaveformPlot timeS={series.timeS} current={series.current} voltage={series.voltage} />
          </EmbedFigure>
        );
      }),

    ConductionMap: ({ analysis: label }: { analysis?: string }) =>
      withAnalysis(label, (analysis) => {
        const series = analysis.displaySeries?.halfCycles;
        const figures = analysis.waveform;
        if (!series || !figures) return notInAnalysis(analysis, "half-cycle series");
        const { halfCycles } = figures;
        const runs = conductionRuns(series.conducting);
        return (
          <EmbedFigure
            title={`Conduction map: ${analysis.tool.name}`}
            source={sourceLine(analysis)}
            summary={`${halfCycles.conducting} of ${halfCycles.count} half-cycles conduct (duty ${formatNumber(halfCycles.duty * 100, 3)} %), ${formatNumber(
              halfCycles.switchesPerMinute,
              3,
            )} switchings per minute, longest off ${formatNumber(halfCycles.longestOffSeconds, 3)} s; firing: ${halfCycles.firing}${
              halfCycles.asymmetric ? ", asymmetric" : ""
            }.${series.conducting.length < halfCycles.count ? ` The strip shows the first ${series.conducting.length} half-cycles.` : ""}`}
            table={
              <p className="text-ink-soft">
                In order, from the start:{" "}
                {runs.map((run) => `${run.count} ${run.on ? "conducting" : "blocked"}`).join(", ")}.
              </p>
            }
          >
            <ConductionStrip conducting={series.conducting} halfCycleSeconds={series.halfCycleSeconds} />
          </EmbedFigure>
        );
      }),

    HarmonicChart: ({ analysis: label }: { analysis?: string }) =>
      withAnalysis(label, (analysis) => {
        const harmonics = analysis.waveform?.harmonics;
        if (!harmonics) return notInAnalysis(analysis, "harmonics");
        const above = harmonics.orders.filter((order) => order.withinLimit === false).map((order) => order.order);
        const verdict = harmonics.applicable
          ? above.length
            ? `above the Class ${harmonics.class} limit at order${above.length > 1 ? "s" : ""} ${above.join(", ")}`
            : `within the Class ${harmonics.class} limits at every order`
          : `no limits apply: ${harmonics.notApplicableReason ?? "outside the standard's scope"}`;
        return (
          <EmbedFigure
            title={`Harmonic currents against IEC 61000-3-2: ${analysis.tool.name}`}
            source={sourceLine(analysis)}
            summary={`Fundamental ${formatNumber(harmonics.fundamentalAmps)} A, THD ${formatNumber(harmonics.thdPercent, 3)} %; ${verdict}. Indicative only: a capture of seconds is not a compliance measurement.`}
            table={
              <table className={embedTableClass}>
                <thead className={embedHeadClass}>
                  <tr>
                    <th scope="col" className="px-2 py-1">Order</th>
                    <th scope="col" className="px-2 py-1 text-right">Current (A)</th>
                    <th scope="col" className="px-2 py-1 text-right">Limit (A)</th>
                    <th scope="col" className="px-2 py-1">Within limit</th>
                  </tr>
                </thead>
                <tbody>
                  {harmonics.orders.map((order) => (
                    <tr key={order.order} className="border-t border-rule">
                      <th scope="row" className="figure px-2 py-1 font-normal">{order.order}</th>
                      <td className="figure px-2 py-1 text-right">{order.amps.toFixed(4)}</td>
                      <td className="figure px-2 py-1 text-right">{order.limitAmps === null ? "—" : order.limitAmps.toFixed(3)}</td>
                      <td className="px-2 py-1">{order.withinLimit === null ? "no limit" : order.withinLimit ? "yes" : "no, above"}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            }
          >
            <LazyHarmonicPlot orders={harmonics.orders.map(({ order, amps, limitAmps }) => ({ order, amps, limitAmps }))} />
          </EmbedFigure>
        );
      }),

    HeatUpCurve: ({ analysis: label }: { analysis?: string }) =>
      withAnalysis(label, (analysis) => {
        const series = analysis.displaySeries?.heatUp;
        const figures = analysis.heatUp;
        if (!series || !figures) return notInAnalysis(analysis, "heat-up curve");
        return (
          <EmbedFigure
            title={`Heat-up: ${analysis.tool.name}`}
            source={sourceLine(analysis)}
            summary={`From ${formatNumber(figures.startTemperatureC, 3)} °C towards the ${formatNumber(figures.setpointC, 3)} °C setpoint: ${
              figures.bandEntryS === null
                ? "never settled in the band"
                : `entered the band ${figures.band.description} (${formatNumber(figures.band.lowerC, 4)}–${formatNumber(figures.band.upperC, 4)} °C) for good after ${formatNumber(figures.bandEntryS, 3)} s`
            }; t63.2 ${formatNumber(figures.t63S, 3)} s, t90 ${formatNumber(figures.t90S, 3)} s, overshoot ${formatNumber(figures.overshootC, 3)} °C, steady state ${formatNumber(
              figures.finalTemperatureC,
              4,
            )} °C with a spread (s) of ${formatNumber(figures.steadyState.standardDeviation, 2)} °C.`}
          >
            <LazyHeatUpPlot
              timeS={series.timeS}
              temperatureC={series.temperatureC}
              setpointC={series.setpointC ?? figures.setpointC}
              band={figures.band}
              bandEntryS={figures.bandEntryS}
            />
          </EmbedFigure>
        );
      }),

    SpecTable: ({ tool: slug }: { tool?: string }) => {
      const tool = slug === undefined ? embeds.tools[0] : embeds.tools.find((candidate) => candidate.slug === slug);
      if (!tool) return <MdxProblemNote message={slug === undefined ? "This report covers no tool yet." : `This report does not cover the tool “${slug}”.`} />;
      return <SpecTable tool={tool} />;
    },

    Figure: ({ image: name, caption }: { image?: string; caption?: string }) => {
      const image = name === undefined ? undefined : embeds.images[name];
      if (!image) return <MdxProblemNote message={`No image named “${name ?? ""}” is uploaded to this report.`} />;
      return (
        <figure className="not-prose my-6">
          <img src={image.src} alt={image.altText} width={image.width} height={image.height} loading="lazy" className="h-auto max-w-full rounded border border-rule" />
          {caption ? <figcaption className="mt-2 text-sm text-ink-soft">{caption}</figcaption> : null}
        </figure>
      );
    },

    SafetyNotice: () => (
      <div className="not-prose my-6">
        <SafetyNotice />
      </div>
    ),
  };
}

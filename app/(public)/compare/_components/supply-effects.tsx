import { TableScroller } from "@/components/ui/table-scroller";
import { ConductionStrip } from "@/components/report-embeds/conduction-strip";
import { formatNumber } from "@/components/report-embeds/figure-format";
import { LazyHarmonicPlot } from "@/components/report-embeds/lazy-plots";
import type { FlickerFigures, PublishedAnalysis } from "@/lib/published-results";
import type { WaveformFigures } from "@/lib/report-embeds";
import { compareHeadClass, compareTableClass, SideBySideTable, SourceLine, type SideBySideRow } from "./compare-table";

export type SupplySide = { name: string; waveform: PublishedAnalysis | null };

const firingLabels: Record<string, string> = {
  "whole-cycle": "burst-fire (whole cycles)",
  "half-cycle": "half-cycle firing",
  continuous: "continuous",
  none: "never conducted",
};

const conductionRows: SideBySideRow<WaveformFigures>[] = [
  { label: "Firing", value: ({ halfCycles }) => `${firingLabels[halfCycles.firing] ?? halfCycles.firing}${halfCycles.asymmetric ? ", asymmetric" : ""}`, words: true },
  { label: "Half-cycles conducting", value: ({ halfCycles }) => `${halfCycles.conducting} of ${halfCycles.count}` },
  { label: "Duty", value: ({ halfCycles }) => `${formatNumber(halfCycles.duty * 100, 3)} %` },
  { label: "Switchings per minute", value: ({ halfCycles }) => formatNumber(halfCycles.switchesPerMinute, 3) },
  { label: "Longest off", value: ({ halfCycles }) => `${formatNumber(halfCycles.longestOffSeconds, 3)} s` },
  { label: "Supply frequency measured", value: ({ frequencyHz }) => `${formatNumber(frequencyHz, 5)} Hz` },
];

function harmonicVerdict({ harmonics }: WaveformFigures): string {
  if (!harmonics.applicable) return `no limits apply: ${harmonics.notApplicableReason ?? "outside the standard's scope"}`;
  const above = harmonics.orders.filter((order) => order.withinLimit === false).map((order) => order.order);
  return above.length ? `above the Class ${harmonics.class} limit at order${above.length > 1 ? "s" : ""} ${above.join(", ")}` : `within the Class ${harmonics.class} limits`;
}

const harmonicRows: SideBySideRow<WaveformFigures>[] = [
  { label: "Against IEC 61000-3-2", value: harmonicVerdict, words: true },
  { label: "Fundamental", value: ({ harmonics }) => `${formatNumber(harmonics.fundamentalAmps)} A` },
  { label: "THD", value: ({ harmonics }) => `${formatNumber(harmonics.thdPercent, 3)} %` },
];

const withLimit = (value: number, limit: number, unit: string, digits = 3) =>
  `${formatNumber(value, digits)}${unit} (limit ${formatNumber(limit, digits)}${unit}, ${value <= limit ? "within" : "above"})`;

const flickerRows: SideBySideRow<FlickerFigures>[] = [
  { label: "Pst", value: (flicker) => withLimit(flicker.pst, flicker.pstLimit, "") },
  { label: "dmax", value: (flicker) => withLimit(flicker.dmaxPercent, flicker.dmaxLimitPercent, " %") },
  { label: "dc", value: (flicker) => withLimit(flicker.dcPercent, flicker.dcLimitPercent, " %") },
  { label: "Tmax", value: (flicker) => withLimit(flicker.tmaxSeconds, flicker.tmaxLimitSeconds, " s") },
  { label: "Voltage changes per minute", value: (flicker) => formatNumber(flicker.changesPerMinute, 3) },
  {
    label: "Supply impedance assumed",
    value: ({ impedance }) => `${formatNumber(impedance.resistanceOhm, 3)} + j${formatNumber(impedance.reactanceOhm, 3)} Ω (${impedance.source})`,
  },
];

function NoWaveform({ name }: { name: string }) {
  return <p className="text-sm text-ink-soft">{name} has no published waveform capture.</p>;
}

/** What each tool's switching does to the supply: its conduction pattern, harmonic currents and flicker estimate. */
export function SupplyEffects({ a, b }: { a: SupplySide; b: SupplySide }) {
  const names = { a: a.name, b: b.name };
  const figures = { a: a.waveform?.waveform ?? null, b: b.waveform?.waveform ?? null };
  if (!figures.a && !figures.b) return <p className="text-ink-soft">Neither tool has a published waveform capture.</p>;
  const sides = [
    { key: "a", side: a, figures: figures.a },
    { key: "b", side: b, figures: figures.b },
  ] as const;
  const flicker = { a: a.waveform?.flicker ?? null, b: b.waveform?.flicker ?? null };
  const orders = [...new Set([...(figures.a?.harmonics.orders ?? []), ...(figures.b?.harmonics.orders ?? [])].map((order) => order.order))].sort((x, y) => x - y);
  const orderOf = (side: WaveformFigures | null, order: number) => side?.harmonics.orders.find((entry) => entry.order === order);

  return (
    <div className="space-y-8">
      <section aria-labelledby="conduction-heading" className="space-y-3">
        <h3 id="conduction-heading" className="font-serif text-xl">
          Conduction pattern
        </h3>
        <div className="grid gap-4 md:grid-cols-2">
          {sides.map(({ key, side }) => {
            const series = side.waveform?.displaySeries?.halfCycles;
            return (
              <figure key={key} className="rounded border border-rule bg-paper-raised p-4">
                <figcaption className="font-semibold">{side.name}</figcaption>
                {series && side.waveform ? (
                  <>
                    <div aria-hidden="true" className="mt-2">
                      <ConductionStrip conducting={series.conducting} halfCycleSeconds={series.halfCycleSeconds} />
                    </div>
                    <SourceLine report={side.waveform.report} run={side.waveform.run} />
                  </>
                ) : (
                  <NoWaveform name={side.name} />
                )}
              </figure>
            );
          })}
        </div>
        <SideBySideTable caption="How each tool switches its heater" rows={conductionRows} a={figures.a} b={figures.b} names={names} />
      </section>

      <section aria-labelledby="harmonics-heading" className="space-y-3">
        <h3 id="harmonics-heading" className="font-serif text-xl">
          Harmonic currents
        </h3>
        <p className="text-sm text-ink-soft">Indicative only: a capture of seconds is not a compliance measurement, and the limits depend on each tool&apos;s own supply.</p>
        <div className="grid gap-4 md:grid-cols-2">
          {sides.map(({ key, side, figures: own }) => (
            <figure key={key} className="rounded border border-rule bg-paper-raised p-4">
              <figcaption className="font-semibold">{side.name}</figcaption>
              {own ? (
                <div aria-hidden="true" className="mt-2">
                  <LazyHarmonicPlot orders={own.harmonics.orders.map(({ order, amps, limitAmps }) => ({ order, amps, limitAmps }))} />
                </div>
              ) : (
                <NoWaveform name={side.name} />
              )}
            </figure>
          ))}
        </div>
        <SideBySideTable caption="Harmonic currents of each tool, in summary" rows={harmonicRows} a={figures.a} b={figures.b} names={names} />
        <details className="text-sm">
          <summary className="cursor-pointer font-semibold">Every order as a table</summary>
          <TableScroller label="Harmonic currents of every order, both tools" className="mt-2">
            <table className={`${compareTableClass} min-w-[28rem]`}>
              <caption className="sr-only">Harmonic current and limit of each order, both tools</caption>
              <thead className={compareHeadClass}>
                <tr>
                  <th scope="col" className="px-2 py-1">Order</th>
                  <th scope="col" className="px-2 py-1 text-right">{a.name} (A)</th>
                  <th scope="col" className="px-2 py-1 text-right">Limit (A)</th>
                  <th scope="col" className="px-2 py-1 text-right">{b.name} (A)</th>
                  <th scope="col" className="px-2 py-1 text-right">Limit (A)</th>
                </tr>
              </thead>
              <tbody>
                {orders.map((order) => {
                  const left = orderOf(figures.a, order);
                  const right = orderOf(figures.b, order);
                  return (
                    <tr key={order} className="border-t border-rule">
                      <th scope="row" className="figure px-2 py-1 font-normal">{order}</th>
                      <td className="figure px-2 py-1 text-right">{left ? left.amps.toFixed(4) : "—"}</td>
                      <td className="figure px-2 py-1 text-right">{left?.limitAmps == null ? "—" : left.limitAmps.toFixed(3)}</td>
                      <td className="figure px-2 py-1 text-right">{right ? right.amps.toFixed(4) : "—"}</td>
                      <td className="figure px-2 py-1 text-right">{right?.limitAmps == null ? "—" : right.limitAmps.toFixed(3)}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </TableScroller>
        </details>
      </section>

      <section aria-labelledby="flicker-heading" className="space-y-3">
        <h3 id="flicker-heading" className="font-serif text-xl">
          Flicker estimate (IEC 61000-3-3)
        </h3>
        <p className="text-sm text-ink-soft">Estimated from the capture on a simulated supply impedance, each tool on its own supply; not a compliance measurement.</p>
        <SideBySideTable caption="Flicker estimates of both tools against their limits" rows={flickerRows} a={flicker.a} b={flicker.b} names={names} />
        {sides.map(({ key, side }) =>
          side.waveform && !side.waveform.flicker ? (
            <p key={key} className="text-sm text-ink-soft">
              No flicker estimate for {side.name}: {side.waveform.flickerUnavailableReason ?? "none was stored with its analysis."}
            </p>
          ) : null,
        )}
      </section>
    </div>
  );
}

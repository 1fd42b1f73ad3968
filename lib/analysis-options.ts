// From a reviewer's column mapping and the run it belongs to, the exact options an analysis runs with. Everything
// the analysis needs is copied in (ratings, tolerances, instrument specs), so an analysis is a function of its capture
// and its options alone: later edits to the tool or an instrument never change what a stored analysis means.
// Pure and free of server imports: the mapping form uses the accuracy choices too.

import type { AccuracyRange, InstrumentSnapshot, ProtocolConditions, ProtocolTolerance } from "@/db/schema";
import type { AnalysisOptions } from "@/lib/bench/analysis";
import type { Band } from "@/lib/bench/thermal";
import type { AccuracySpec } from "@/lib/bench/uncertainty";
import type { DecisionRule } from "@/lib/bench/verdict";
import type { HeatUpMapping, WaveformMapping } from "@/lib/validations/runs";

export type RunInstrument = { instrumentId: string; snapshot: InstrumentSnapshot };

export type ToolRating = {
  ratedPowerW: number;
  ratedVoltageMin: number;
  ratedVoltageMax: number;
  applianceType: "heating" | "motor" | "combined";
  claimedHeatUpSeconds: number | null;
};

export type ProtocolTolerances = Partial<Record<"airflow" | "heat_up_time" | "temperature_vs_setpoint", ProtocolTolerance>>;

export type HeatUpLogOptions = {
  temperature: { column: string; scale: number };
  time: string | null;
  sampleIntervalSeconds?: number;
  setpointC: number;
  band: Band;
  temperatureAccuracy: AccuracySpec | null;
  rule: DecisionRule;
  claimedHeatUpSeconds: number | null;
  heatUpTolerance: ProtocolTolerance | null;
  temperatureTolerance: ProtocolTolerance | null;
};

/** What analyses.options holds: the mapping as the reviewer gave it, and what the analysis code is called with. */
export type StoredAnalysisOptions =
  | { kind: "waveform"; mapping: WaveformMapping; analysis: AnalysisOptions }
  | { kind: "heat_up_log"; mapping: HeatUpMapping; heatUp: HeatUpLogOptions };

export type AccuracyChoice = {
  /** "instrumentId:rangeIndex", as the mapping form sends it. */
  value: string;
  label: string;
  instrumentId: string;
  range: AccuracyRange;
};

export function accuracyChoices(instruments: readonly RunInstrument[], quantity: AccuracyRange["quantity"]): AccuracyChoice[] {
  return instruments.flatMap(({ instrumentId, snapshot }) =>
    snapshot.accuracy.flatMap((range, index) =>
      range.quantity === quantity
        ? [
            {
              value: `${instrumentId}:${index}`,
              label: `${snapshot.maker} ${snapshot.model} (${snapshot.serialNumber}), range to ${range.rangeMax} ${range.unit}: ±(${range.percentOfReading} % + ${range.offset} ${range.unit})`,
              instrumentId,
              range,
            },
          ]
        : [],
    ),
  );
}

/** The smallest range that holds the expected reading (a meter is most accurate on it), else the largest there is. */
export function defaultAccuracyChoice(choices: readonly AccuracyChoice[], expectedReading: number): string | undefined {
  const holding = choices.filter((choice) => choice.range.rangeMax >= expectedReading).sort((a, b) => a.range.rangeMax - b.range.rangeMax);
  const largest = [...choices].sort((a, b) => b.range.rangeMax - a.range.rangeMax);
  return (holding[0] ?? largest[0])?.value;
}

type Resolved = { spec: AccuracySpec | null; instrumentId: string | null };

function resolveAccuracy(instruments: readonly RunInstrument[], value: string | undefined, quantity: AccuracyRange["quantity"]): Resolved | "unknown" {
  if (value === undefined) return { spec: null, instrumentId: null };
  const choice = accuracyChoices(instruments, quantity).find((candidate) => candidate.value === value);
  if (!choice) return "unknown";
  return { spec: { percentOfReading: choice.range.percentOfReading, offset: choice.range.offset }, instrumentId: choice.instrumentId };
}

export type BuiltOptions =
  | { ok: true; options: StoredAnalysisOptions; instrumentSnapshots: InstrumentSnapshot[] }
  | { ok: false; fieldErrors: Record<string, string[]> };

function snapshotsOf(instruments: readonly RunInstrument[], ids: (string | null)[]): InstrumentSnapshot[] {
  const used = new Set(ids.filter((id) => id !== null));
  return instruments.filter(({ instrumentId }) => used.has(instrumentId)).map(({ snapshot }) => snapshot);
}

const notOnRun = "That accuracy line is not one of this run's instruments.";

export function buildWaveformOptions(input: {
  mapping: WaveformMapping;
  conditions: ProtocolConditions;
  tool: ToolRating;
  instruments: readonly RunInstrument[];
}): BuiltOptions {
  const { mapping, conditions, tool, instruments } = input;
  const current = resolveAccuracy(instruments, mapping.currentAccuracy, "current");
  const voltage = resolveAccuracy(instruments, mapping.voltageColumn ? mapping.voltageAccuracy : undefined, "voltage");
  const fieldErrors: Record<string, string[]> = {};
  if (current === "unknown") fieldErrors.currentAccuracy = [notOnRun];
  if (voltage === "unknown") fieldErrors.voltageAccuracy = [notOnRun];
  if (current === "unknown" || voltage === "unknown") return { ok: false, fieldErrors };

  const analysis: AnalysisOptions = {
    current: { column: mapping.currentColumn, scale: mapping.currentScale },
    voltage: mapping.voltageColumn ? { column: mapping.voltageColumn, scale: mapping.voltageScale ?? 1 } : null,
    time: mapping.timeColumn ?? null,
    ...(mapping.sampleIntervalSeconds === undefined ? {} : { sampleIntervalSeconds: mapping.sampleIntervalSeconds }),
    nominalVoltage: conditions.supplyVoltage,
    nominalFrequencyHz: conditions.supplyFrequencyHz,
    impedance:
      mapping.impedanceResistanceOhm === undefined || mapping.impedanceReactanceOhm === undefined
        ? null
        : { resistanceOhm: mapping.impedanceResistanceOhm, reactanceOhm: mapping.impedanceReactanceOhm },
    dmaxLimitPercent: mapping.dmaxLimitPercent,
    harmonicClass: mapping.harmonicClass,
    rating: {
      ratedPowerW: tool.ratedPowerW,
      ratedVoltage: tool.ratedVoltageMin === tool.ratedVoltageMax ? tool.ratedVoltageMin : { min: tool.ratedVoltageMin, max: tool.ratedVoltageMax },
      appliance: tool.applianceType,
      currentAccuracy: current.spec,
      voltageAccuracy: voltage.spec,
      rule: mapping.rule,
    },
  };
  return {
    ok: true,
    options: { kind: "waveform", mapping, analysis },
    instrumentSnapshots: snapshotsOf(instruments, [current.instrumentId, voltage.instrumentId]),
  };
}

export function buildHeatUpOptions(input: {
  mapping: HeatUpMapping;
  tool: ToolRating;
  tolerances: ProtocolTolerances;
  instruments: readonly RunInstrument[];
}): BuiltOptions {
  const { mapping, tool, tolerances, instruments } = input;
  const temperature = resolveAccuracy(instruments, mapping.temperatureAccuracy, "temperature");
  if (temperature === "unknown") return { ok: false, fieldErrors: { temperatureAccuracy: [notOnRun] } };
  const heatUp: HeatUpLogOptions = {
    temperature: { column: mapping.temperatureColumn, scale: mapping.temperatureScale },
    time: mapping.timeColumn ?? null,
    ...(mapping.sampleIntervalSeconds === undefined ? {} : { sampleIntervalSeconds: mapping.sampleIntervalSeconds }),
    setpointC: mapping.setpointC,
    band: { kind: "absolute", plusMinusC: mapping.bandC },
    temperatureAccuracy: temperature.spec,
    rule: mapping.rule,
    claimedHeatUpSeconds: tool.claimedHeatUpSeconds,
    heatUpTolerance: tolerances.heat_up_time ?? null,
    temperatureTolerance: tolerances.temperature_vs_setpoint ?? null,
  };
  return {
    ok: true,
    options: { kind: "heat_up_log", mapping, heatUp },
    instrumentSnapshots: snapshotsOf(instruments, [temperature.instrumentId]),
  };
}

/** The band a heat-up is judged in: the protocol's setpoint tolerance when it is in degrees, else ±10 °C. */
export function defaultHeatUpBandC(tolerances: ProtocolTolerances): number {
  const tolerance = tolerances.temperature_vs_setpoint;
  return tolerance?.kind === "absolute" ? Math.min(tolerance.plus, tolerance.minus) || Math.max(tolerance.plus, tolerance.minus) : 10;
}

type Heading = { columns: string[]; header: { key: string; value: string }[]; detected: Record<"time" | "current" | "voltage" | "temperature", string | null> };

/** "2.0000E-04", "0,2 ms", "200 us": the sample interval a scope writes in its header, in seconds. */
export function sampleIntervalFromHeader(header: Heading["header"]): number | undefined {
  const entry = header.find((line) => /interval|increment|x-?incr/i.test(line.key));
  const match = entry && /^([+]?\d*[.,]?\d+(?:e[+-]?\d+)?)\s*(s|ms|us|µs)?$/i.exec(entry.value.trim());
  if (!match) return undefined;
  const value = Number(match[1]!.replace(",", "."));
  const unit = (match[2] ?? "s").toLowerCase();
  const seconds = value * (unit === "ms" ? 1e-3 : unit === "s" ? 1 : 1e-6);
  return Number.isFinite(seconds) && seconds > 0 ? seconds : undefined;
}

const asFormValues = (mapping: object): Record<string, string> =>
  Object.fromEntries(Object.entries(mapping).flatMap(([name, value]) => (value === undefined || value === null ? [] : [[name, String(value)]])));

/** The mapping form starts from the capture's last mapping, else from what the header names and the run expects. */
export function waveformMappingDefaults(input: {
  heading: Heading;
  previous: WaveformMapping | null;
  expectedCurrentA: number;
  nominalVoltage: number;
  instruments: readonly RunInstrument[];
}): Record<string, string> {
  const { heading, previous, instruments } = input;
  if (previous) return asFormValues(previous);
  const { detected, columns } = heading;
  const free = columns.filter((column) => column !== detected.time && column !== detected.voltage);
  const interval = detected.time ? undefined : sampleIntervalFromHeader(heading.header);
  return asFormValues({
    currentColumn: detected.current ?? free[0] ?? columns[0],
    currentScale: 1,
    voltageColumn: detected.voltage ?? "",
    voltageScale: 1,
    timeColumn: detected.time ?? "",
    sampleIntervalSeconds: interval ?? "",
    harmonicClass: "A",
    dmaxLimitPercent: 4,
    currentAccuracy: defaultAccuracyChoice(accuracyChoices(instruments, "current"), input.expectedCurrentA) ?? "",
    voltageAccuracy: defaultAccuracyChoice(accuracyChoices(instruments, "voltage"), input.nominalVoltage) ?? "",
    rule: "simple",
  });
}

export function heatUpMappingDefaults(input: {
  heading: Heading;
  previous: HeatUpMapping | null;
  setpointC: number | null;
  tolerances: ProtocolTolerances;
  instruments: readonly RunInstrument[];
}): Record<string, string> {
  const { heading, previous, instruments, setpointC } = input;
  if (previous) return asFormValues(previous);
  const { detected, columns } = heading;
  return asFormValues({
    temperatureColumn: detected.temperature ?? columns.find((column) => column !== detected.time) ?? columns[0],
    temperatureScale: 1,
    timeColumn: detected.time ?? "",
    sampleIntervalSeconds: detected.time ? "" : (sampleIntervalFromHeader(heading.header) ?? ""),
    setpointC: setpointC ?? "",
    bandC: defaultHeatUpBandC(input.tolerances),
    temperatureAccuracy: defaultAccuracyChoice(accuracyChoices(instruments, "temperature"), setpointC ?? 400) ?? "",
    rule: "simple",
  });
}

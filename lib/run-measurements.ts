// A run's measurements, each with its expanded uncertainty (k = 2) and, where a rating applies, its verdict: from a
// waveform analysis, from a heat-up log, or from readings taken by hand. Pure, so the worker, the actions and the
// tests compute them the same way.

import type { AccuracyRange, MeasurementKind } from "@/db/schema";
import type { HeatUpLogOptions, ProtocolTolerances } from "@/lib/analysis-options";
import { ANALYSIS_VERSION, analysisOptionsSchema, type AnalysisOptions, type CaptureAnalysis } from "@/lib/bench/analysis";
import type { Capture } from "@/lib/bench/capture-csv";
import { describeSpread, typeAStandardUncertainty, type Spread } from "@/lib/bench/statistics";
import { analyzeHeatUp, type HeatUp } from "@/lib/bench/thermal";
import { powerInputTolerance } from "@/lib/bench/tolerance";
import {
  COVERAGE_FACTOR,
  combineRelativeUncertainties,
  specStandardUncertainty,
  uncertaintyOfReading,
  type AccuracySpec,
  type ReadingUncertainty,
} from "@/lib/bench/uncertainty";
import { judge, judgeRating, type DecisionRule, type RatingVerdict } from "@/lib/bench/verdict";
import { measurementKindInfo } from "@/lib/measurement-kinds";

export type MeasurementDraft = {
  kind: MeasurementKind;
  value: number;
  unit: string;
  expandedUncertainty: number | null;
  /** The verdict with every number it used; RatingVerdict or PowerInputVerdict. */
  verdict: object | null;
};

function draft(kind: MeasurementKind, value: number, expandedUncertainty: number | null, verdict: object | null = null): MeasurementDraft {
  return { kind, value, unit: measurementKindInfo[kind].unit, expandedUncertainty, verdict };
}

/**
 * Power input at full demand is the power while conducting, as judged (normalised to the rated voltage when the load
 * is resistive); power at setpoint is the mean over the record, the controller cycling; current is the record's
 * true RMS.
 */
export function measurementsFromWaveform(result: CaptureAnalysis, options: AnalysisOptions): MeasurementDraft[] {
  const { rating } = analysisOptionsSchema.parse(options);
  const currentAccuracy = rating?.currentAccuracy ?? null;
  const voltageAccuracy = rating?.voltageAccuracy ?? null;
  const drafts: MeasurementDraft[] = [];

  const { verdict } = result;
  const whileConducting = result.power?.whileConducting ?? result.estimatedPower?.whileConducting ?? null;
  if (verdict !== null) drafts.push(draft("power_input_full_demand", verdict.normalized ?? verdict.measured, verdict.expandedUncertainty, verdict));
  else if (whileConducting !== null && whileConducting > 0) drafts.push(draft("power_input_full_demand", whileConducting, null));

  if (result.power !== null && result.voltage !== null && result.power.real > 0) {
    const terms = [];
    if (currentAccuracy && result.current.rms > 0) {
      terms.push({ source: "current", relativeStandardUncertainty: specStandardUncertainty(currentAccuracy, result.current.rms) / result.current.rms, exponent: 1 });
    }
    if (voltageAccuracy && result.voltage.rms > 0) {
      terms.push({ source: "voltage", relativeStandardUncertainty: specStandardUncertainty(voltageAccuracy, result.voltage.rms) / result.voltage.rms, exponent: 1 });
    }
    const expanded = terms.length ? COVERAGE_FACTOR * combineRelativeUncertainties(terms) * result.power.real : null;
    drafts.push(draft("power_input_at_setpoint", result.power.real, expanded));
  } else if (result.estimatedPower !== null && result.estimatedPower.mean > 0) {
    // An estimate from the nominal voltage has no measurement uncertainty to state.
    drafts.push(draft("power_input_at_setpoint", result.estimatedPower.mean, null));
  }

  drafts.push(draft("current", result.current.rms, currentAccuracy ? uncertaintyOfReading({ reading: result.current.rms, accuracy: currentAccuracy }).expanded : null));
  return drafts;
}

export interface HeatUpLogResult {
  analysisVersion: string;
  capture: {
    samples: number;
    durationSeconds: number;
    sampleRateHz: number;
    timeSource: Capture["timeSource"];
    columns: { time: string | null; temperature: string };
    scale: number;
  };
  heatUp: HeatUp;
  heatUpTime: { measuredS: number | null; expandedUncertaintyS: number; basis: string };
  heatUpVerdict: RatingVerdict | null;
  heatUpVerdictUnavailableReason: string | null;
  steadyTemperature: { measuredC: number; expandedUncertaintyC: number | null };
  temperatureVerdict: RatingVerdict | null;
  temperatureVerdictUnavailableReason: string | null;
}

/** Heat-up from a logged temperature: band entry against the claimed heat-up time, the settled temperature against the setpoint. */
export function analyzeHeatUpLog(
  capture: Pick<Capture, "temperature" | "sampleRateHz" | "timeSource" | "mapping">,
  options: HeatUpLogOptions,
): HeatUpLogResult {
  const temperature = capture.temperature;
  if (temperature === null) throw new Error("no temperature column: a heat-up log needs one");
  const intervalS = 1 / capture.sampleRateHz;
  const log = { timeS: Array.from(temperature, (_, k) => k * intervalS), temperatureC: Array.from(temperature) };
  const heatUp = analyzeHeatUp({ log, setpointC: options.setpointC, band: options.band });

  // Band entry is found to the nearest sample, so the interval bounds its error (read as rectangular).
  const timing = uncertaintyOfReading({ reading: heatUp.bandEntryS ?? 0, accuracy: { percentOfReading: 0, offset: intervalS } });
  const heatUpTime = {
    measuredS: heatUp.bandEntryS,
    expandedUncertaintyS: timing.expanded,
    basis:
      `time from the start of the log to entering ${heatUp.band.description} of the ${options.setpointC} °C setpoint for good; ` +
      `U from the ${intervalS} s sample interval only: the thermometer's accuracy moves the band's edges and is not in it`,
  };
  let heatUpVerdict: RatingVerdict | null = null;
  let heatUpVerdictUnavailableReason: string | null = null;
  if (heatUp.bandEntryS === null) heatUpVerdictUnavailableReason = "the log ends before the temperature settles in the band";
  else if (options.claimedHeatUpSeconds === null) heatUpVerdictUnavailableReason = "the maker claims no heat-up time for this tool";
  else if (options.heatUpTolerance === null) heatUpVerdictUnavailableReason = "the protocol sets no heat-up time tolerance";
  else {
    heatUpVerdict = judgeRating({
      rated: options.claimedHeatUpSeconds,
      measured: heatUp.bandEntryS,
      expandedUncertainty: timing.expanded,
      tolerance: options.heatUpTolerance,
      rule: options.rule,
    });
  }

  const measuredC = heatUp.finalTemperatureC;
  const expandedUncertaintyC = options.temperatureAccuracy ? uncertaintyOfReading({ reading: measuredC, accuracy: options.temperatureAccuracy }).expanded : null;
  let temperatureVerdict: RatingVerdict | null = null;
  let temperatureVerdictUnavailableReason: string | null = null;
  if (options.temperatureTolerance === null) temperatureVerdictUnavailableReason = "the protocol sets no tolerance on the temperature at setpoint";
  else {
    temperatureVerdict = judgeRating({
      rated: options.setpointC,
      measured: measuredC,
      expandedUncertainty: expandedUncertaintyC ?? 0,
      tolerance: options.temperatureTolerance,
      rule: options.rule,
    });
  }

  return {
    analysisVersion: ANALYSIS_VERSION,
    capture: {
      samples: temperature.length,
      durationSeconds: temperature.length * intervalS,
      sampleRateHz: capture.sampleRateHz,
      timeSource: capture.timeSource,
      columns: { time: capture.mapping.time, temperature: capture.mapping.temperature ?? options.temperature.column },
      scale: options.temperature.scale,
    },
    heatUp,
    heatUpTime,
    heatUpVerdict,
    heatUpVerdictUnavailableReason,
    steadyTemperature: { measuredC, expandedUncertaintyC },
    temperatureVerdict,
    temperatureVerdictUnavailableReason,
  };
}

export function measurementsFromHeatUp(result: HeatUpLogResult): MeasurementDraft[] {
  const drafts: MeasurementDraft[] = [];
  if (result.heatUpTime.measuredS !== null) {
    drafts.push(draft("heat_up_time", result.heatUpTime.measuredS, result.heatUpTime.expandedUncertaintyS, result.heatUpVerdict));
  }
  drafts.push(draft("temperature_vs_setpoint", result.steadyTemperature.measuredC, result.steadyTemperature.expandedUncertaintyC, result.temperatureVerdict));
  drafts.push(draft("temperature_stability", result.heatUp.steadyState.standardDeviation, null));
  return drafts;
}

/** The smallest accuracy line in the reading's unit whose range holds it; null when the instrument has none. */
export function accuracyForReading(accuracy: readonly AccuracyRange[], unit: string, reading: number): AccuracySpec | null {
  const candidates = accuracy
    .filter((range) => range.unit.toLowerCase() === unit.toLowerCase() && range.rangeMax >= Math.abs(reading))
    .sort((a, b) => a.rangeMax - b.rangeMax);
  const range = candidates[0];
  return range ? { percentOfReading: range.percentOfReading, offset: range.offset } : null;
}

export type ReadingRatings = {
  ratedPowerW: number;
  applianceType: "heating" | "motor" | "combined";
  motorShareAboveHalf: boolean | null;
  ratedAirflowLpm: number | null;
  claimedHeatUpSeconds: number | null;
  temperatureSetpointC: number | null;
  tolerances: ProtocolTolerances;
};

export type ReadingSpread = { spread: Spread; typeA: number | null; uncertainty: ReadingUncertainty };

/** Mean and spread of the repeats, and Type A (s/√n) combined with the instrument's Type B into U (k = 2). */
export function describeReadings({ values, accuracy }: { values: readonly number[]; accuracy: AccuracySpec | null }): ReadingSpread {
  const spread = describeSpread(values, "readings");
  const repeats = values.length > 1 ? values : undefined;
  return {
    spread,
    typeA: repeats ? typeAStandardUncertainty(repeats) : null,
    uncertainty: uncertaintyOfReading({ reading: spread.mean, accuracy, repeats }),
  };
}

export type ReadingFigures = ReadingSpread & { verdict: RatingVerdict | null };

/** The readings described, and judged where a rating applies to their kind. */
export function manualReadingFigures(input: {
  kind: MeasurementKind;
  values: readonly number[];
  accuracy: AccuracySpec | null;
  rule: DecisionRule;
  ratings: ReadingRatings;
}): ReadingFigures {
  const { kind, rule, ratings } = input;
  const described = describeReadings(input);
  const judged = { measured: described.spread.mean, expandedUncertainty: described.uncertainty.expanded, rule };
  const byTolerance = (rated: number | null, tolerance: ProtocolTolerances[keyof ProtocolTolerances]) =>
    rated === null || tolerance === undefined ? null : judgeRating({ ...judged, rated, tolerance });

  let verdict: RatingVerdict | null = null;
  if (kind === "airflow") verdict = byTolerance(ratings.ratedAirflowLpm, ratings.tolerances.airflow);
  else if (kind === "heat_up_time") verdict = byTolerance(ratings.claimedHeatUpSeconds, ratings.tolerances.heat_up_time);
  else if (kind === "temperature_vs_setpoint") verdict = byTolerance(ratings.temperatureSetpointC, ratings.tolerances.temperature_vs_setpoint);
  else if (kind === "power_input_full_demand") {
    const tolerance = powerInputTolerance({
      ratedPowerW: ratings.ratedPowerW,
      appliance: ratings.applianceType,
      motorShareAbove50: ratings.motorShareAboveHalf ?? undefined,
    });
    const judgement = judge({ ...judged, lower: tolerance.lower, upper: tolerance.upper });
    verdict = {
      rated: tolerance.rated,
      measured: judgement.measured,
      lower: judgement.lower,
      upper: judgement.upper,
      acceptanceLower: judgement.acceptanceLower,
      acceptanceUpper: judgement.acceptanceUpper,
      expandedUncertainty: judgement.expandedUncertainty,
      coverageFactor: COVERAGE_FACTOR,
      rule,
      result: judgement.result,
      tolerance: { source: tolerance.source, description: tolerance.row },
    };
  }
  return { ...described, verdict };
}

// The one analysis of a capture, used by the CLI (scripts/analyze.ts) and by
// the web app's background job: read the CSV, measure, and judge. The object
// it returns is the CLI's --json output, documented in the README.

import { z } from "zod";
import { assertEnoughCycles, CaptureError, readCapture, readCaptureFile, type Capture, type CaptureData, type CaptureBlocksReader } from "./capture-csv";
import {
  currentFigures,
  halfCycleBoundaries,
  measureMainsFrequency,
  peakMagnitude,
  powerFigures,
  voltageFigures,
  type CrossingScan,
  type CurrentFigures,
} from "./electrical";
import { estimateFlicker, type FlickerResult } from "./flicker";
import {
  CONDUCTING_FLOOR_AMPS,
  CONDUCTING_SHARE_OF_LARGEST,
  classifyConduction,
  estimatePowerFromCurrent,
  sumHalfCycles,
  tabulateHalfCycles,
  type EstimatedPower,
  type Firing,
} from "./half-cycles";
import {
  assessHarmonics,
  harmonicSpectrum,
  harmonicWindowCycles,
  harmonicWindows,
  measureHarmonics,
  measureHarmonicWindows,
  type HarmonicSpectrum,
  type HarmonicsInput,
  type HarmonicsReport,
  type HarmonicWindows,
} from "./harmonics";
import { parseAccuracySpec } from "./uncertainty";
import { judgePowerInput, type PowerInputVerdict } from "./verdict";

/** Stored with every analysis: bump it whenever a change to this code can change a figure. */
export const ANALYSIS_VERSION = "1.0.0";

const columnRef = z.union([z.string().trim().min(1), z.number().int().positive()]);
const channel = z.object({
  /** Omitted: found by name, so a scale can be given for a column found that way. */
  column: columnRef.optional(),
  scale: z
    .number()
    .refine((scale) => scale !== 0, "scale must not be 0")
    .default(1),
});
const accuracy = z.union([
  z.string().transform((text, context) => {
    try {
      return parseAccuracySpec(text);
    } catch (error) {
      context.addIssue({ code: "custom", message: (error as Error).message });
      return z.NEVER;
    }
  }),
  z.object({ percentOfReading: z.number().nonnegative(), offset: z.number().nonnegative() }),
]);

export const analysisOptionsSchema = z.object({
  /** Omitted: a column named like current (current, I, amps), or the only channel there is. */
  current: channel.optional(),
  /** Omitted: a column named like voltage (voltage, V, U) if there is one; null: none. */
  voltage: channel.nullable().optional(),
  /** Omitted: a column named like time (time, t, timestamp, seconds); null: none, give sampleIntervalSeconds. */
  time: columnRef.nullable().optional(),
  sampleIntervalSeconds: z.number().positive().optional(),
  nominalVoltage: z.number().positive().default(230),
  /** Omitted: 60 Hz for nominal voltages up to 150 V, else 50 Hz. */
  nominalFrequencyHz: z.number().min(40).max(70).optional(),
  /** Omitted: the 120 V lamp for nominal voltages up to 150 V, else the 230 V lamp. */
  lamp: z.union([z.literal(230), z.literal(120)]).optional(),
  /** Null: the IEC 61000-3-3 reference impedance where one is defined. */
  impedance: z.object({ resistanceOhm: z.number().nonnegative(), reactanceOhm: z.number().nonnegative() }).nullable().default(null),
  /** IEC 61000-3-3: 4 % in general, 6 % for equipment switched a few times a day, 7 % for equipment attended while in use. */
  dmaxLimitPercent: z.union([z.literal(4), z.literal(6), z.literal(7)]).default(4),
  harmonicClass: z.enum(["A", "B"]).default("A"),
  rating: z
    .object({
      ratedPowerW: z.number().positive(),
      ratedVoltage: z.union([
        z.number().positive(),
        z
          .object({ min: z.number().positive(), max: z.number().positive() })
          .refine(({ min, max }) => max > min, "the rated voltage range's maximum must be above its minimum"),
      ]),
      appliance: z.enum(["heating", "motor", "combined"]).default("heating"),
      currentAccuracy: accuracy.nullable().default(null),
      voltageAccuracy: accuracy.nullable().default(null),
      rule: z.enum(["simple", "guarded"]).default("simple"),
    })
    .nullable()
    .default(null),
});

export type AnalysisOptions = z.input<typeof analysisOptionsSchema>;
type ParsedOptions = z.output<typeof analysisOptionsSchema>;

export type CaptureSource = { path: string } | { data: CaptureData; sizeBytes?: number };

export interface CaptureAnalysis {
  analysisVersion: string;
  capture: {
    samples: number;
    durationSeconds: number;
    timeSource: Capture["timeSource"];
    columns: { time: string | null; current: string; voltage: string | null };
    scales: { current: number; voltage: number | null };
  };
  frequencyHz: number;
  frequencySource: "voltage" | "current" | "nominal";
  nominalFrequencyHz: number;
  nominalVoltage: number;
  sampleRateHz: number;
  current: CurrentFigures;
  voltage: { rms: number; peak: number; rmsWhileConducting: number | null } | null;
  power: { real: number; apparent: number; factor: number | null; whileConducting: number | null; factorWhileConducting: number | null } | null;
  estimatedPower: EstimatedPower | null;
  halfCycles: {
    count: number;
    conducting: number;
    duty: number;
    switchesPerMinute: number;
    longestOffSeconds: number;
    firing: Firing;
    asymmetric: boolean;
    asymmetricNote: string | null;
    positiveConducting: number;
    negativeConducting: number;
    thresholdAmps: number;
    currentRmsWhileConducting: number | null;
    conductionMap: string;
  };
  harmonics: HarmonicsReport;
  flicker: FlickerResult | null;
  flickerUnavailableReason: string | null;
  verdict: PowerInputVerdict | null;
  verdictUnavailableReason: string | null;
  assumptions: string[];
  warnings: string[];
}

/** Receives each stage's wall time, for the benchmark. */
export type StageObserver = (stage: string, milliseconds: number) => void;

/**
 * A second thread (lib/bench/helper-thread.ts) for callers that start one: it reads blocks of a large capture file
 * beside this thread, looks for the later half's zero crossings, and measures the peaks and the harmonics while this
 * thread does the rest. The figures are the same without it.
 */
export interface AnalysisHelper {
  readBlocks: CaptureBlocksReader;
  /**
   * Starts measureHarmonicWindows or peakMagnitude on the helper; the function returned waits for it to be done.
   * Signals and windows must be on shared memory.
   */
  startHarmonicWindows(input: HarmonicsInput, windows: HarmonicWindows): () => void;
  startPeak(signal: Float64Array): () => number;
  /** Starts findZeroCrossings on the part of a signal after `after`. */
  startCrossings: CrossingScan;
}

function nominalFrequencyFor(options: ParsedOptions): number {
  return options.nominalFrequencyHz ?? (options.nominalVoltage <= 150 ? 60 : 50);
}

/** Reads a capture (a file, or bytes and chunks from storage) and analyses it. */
export async function analyzeCapture(source: CaptureSource, options: AnalysisOptions, observer?: StageObserver, helper?: AnalysisHelper): Promise<CaptureAnalysis> {
  return analyzeSamples(await readCaptureForAnalysis(source, options, observer, helper), options, observer, helper);
}

/** The reading half of analyzeCapture, for callers that need the samples too (the worker draws charts from them). */
export async function readCaptureForAnalysis(source: CaptureSource, options: AnalysisOptions, observer?: StageObserver, helper?: AnalysisHelper): Promise<Capture> {
  const parsed = analysisOptionsSchema.parse(options);
  const nominalHz = nominalFrequencyFor(parsed);
  const readOptions = {
    current: parsed.current,
    voltage: parsed.voltage,
    temperature: null,
    time: parsed.time,
    sampleIntervalSeconds: parsed.sampleIntervalSeconds,
    mains: { frequencyHz: nominalHz, minWholeCycles: harmonicWindowCycles(nominalHz) },
    required: ["current" as const],
  };
  const started = performance.now();
  const capture =
    "path" in source
      ? await readCaptureFile(source.path, readOptions, helper?.readBlocks)
      : await readCapture(source.data, { ...readOptions, sizeHintBytes: source.sizeBytes });
  observer?.("read", performance.now() - started);
  return capture;
}

/** The analysis proper, on samples already read (synthetic waveforms in tests come in here too). */
export function analyzeSamples(
  capture: Pick<Capture, "current" | "voltage" | "sampleRateHz"> & Partial<Pick<Capture, "timeSource" | "mapping">>,
  options: AnalysisOptions,
  observer?: StageObserver,
  helper?: AnalysisHelper,
): CaptureAnalysis {
  const parsed = analysisOptionsSchema.parse(options);
  const { sampleRateHz, voltage } = capture;
  const current = capture.current;
  if (current === null) throw new CaptureError("no current column: the analysis needs the current", null);
  if (voltage !== null && voltage.length !== current.length) throw new Error("current and voltage must hold the same number of samples");
  const nominalHz = nominalFrequencyFor(parsed);
  const { nominalVoltage } = parsed;
  const assumptions: string[] = [];
  const warnings: string[] = [];
  let stageStart = performance.now();
  const stage = (name: string) => {
    const now = performance.now();
    observer?.(name, now - stageStart);
    stageStart = now;
  };

  // On a helper thread (signals on shared memory) the current's peak is measured while this one sets the crossings'
  // band, the later half's crossings are found while this one finds the earlier half's, and the harmonics are
  // measured while this one works through the half-cycles and the flicker, after which it takes the windows left.
  const onHelper = helper !== undefined && current.buffer instanceof SharedArrayBuffer ? helper : null;
  const peakOf = (signal: Float64Array) => (onHelper ? onHelper.startPeak(signal) : () => peakMagnitude(signal));
  const currentPeak = peakOf(current);
  const mains = measureMainsFrequency({ current, voltage, sampleRateHz, nominalHz, scanAfter: onHelper?.startCrossings });
  // Not needed before the half-cycles are added up, so it waits behind the crossings on the helper.
  const voltagePeak = voltage === null ? null : peakOf(voltage);
  const { frequencyHz } = mains;
  const windowCycles = harmonicWindowCycles(frequencyHz);
  assertEnoughCycles(current.length, sampleRateHz, frequencyHz, windowCycles);
  if (mains.source === "nominal") {
    warnings.push(`no usable zero crossings in the voltage or the current: the nominal ${nominalHz} Hz is used as the mains frequency`);
  }
  if (Math.abs(frequencyHz - nominalHz) > 0.05 * nominalHz) {
    warnings.push(`measured frequency ${round(frequencyHz, 3)} Hz is more than 5 % from the nominal ${nominalHz} Hz: check the supply settings`);
  }
  stage("frequency");

  const boundaries = halfCycleBoundaries(mains.crossings, sampleRateHz, frequencyHz, current.length);
  const harmonicsInput = { current, sampleRateHz, frequencyHz, startSample: boundaries[0] ?? 0 };
  const sharedSpectrum = onHelper ? startSharedHarmonics(onHelper, harmonicsInput) : null;
  const table = tabulateHalfCycles(current, voltage, boundaries);
  const record = sumHalfCycles(table, 0, table.count);
  const conduction = classifyConduction(table, sampleRateHz);
  const conducting = sumHalfCycles(table, 0, table.count, conduction.conductingMask);
  const currentRecord = currentFigures(record, currentPeak());
  const currentRmsWhileConducting = conducting.count > 0 ? Math.sqrt(conducting.currentSquared / conducting.count) : null;
  const wholeCycles = table.count / 2;
  assumptions.push(
    `RMS, DC, real and apparent power are over the ${wholeCycles} whole cycles from the first half-cycle boundary ` +
      `(${round(wholeCycles / frequencyHz, 3)} s); peaks are over every sample.`,
    `Mains frequency ${round(frequencyHz, 4)} Hz from the ${mains.source === "nominal" ? "nominal value" : `${mains.source}'s zero crossings`}; ` +
      "half-cycle boundaries at the zero crossings, placed by that frequency where there are none.",
    `A half-cycle conducts when its RMS current exceeds ${CONDUCTING_SHARE_OF_LARGEST * 100} % of the largest half-cycle RMS current ` +
      `and ${CONDUCTING_FLOOR_AMPS * 1000} mA (here ${round(conduction.thresholdAmps, 4)} A); partial conduction within a half-cycle ` +
      "(phase-angle control) counts as conducting.",
  );

  let voltageReport: CaptureAnalysis["voltage"] = null;
  let power: CaptureAnalysis["power"] = null;
  let estimatedPower: EstimatedPower | null = null;
  let powerWhileConducting: number | null = null;
  if (voltage !== null && voltagePeak !== null) {
    const voltageRecord = voltageFigures(record, voltagePeak());
    const recordPower = powerFigures(record);
    const whileConducting = conducting.count > 0 ? powerFigures(conducting) : null;
    voltageReport = {
      ...voltageRecord,
      rmsWhileConducting: conducting.count > 0 ? Math.sqrt(conducting.voltageSquared / conducting.count) : null,
    };
    power = {
      ...recordPower,
      whileConducting: whileConducting?.real ?? null,
      factorWhileConducting: whileConducting?.factor ?? null,
    };
    powerWhileConducting = power.whileConducting;
    const supply = voltageReport.rmsWhileConducting ?? voltageRecord.rms;
    if (Math.abs(supply - nominalVoltage) > 0.1 * nominalVoltage) {
      warnings.push(`measured supply ${round(supply, 1)} V is more than 10 % from the nominal ${nominalVoltage} V: check the nominal voltage`);
    }
    if (recordPower.real < 0) {
      warnings.push("negative real power: the current clamp or the voltage probe is probably connected the wrong way round");
    }
  } else if (currentRmsWhileConducting !== null) {
    estimatedPower = estimatePowerFromCurrent({ nominalVoltage, currentRmsWhileConducting, currentRmsRecord: currentRecord.rms });
    powerWhileConducting = estimatedPower.whileConducting;
    assumptions.push(`Power is estimated (no voltage channel): ${estimatedPower.basis}.`);
  }
  stage("half-cycles");

  const flicker = estimateFlicker({
    current,
    sampleRateHz,
    frequencyHz,
    nominalVoltage,
    lamp: parsed.lamp ?? (nominalVoltage <= 150 ? 120 : 230),
    impedance: parsed.impedance,
    dmaxLimitPercent: parsed.dmaxLimitPercent,
    currentPeakAmps: currentRecord.peak,
  });
  stage("flicker");

  const harmonics = assessHarmonics({
    spectrum: sharedSpectrum ? sharedSpectrum() : measureHarmonics(harmonicsInput),
    harmonicClass: parsed.harmonicClass,
    nominalVoltage,
    powerW: parsed.rating?.ratedPowerW ?? powerWhileConducting,
    powerIsRated: parsed.rating !== null,
    currentRmsWhileConducting,
  });
  stage("harmonics");

  let verdict: PowerInputVerdict | null = null;
  let verdictUnavailableReason: string | null = null;
  const { rating } = parsed;
  if (rating !== null) {
    if (powerWhileConducting === null || !(powerWhileConducting > 0) || currentRmsWhileConducting === null) {
      verdictUnavailableReason = "no power while conducting to judge: the current never conducted, or the real power is not positive";
    } else {
      verdict = judgePowerInput({
        ratedPowerW: rating.ratedPowerW,
        ratedVoltage: rating.ratedVoltage,
        appliance: rating.appliance,
        powerWhileConductingW: powerWhileConducting,
        voltageRmsWhileConducting: voltageReport?.rmsWhileConducting ?? null,
        currentRmsWhileConducting,
        powerFactorWhileConducting: power === null ? null : clampPowerFactor(power.factorWhileConducting),
        currentAccuracy: rating.currentAccuracy,
        voltageAccuracy: rating.voltageAccuracy,
        rule: rating.rule,
      });
      if (rating.currentAccuracy === null) {
        warnings.push("no current accuracy given: the verdict's uncertainty leaves out the current reading");
      }
      if (voltage !== null && rating.voltageAccuracy === null) {
        warnings.push("no voltage accuracy given: the verdict's uncertainty leaves out the voltage reading");
      }
    }
  }
  stage("verdict");

  return {
    analysisVersion: ANALYSIS_VERSION,
    capture: {
      samples: current.length,
      durationSeconds: current.length / sampleRateHz,
      timeSource: capture.timeSource ?? "sample interval",
      columns: {
        time: capture.mapping?.time ?? null,
        current: capture.mapping?.current ?? "current",
        voltage: voltage === null ? null : (capture.mapping?.voltage ?? "voltage"),
      },
      scales: { current: parsed.current?.scale ?? 1, voltage: voltage === null ? null : (parsed.voltage?.scale ?? 1) },
    },
    frequencyHz,
    frequencySource: mains.source,
    nominalFrequencyHz: nominalHz,
    nominalVoltage,
    sampleRateHz,
    current: currentRecord,
    voltage: voltageReport,
    power,
    estimatedPower,
    halfCycles: {
      count: conduction.halfCycles,
      conducting: conduction.conducting,
      duty: conduction.duty,
      switchesPerMinute: conduction.switchesPerMinute,
      longestOffSeconds: conduction.longestOffSeconds,
      firing: conduction.firing,
      asymmetric: conduction.asymmetric,
      asymmetricNote: conduction.asymmetric
        ? `asymmetric control: ${conduction.positiveConducting} positive and ${conduction.negativeConducting} negative ` +
          "half-cycles conduct, which puts DC and even harmonics on the supply; IEC 61000-3-2 clause 6.2 permits " +
          "asymmetrical control only in narrow cases, so check whether this tool is one of them"
        : null,
      positiveConducting: conduction.positiveConducting,
      negativeConducting: conduction.negativeConducting,
      thresholdAmps: conduction.thresholdAmps,
      currentRmsWhileConducting,
      conductionMap: conduction.map,
    },
    harmonics,
    flicker: flicker.pst === null ? null : flicker,
    flickerUnavailableReason: flicker.pst === null ? flicker.reason : null,
    verdict,
    verdictUnavailableReason,
    assumptions,
    warnings,
  };
}

/** Sets the helper on the harmonic windows; the function returned takes the windows it has not, waits for its last, and adds them all up. */
function startSharedHarmonics(helper: AnalysisHelper, input: HarmonicsInput): () => HarmonicSpectrum {
  const windows = harmonicWindows(input, true);
  const helperDone = helper.startHarmonicWindows(input, windows);
  return () => {
    measureHarmonicWindows(input, windows);
    helperDone();
    return harmonicSpectrum(input, windows);
  };
}

/** P/(Vrms·Irms) can land a rounding error above 1 for a pure resistance. */
function clampPowerFactor(factor: number | null): number | null {
  return factor === null || factor <= 0 ? null : Math.min(1, factor);
}

function round(value: number, digits: number): number {
  return Number(value.toFixed(digits));
}

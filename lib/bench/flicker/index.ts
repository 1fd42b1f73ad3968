/**
 * Flicker a tool would cause on a shared supply: the point-of-connection voltage simulated from
 * its measured current through a supply impedance, judged by IEC 61000-3-3 (dc, dmax, Tmax, Pst)
 * with Pst from an IEC 61000-4-15 flickermeter and the analytical method as a cross-check.
 */
import { analyticalMethod, type AnalyticalPst } from "./analytical";
import {
  demodulateHalfCycles,
  nominalSupplyFrequency,
  OBSERVATION_SECONDS,
  pinstSeries,
  pstFromPinst,
  type Lamp,
} from "./flickermeter";
import { pccHalfCycleRms, referenceImpedance, type SupplyImpedance } from "./pcc-voltage";
import { DC_LIMIT_PERCENT, voltageChanges } from "./voltage-changes";

export { flickermeterPst, plt, type Lamp } from "./flickermeter";
export { referenceImpedance, type SupplyImpedance } from "./pcc-voltage";
export type { AnalyticalPst } from "./analytical";

/** dmax limits of IEC 61000-3-3: 4 % in general, 6 % for equipment switched a few times a day, 7 % for equipment attended while in use. */
export type DmaxLimitPercent = 4 | 6 | 7;

export interface FlickerInput {
  /** Measured current, amperes, uniformly sampled. */
  current: Float64Array;
  sampleRateHz: number;
  /** Measured supply frequency. */
  frequencyHz: number;
  nominalVoltage: number;
  lamp: Lamp;
  /** Supply impedance; null takes the IEC 61000-3-3 reference impedance where one is defined. */
  impedance: SupplyImpedance | null;
  dmaxLimitPercent: DmaxLimitPercent;
  /** The current's largest magnitude, when the caller has measured it already. */
  currentPeakAmps?: number;
}

export interface FlickerResult {
  pst: number;
  pstLimit: 1;
  dcPercent: number;
  dcLimitPercent: 3.3;
  dmaxPercent: number;
  dmaxLimitPercent: DmaxLimitPercent;
  tmaxSeconds: number;
  tmaxLimitSeconds: 0.5;
  changesPerMinute: number;
  impedance: SupplyImpedance & { source: "IEC 61000-3-3 reference" | "user" };
  analytical: AnalyticalPst | null;
  assumptions: string[];
}

export interface FlickerUnavailable {
  pst: null;
  reason: string;
}

const MIN_SAMPLE_RATE_HZ = 1000;
/** One second: the shortest steady state IEC 61000-3-3 recognises. */
const MIN_CAPTURE_SECONDS = 1;

function unavailable(reason: string): FlickerUnavailable {
  return { pst: null, reason };
}

export function estimateFlicker(input: FlickerInput): FlickerResult | FlickerUnavailable {
  const { current, sampleRateHz, frequencyHz, nominalVoltage, lamp } = input;
  if (!(nominalVoltage > 0)) return unavailable(`nominal voltage must be positive, got ${nominalVoltage}`);
  if (!(sampleRateHz >= MIN_SAMPLE_RATE_HZ)) {
    return unavailable(`flicker needs at least ${MIN_SAMPLE_RATE_HZ} samples/s, the capture has ${sampleRateHz}`);
  }
  const supply = nominalSupplyFrequency(frequencyHz);
  if (supply === null) return unavailable(`supply frequency ${frequencyHz} Hz is neither 50 Hz nor 60 Hz (±5 %)`);

  const reference = referenceImpedance(nominalVoltage, frequencyHz);
  const impedance = input.impedance ?? reference;
  if (impedance === null) {
    return unavailable(
      `IEC 61000-3-3 defines no reference impedance for a ${nominalVoltage} V / ${supply} Hz supply (it covers 220–250 V at 50 Hz); give the supply impedance to estimate flicker`,
    );
  }
  if (!(impedance.resistanceOhm >= 0 && impedance.reactanceOhm >= 0) || !Number.isFinite(impedance.resistanceOhm + impedance.reactanceOhm)) {
    return unavailable(`supply impedance must be finite and non-negative, got ${impedance.resistanceOhm} + j${impedance.reactanceOhm} Ω`);
  }

  const halfCycles = pccHalfCycleRms({ current, sampleRateHz, frequencyHz, nominalVoltage, nominalFrequencyHz: supply, impedance, currentPeakAmps: input.currentPeakAmps });
  const seconds = halfCycles.rms.length * halfCycles.halfCycleSeconds;
  if (seconds < MIN_CAPTURE_SECONDS) {
    return unavailable(`the capture holds ${seconds.toFixed(2)} s of whole half-cycles; flicker needs at least ${MIN_CAPTURE_SECONDS} s`);
  }

  const changes = voltageChanges(halfCycles, nominalVoltage);
  const pinst = pinstSeries(demodulateHalfCycles(halfCycles.rms, halfCycles.halfCycleSeconds), supply, lamp, "repeated");
  const source = input.impedance === null ? "IEC 61000-3-3 reference" : "user";

  const assumptions = [
    `The ${seconds.toFixed(1)} s capture is repeated end to end to fill the ${OBSERVATION_SECONDS / 60}-minute Pst observation period.`,
    `Point-of-connection voltage simulated: an ideal ${nominalVoltage} V, ${frequencyHz.toFixed(3)} Hz sinusoidal source behind ${impedance.resistanceOhm} + j${impedance.reactanceOhm} Ω (${source === "user" ? "impedance given by the user" : "IEC 61000-3-3 reference impedance"}), carrying the measured current unchanged.`,
    "The source voltage is taken in phase with the current's fundamental, as for a resistive load such as a burst-fired heater; a reactive or phase-angle-controlled load shifts it.",
    "The flickermeter is fed the half-cycle r.m.s. voltage: exact for changes at zero crossings (burst-fire); changes within a half-cycle are averaged over it.",
    `${lamp} V lamp model of IEC 61000-4-15.`,
    "Steady state: half-cycle r.m.s. voltage within ±0.2 % of the nominal voltage for at least 1 s (IEC 61000-3-3 definition, tolerance from memory).",
  ];
  if (reference === null) {
    assumptions.push(`IEC 61000-3-3 covers 220–250 V, 50 Hz supplies; its limits are shown for comparison on this ${nominalVoltage} V / ${supply} Hz supply.`);
  }

  return {
    pst: pstFromPinst(pinst),
    pstLimit: 1,
    dcPercent: changes.dcPercent,
    dcLimitPercent: DC_LIMIT_PERCENT,
    dmaxPercent: changes.dmaxPercent,
    dmaxLimitPercent: input.dmaxLimitPercent,
    tmaxSeconds: changes.tmaxSeconds,
    tmaxLimitSeconds: 0.5,
    changesPerMinute: changes.changesPerMinute,
    impedance: { resistanceOhm: impedance.resistanceOhm, reactanceOhm: impedance.reactanceOhm, source },
    analytical: analyticalMethod(changes),
    assumptions,
  };
}

/**
 * Digital flickermeter after IEC 61000-4-15:2010: input voltage adaptor, squaring demodulator,
 * 0.05 Hz high-pass and 6th-order Butterworth low-pass (35 Hz on 50 Hz supplies, 42 Hz on 60 Hz),
 * lamp–eye weighting filter, squaring and 300 ms first-order smoothing (Pinst), then the
 * statistical classification over the 10-minute observation period (Pst).
 *
 * Internal sample rate: the demodulated signal (the voltage squared) is averaged over blocks to
 * about 2 kHz before the filters run. Block averaging is a sinc low-pass with its nulls on the
 * multiples of the new rate, and whatever would fold into the 0–42 Hz band the meter looks at
 * lies beside those nulls (attenuated about fifty-fold or more); the 2f carrier (100 or 120 Hz)
 * stays far below the new Nyquist frequency, for the Butterworth to remove as the standard
 * intends. At 2 kHz the 620 s run is 1.24 M samples, tens of milliseconds, instead of 31 M at a
 * 50 kS/s capture's own rate.
 */
import {
  butterworthLowPass,
  cascadeMagnitude,
  firstOrderHighPass,
  firstOrderLowPass,
  SectionCascade,
  weightingFilter,
  type Lamp,
} from "./filters";

export type { Lamp } from "./filters";

export const OBSERVATION_SECONDS = 600;

/** Filters run this long before the observation period opens, so their start-up transients are gone (high-pass τ = 3.2 s). */
const SETTLING_SECONDS = 20;

const INTERNAL_RATE_HZ = 2000;
/** Samples filtered at a time: few enough to stay in the CPU's cache from one section of the cascade to the next. */
const PINST_BLOCK = 4096;
const MIN_SAMPLE_RATE_HZ = 1000;

/**
 * Input voltage adaptor: the reference level follows the r.m.s. voltage through a first-order
 * low-pass. IEC 61000-4-15 speaks of a time constant of about one minute (from memory; one public
 * implementation uses 27.3 s): either way it only tracks the slow level, never the flicker.
 */
const ADAPTOR_TIME_CONSTANT_SECONDS = 60;
const HIGH_PASS_HZ = 0.05;
const SMOOTHING_TIME_CONSTANT_SECONDS = 0.3;

/** Calibration point (IEC 61000-4-15:2010 table 1, 230 V lamp): 8.8 Hz sinusoidal modulation of ΔV/V = 0.250 % gives Pinst = 1. */
const CALIBRATION_FREQUENCY_HZ = 8.8;
const CALIBRATION_DELTA_V_OVER_V = 0.0025;

export type SupplyFrequency = 50 | 60;

/**
 * The squaring demodulator's output: mean square of the voltage over consecutive intervals at a uniform rate, held
 * as levels each lasting `samplesPerLevel` samples (sample j is level ⌊j / samplesPerLevel⌋, the last one held to
 * the end), so that half-cycle values need no array of a million samples.
 */
export interface DemodulatedVoltage {
  levels: Float64Array;
  samplesPerLevel: number;
  length: number;
  rateHz: number;
}

/**
 * Where the 600 s observation period lies in the demodulated record: its last 600 s, after the
 * filters have settled on what precedes them, or the record repeated end to end.
 */
export type Observation = "last-600-s" | "repeated";

/** Nominal supply frequency within ±5 %; the Butterworth cut-off depends on it. */
export function nominalSupplyFrequency(frequencyHz: number): SupplyFrequency | null {
  if (Math.abs(frequencyHz - 50) <= 2.5) return 50;
  if (Math.abs(frequencyHz - 60) <= 3) return 60;
  return null;
}

function bandSections(supply: SupplyFrequency, lamp: Lamp, rateHz: number) {
  return [
    firstOrderHighPass(HIGH_PASS_HZ, rateHz),
    ...butterworthLowPass(6, supply === 50 ? 35 : 42, rateHz),
    ...weightingFilter(lamp, rateHz),
  ];
}

/**
 * One scale for both lamps, set on the 230 V lamp chain. With the 120 V filter's lower gain
 * (k = 1.6357, 0.783 at 8.8 Hz) the 120 V lamp then reads Pinst = 1 at about 0.32 %.
 * Pinst = 1 is taken at the peak of the smoothed output, which carries a residual ripple at twice
 * the modulation frequency.
 */
function pinstScale(supply: SupplyFrequency, rateHz: number): number {
  const gain = cascadeMagnitude(bandSections(supply, 230, rateHz), CALIBRATION_FREQUENCY_HZ, rateHz);
  const ripple = cascadeMagnitude(
    [firstOrderLowPass(SMOOTHING_TIME_CONSTANT_SECONDS, rateHz)],
    2 * CALIBRATION_FREQUENCY_HZ,
    rateHz,
  );
  const amplitude = CALIBRATION_DELTA_V_OVER_V * gain;
  return 1 / (((amplitude * amplitude) / 2) * (1 + ripple));
}

/** Squaring demodulator with block averaging down to the internal rate (see the file comment). */
function demodulateVoltage(voltage: Float64Array, sampleRateHz: number): DemodulatedVoltage {
  if (!(sampleRateHz >= MIN_SAMPLE_RATE_HZ)) {
    throw new RangeError(`flickermeter needs at least ${MIN_SAMPLE_RATE_HZ} samples/s, got ${sampleRateHz}`);
  }
  const block = Math.max(1, Math.floor(sampleRateHz / INTERNAL_RATE_HZ));
  const count = Math.floor(voltage.length / block);
  const meanSquare = new Float64Array(count);
  for (let b = 0, n = 0; b < count; b++) {
    let sum = 0;
    for (let end = n + block; n < end; n++) {
      const v = voltage[n]!;
      sum += v * v;
    }
    meanSquare[b] = sum / block;
  }
  return { levels: meanSquare, samplesPerLevel: 1, length: count, rateHz: sampleRateHz / block };
}

/**
 * The demodulator's output rebuilt from half-cycle r.m.s. values, each held for its half-cycle.
 * For changes that fall on zero crossings, as burst-fire switching does, the squared voltage's
 * low-frequency content is exactly this staircase: what it lacks is the 2f carrier, which the
 * Butterworth would have removed.
 */
export function demodulateHalfCycles(rms: Float64Array, halfCycleSeconds: number): DemodulatedVoltage {
  const samplesPerLevel = halfCycleSeconds * INTERNAL_RATE_HZ;
  return { levels: rms.map((u) => u * u), samplesPerLevel, length: Math.round(rms.length * samplesPerLevel), rateHz: INTERNAL_RATE_HZ };
}

/** Instantaneous flicker sensation over the 600 s observation period, one value per demodulated sample. */
export function pinstSeries(
  demodulated: DemodulatedVoltage,
  supply: SupplyFrequency,
  lamp: Lamp,
  observation: Observation,
): Float64Array {
  const { levels, samplesPerLevel, length, rateHz } = demodulated;
  const lastLevel = levels.length - 1;
  const meanSquare = (j: number) => levels[Math.min(lastLevel, Math.floor(j / samplesPerLevel))]!;
  const observed = Math.round(OBSERVATION_SECONDS * rateHz);
  const settling = Math.round(SETTLING_SECONDS * rateHz);
  if (length === 0) throw new RangeError("flickermeter input is empty");
  if (observation === "last-600-s" && length < observed + settling) {
    throw new RangeError(
      `flickermeter needs ${OBSERVATION_SECONDS + SETTLING_SECONDS} s of voltage (600 s observed after ${SETTLING_SECONDS} s settling), got ${(length / rateHz).toFixed(1)} s`,
    );
  }
  const start = observation === "last-600-s" ? length - observed : 0;

  const band = new SectionCascade(bandSections(supply, lamp, rateHz));
  const smoothing = new SectionCascade([firstOrderLowPass(SMOOTHING_TIME_CONSTANT_SECONDS, rateHz)]);
  const scale = pinstScale(supply, rateHz);
  const adapt = -Math.expm1(-1 / (rateHz * ADAPTOR_TIME_CONSTANT_SECONDS));
  // Starting the adaptor at the record's mean square spares the minutes its one-minute time constant would need to settle.
  let total = 0;
  for (let j = 0; j < length; j++) total += meanSquare(j);
  let reference = total / length;
  if (!(reference > 0)) throw new RangeError("flickermeter input has no voltage");

  const pinst = new Float64Array(observed);
  let index = (((start - settling) % length) + length) % length;
  const block = new Float64Array(PINST_BLOCK);
  for (let from = -settling; from < observed; from += PINST_BLOCK) {
    const count = Math.min(PINST_BLOCK, observed - from);
    for (let m = 0; m < count; m++) {
      const x = meanSquare(index);
      index = index + 1 === length ? 0 : index + 1;
      reference += adapt * (x - reference);
      // Subtracting the steady level keeps the high-pass from starting on a unit step.
      block[m] = x / reference - 1;
    }
    band.processBlock(block, count);
    for (let m = 0; m < count; m++) block[m] = block[m]! * block[m]!;
    smoothing.processBlock(block, count);
    // The first `settling` samples only settle the filters.
    for (let m = Math.max(0, -from); m < count; m++) pinst[from + m] = block[m]! * scale;
  }
  return pinst;
}

/** The percentiles block 5 classifies by: levels exceeded for this % of the observation period. */
const PST_PERCENTILES = [0.1, 0.7, 1, 1.5, 2.2, 3, 4, 6, 8, 10, 13, 17, 30, 50, 80];

/** Where a percentile falls among the sorted samples: between ranks `below` and `below + 1`. */
function percentilePosition(percent: number, length: number): number {
  return (1 - percent / 100) * (length - 1);
}

/** Level exceeded for `percent` % of the observation period, interpolated between the samples at its two ranks. */
function exceededFor(ranked: Float64Array, percent: number): number {
  const position = percentilePosition(percent, ranked.length);
  const below = Math.floor(position);
  const lower = ranked[below]!;
  const upper = ranked[Math.min(below + 1, ranked.length - 1)]!;
  return lower + (upper - lower) * (position - below);
}

/**
 * Moves the value of each rank in `ranks` (ascending) to where a full sort would put it, by
 * quickselect recursing only into the parts that hold wanted ranks: the ~30 ranks block 5 needs
 * cost a few passes over the 1.2 M Pinst samples, where sorting them took a third of the flicker
 * estimate. Hoare partitioning keeps runs of equal values (a steady supply's Pinst) from going quadratic.
 */
function selectRanks(values: Float64Array, ranks: readonly number[]): void {
  const pending: [number, number, number, number][] = [[0, values.length - 1, 0, ranks.length - 1]];
  for (let part = pending.pop(); part !== undefined; part = pending.pop()) {
    const [lo, hi, firstRank, lastRank] = part;
    if (hi - lo < 16) {
      for (let i = lo + 1; i <= hi; i++) {
        const x = values[i]!;
        let j = i - 1;
        for (; j >= lo && values[j]! > x; j--) values[j + 1] = values[j]!;
        values[j + 1] = x;
      }
      continue;
    }
    const a = values[lo]!;
    const b = values[(lo + hi) >>> 1]!;
    const c = values[hi]!;
    const pivot = a < b ? (b < c ? b : a < c ? c : a) : a < c ? a : b < c ? c : b;
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (values[i]! < pivot) i++;
      while (values[j]! > pivot) j--;
      if (i <= j) {
        const swap = values[i]!;
        values[i++] = values[j]!;
        values[j--] = swap;
      }
    }
    // Now [lo, j] ≤ pivot ≤ [i, hi], and anything between equals the pivot: already in place.
    let split = firstRank;
    while (split <= lastRank && ranks[split]! <= j) split++;
    if (split > firstRank) pending.push([lo, j, firstRank, split - 1]);
    let upper = split;
    while (upper <= lastRank && ranks[upper]! < i) upper++;
    if (upper <= lastRank) pending.push([i, hi, upper, lastRank]);
  }
}

/**
 * Block 5, with exact percentiles from the ranked Pinst samples instead of a class histogram:
 * Pst = √(0.0314 P0.1 + 0.0525 P1s + 0.0657 P3s + 0.28 P10s + 0.08 P50s), smoothed percentiles
 * P1s = (P0.7 + P1 + P1.5)/3, P3s = (P2.2 + P3 + P4)/3, P10s = (P6 + P8 + P10 + P13 + P17)/5,
 * P50s = (P30 + P50 + P80)/3. The samples are ranked in place, so their order is lost: a copy of
 * 1.2 M samples would be the largest allocation of a flicker estimate.
 */
export function pstFromPinst(pinst: Float64Array): number {
  if (pinst.length === 0) throw new RangeError("no Pinst samples to classify");
  const last = pinst.length - 1;
  const ranks = new Set<number>();
  for (const percent of PST_PERCENTILES) {
    const below = Math.floor(percentilePosition(percent, pinst.length));
    ranks.add(below).add(Math.min(below + 1, last));
  }
  selectRanks(pinst, [...ranks].sort((a, b) => a - b));
  const p = (percent: number) => exceededFor(pinst, percent);
  const mean = (...values: number[]) => values.reduce((a, b) => a + b, 0) / values.length;
  const p1s = mean(p(0.7), p(1), p(1.5));
  const p3s = mean(p(2.2), p(3), p(4));
  const p10s = mean(p(6), p(8), p(10), p(13), p(17));
  const p50s = mean(p(30), p(50), p(80));
  return Math.sqrt(0.0314 * p(0.1) + 0.0525 * p1s + 0.0657 * p3s + 0.28 * p10s + 0.08 * p50s);
}

function requireSupply(frequencyHz: number): SupplyFrequency {
  const supply = nominalSupplyFrequency(frequencyHz);
  if (supply === null) throw new RangeError(`supply frequency ${frequencyHz} Hz is neither 50 Hz nor 60 Hz (±5 %)`);
  return supply;
}

/** Pinst over the last 600 s of a voltage record that runs at least 620 s. */
export function instantaneousFlickerSensation(
  voltage: Float64Array,
  sampleRateHz: number,
  frequencyHz: number,
  lamp: Lamp,
): Float64Array {
  return pinstSeries(demodulateVoltage(voltage, sampleRateHz), requireSupply(frequencyHz), lamp, "last-600-s");
}

/** Short-term flicker severity of the last 600 s of a voltage record; the 20 s before them settle the filters. */
export function flickermeterPst(voltage: Float64Array, sampleRateHz: number, frequencyHz: number, lamp: Lamp): number {
  return pstFromPinst(instantaneousFlickerSensation(voltage, sampleRateHz, frequencyHz, lamp));
}

/** Long-term flicker severity from twelve consecutive 10-minute Pst values: Plt = (Σ Pst³ / 12)^(1/3). */
export function plt(pstValues: readonly number[]): number {
  if (pstValues.length !== 12 || pstValues.some((v) => !(v >= 0) || !Number.isFinite(v))) {
    throw new RangeError(`Plt takes twelve finite, non-negative Pst values, got ${pstValues.length}`);
  }
  return Math.cbrt(pstValues.reduce((sum, v) => sum + v ** 3, 0) / 12);
}

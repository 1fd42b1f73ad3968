// Series small enough to chart, derived from a capture's samples once, when it
// is analysed, so pages never re-read a capture of millions of samples. The
// half-cycles come from the same boundaries and conduction rule as the
// analysis, so a conduction map drawn from them matches its figures.

import { halfCycleBoundaries, measureMainsFrequency } from "./electrical";
import { classifyConduction, halfCycleRms, tabulateHalfCycles } from "./half-cycles";

export const DISPLAY_POINTS = 2000;
/** One minute of 60 Hz mains: longer captures show their first minute of half-cycles. */
export const DISPLAY_HALF_CYCLES = 7200;

export interface WaveformEnvelope {
  timeS: number[];
  current: number[];
  voltage: number[] | null;
}

/**
 * Min/max envelope: each of points/2 buckets gives its two extremes in the order
 * they occur, so peaks survive downsampling and a sine still looks like one
 * when the capture is short. Captures with fewer samples than points pass whole.
 */
export function waveformEnvelope(input: {
  current: Float64Array;
  voltage: Float64Array | null;
  sampleRateHz: number;
  points?: number;
}): WaveformEnvelope {
  const { current, voltage, sampleRateHz } = input;
  const points = input.points ?? DISPLAY_POINTS;
  const length = current.length;
  if (length <= points) {
    return {
      timeS: Array.from({ length }, (_, k) => k / sampleRateHz),
      current: Array.from(current),
      voltage: voltage === null ? null : Array.from(voltage),
    };
  }
  const buckets = Math.floor(points / 2);
  const timeS: number[] = [];
  const currentOut: number[] = [];
  const voltageOut: number[] | null = voltage === null ? null : [];
  for (let b = 0; b < buckets; b++) {
    const start = Math.floor((b * length) / buckets);
    const end = Math.floor(((b + 1) * length) / buckets);
    timeS.push(start / sampleRateHz, Math.floor((start + end) / 2) / sampleRateHz);
    currentOut.push(...extremesInOrder(current, start, end));
    if (voltage !== null && voltageOut !== null) voltageOut.push(...extremesInOrder(voltage, start, end));
  }
  return { timeS, current: currentOut, voltage: voltageOut };
}

function extremesInOrder(signal: Float64Array, start: number, end: number): [number, number] {
  let min = start;
  let max = start;
  for (let k = start + 1; k < end; k++) {
    if ((signal[k] as number) < (signal[min] as number)) min = k;
    if ((signal[k] as number) > (signal[max] as number)) max = k;
  }
  const low = signal[min] as number;
  const high = signal[max] as number;
  return min <= max ? [low, high] : [high, low];
}

export interface HalfCycleSeries {
  halfCycleSeconds: number;
  rmsCurrent: number[];
  conducting: boolean[];
}

/** RMS current and conduction of each half-cycle, as the analysis finds them, up to maxHalfCycles. */
export function halfCycleSeries(input: {
  current: Float64Array;
  voltage: Float64Array | null;
  sampleRateHz: number;
  nominalHz: number;
  maxHalfCycles?: number;
}): HalfCycleSeries {
  const { current, voltage, sampleRateHz, nominalHz } = input;
  const mains = measureMainsFrequency({ current, voltage, sampleRateHz, nominalHz });
  const boundaries = halfCycleBoundaries(mains.crossings, sampleRateHz, mains.frequencyHz, current.length);
  const table = tabulateHalfCycles(current, voltage, boundaries);
  const { conductingMask } = classifyConduction(table, sampleRateHz);
  const shown = Math.min(table.count, input.maxHalfCycles ?? DISPLAY_HALF_CYCLES);
  return {
    halfCycleSeconds: 1 / (2 * mains.frequencyHz),
    rmsCurrent: Array.from({ length: shown }, (_, j) => halfCycleRms(table, j)),
    conducting: Array.from(conductingMask.subarray(0, shown), (on) => on === 1),
  };
}

/** Every k-th point of a slow log, so a chart gets at most `points` of them, the last always kept. */
export function thinSeries(values: ArrayLike<number>, points = DISPLAY_POINTS): number[] {
  const length = values.length;
  if (length <= points) return Array.from(values);
  const stride = Math.ceil(length / points);
  const thinned: number[] = [];
  for (let k = 0; k < length; k += stride) thinned.push(values[k] as number);
  if ((length - 1) % stride !== 0) thinned.push(values[length - 1] as number);
  return thinned;
}

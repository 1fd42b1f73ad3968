// Mains frequency, half-cycle boundaries and whole-record figures (true RMS,
// peak, crest factor, DC, real and apparent power, power factor) from sampled
// current and, when captured, voltage. Definitions as REFERENCES.md §7: RMS
// over whole cycles, P = mean of v·i, S = Vrms·Irms, PF = P/S.

/** Measured frequencies outside this band are taken as a failed measurement, and the nominal is used. */
const PLAUSIBLE_MAINS_HZ = { min: 40, max: 70 };

/** Hysteresis around zero as a share of the signal's robust peak, so noise near zero makes no crossings. */
const CROSSING_HYSTERESIS = 0.1;

/** Crossings needed before a frequency is trusted. */
const MIN_RISING_CROSSINGS = 3;

/** Samples looked at for a robust peak: a percentile needs far fewer than a long capture holds. */
const ROBUST_PEAK_SAMPLES = 1_000_000;

/**
 * The 99.9th percentile of |x| over an evenly strided subset of samples: a
 * peak that one spike cannot drag up (it sets thresholds; the reported peak is
 * the true maximum).
 */
export function robustPeak(signal: Float64Array): number {
  const stride = Math.max(1, Math.floor(signal.length / ROBUST_PEAK_SAMPLES));
  let max = 0;
  let looked = 0;
  for (let k = 0; k < signal.length; k += stride, looked++) max = Math.max(max, Math.abs(signal[k] as number));
  if (max === 0) return 0;
  const bins = 1024;
  const counts = new Uint32Array(bins + 1);
  const perUnit = bins / max;
  for (let k = 0; k < signal.length; k += stride) {
    const bin = Math.floor(Math.abs(signal[k] as number) * perUnit);
    counts[bin] = (counts[bin] as number) + 1;
  }
  let remaining = Math.ceil(looked * 0.001);
  for (let bin = bins; bin >= 0; bin--) {
    remaining -= counts[bin] as number;
    if (remaining <= 0) return ((bin + 1) / bins) * max;
  }
  return max;
}

export interface ZeroCrossings {
  /** Fractional sample positions, interpolated linearly between the samples either side of zero. */
  positions: number[];
  /** +1 for a rising crossing, −1 for a falling one, per position. */
  directions: number[];
}

/**
 * Crossings of zero with hysteresis: the signal must leave a ±threshold band on
 * the other side before a crossing counts, and the crossing is placed at the
 * last sign change before it left. A signal resting at zero (a blocked
 * half-cycle) makes none; but after resting in the band for `restSamples` it
 * makes one on leaving, whichever side it left last, so a current fed through
 * a diode (pulses of one polarity) still marks each cycle.
 *
 * `after` and `end` scan part of the signal: the crossings among samples
 * (after, end), after being a sample outside the band (see firstOutside) or
 * −1 for the start. A sample outside the band fixes everything the scan
 * carries, so the parts' crossings, end to end, are those of the whole.
 */
export function findZeroCrossings(signal: Float64Array, threshold: number, restSamples = Infinity, after = -1, end = signal.length): ZeroCrossings {
  const positions: number[] = [];
  const directions: number[] = [];
  if (!(threshold > 0)) return { positions, directions };
  const resumed = after >= 0;
  let previous = signal[resumed ? after : 0] ?? 0;
  let state = resumed ? Math.sign(previous) : 0;
  let lastSignChange = -1;
  let lastOutside = after;
  for (let k = resumed ? after + 1 : 1; k < end; k++) {
    const value = signal[k] as number;
    // Beyond the band on the side already entered, as the sample before was: no sign change and no
    // crossing, so most samples of a sine skip the bookkeeping below.
    if (value * state > threshold && previous * state > threshold) {
      lastOutside = k;
      previous = value;
      continue;
    }
    if (previous <= 0 !== value <= 0) lastSignChange = k;
    if (value > threshold || value < -threshold) {
      const direction = value > 0 ? 1 : -1;
      const rested = k - lastOutside - 1 >= restSamples;
      if ((state === -direction || rested) && lastSignChange > lastOutside) {
        positions.push(interpolateZero(signal, lastSignChange));
        directions.push(direction);
      }
      state = direction;
      lastOutside = k;
    }
    previous = value;
  }
  return { positions, directions };
}

/** The first sample from `from` on outside the ±threshold band, where a scan for crossings can start afresh; null if none. */
export function firstOutside(signal: Float64Array, threshold: number, from: number): number | null {
  for (let k = from; k < signal.length; k++) if (Math.abs(signal[k] as number) > threshold) return k;
  return null;
}

/** Scans findZeroCrossings's part after `after` to the end, perhaps on another thread; the function returned waits for the crossings. */
export type CrossingScan = (signal: Float64Array, threshold: number, restSamples: number, after: number) => () => ZeroCrossings;

/** findZeroCrossings over the whole signal, its second half scanned by `scanAfter` meanwhile if given: the same crossings. */
function zeroCrossingsInTwo(signal: Float64Array, threshold: number, restSamples: number, scanAfter?: CrossingScan): ZeroCrossings {
  const split = scanAfter !== undefined && threshold > 0 ? firstOutside(signal, threshold, signal.length >> 1) : null;
  if (scanAfter === undefined || split === null) return findZeroCrossings(signal, threshold, restSamples);
  const later = scanAfter(signal, threshold, restSamples, split);
  const earlier = findZeroCrossings(signal, threshold, restSamples, -1, split + 1);
  const { positions, directions } = later();
  return { positions: earlier.positions.concat(positions), directions: earlier.directions.concat(directions) };
}

function interpolateZero(signal: Float64Array, after: number): number {
  const a = signal[after - 1] as number;
  const b = signal[after] as number;
  return a === b ? after : after - 1 + a / (a - b);
}

export interface MainsFrequency {
  frequencyHz: number;
  source: "voltage" | "current" | "nominal";
  /** Crossings of the signal the frequency came from (empty for the nominal), to place half-cycle boundaries. */
  crossings: ZeroCrossings;
}

/**
 * Cycles are counted between successive rising crossings by rounding each
 * interval to whole periods, so the off gaps of a burst-fired current (no
 * crossings for many cycles) still count; the period is the slope of crossing
 * position against cycle number.
 */
export function frequencyFromCrossings(crossings: ZeroCrossings, sampleRateHz: number): number | null {
  const rising = crossings.positions.filter((_, k) => crossings.directions[k] === 1);
  if (rising.length < MIN_RISING_CROSSINGS) return null;
  const intervals: number[] = [];
  for (let k = 1; k < rising.length; k++) intervals.push((rising[k] as number) - (rising[k - 1] as number));
  const shortest = sampleRateHz / PLAUSIBLE_MAINS_HZ.max;
  const longest = sampleRateHz / PLAUSIBLE_MAINS_HZ.min;
  const oneCycle = intervals.filter((interval) => interval >= shortest && interval <= longest).sort((a, b) => a - b);
  if (oneCycle.length < MIN_RISING_CROSSINGS - 1) return null;
  const typical = oneCycle[Math.floor(oneCycle.length / 2)] as number;
  // Least-squares line through (cycle number, crossing position): every crossing's jitter averages out.
  const cycleNumbers = [0];
  for (const interval of intervals) cycleNumbers.push((cycleNumbers[cycleNumbers.length - 1] as number) + Math.round(interval / typical));
  // A crossing that ends a gap is where a switched current steps up from zero, not where a sine passes through it: left out.
  const fitted = rising.map((_, k) => k > 0 && (cycleNumbers[k] as number) - (cycleNumbers[k - 1] as number) === 1);
  let count = 0;
  let sumCycles = 0;
  let sumPositions = 0;
  for (let k = 0; k < rising.length; k++) {
    if (!fitted[k]) continue;
    count++;
    sumCycles += cycleNumbers[k] as number;
    sumPositions += rising[k] as number;
  }
  if (count < MIN_RISING_CROSSINGS - 1) return null;
  const meanCycle = sumCycles / count;
  const meanPosition = sumPositions / count;
  let covariance = 0;
  let variance = 0;
  for (let k = 0; k < rising.length; k++) {
    if (!fitted[k]) continue;
    const dn = (cycleNumbers[k] as number) - meanCycle;
    covariance += dn * ((rising[k] as number) - meanPosition);
    variance += dn * dn;
  }
  if (variance === 0 || covariance <= 0) return null;
  const frequencyHz = sampleRateHz / (covariance / variance);
  return frequencyHz >= PLAUSIBLE_MAINS_HZ.min && frequencyHz <= PLAUSIBLE_MAINS_HZ.max ? frequencyHz : null;
}

/** From the voltage's zero crossings, else the current's while it conducts, else the nominal. */
export function measureMainsFrequency(input: {
  current: Float64Array;
  voltage: Float64Array | null;
  sampleRateHz: number;
  nominalHz: number;
  /** Another thread's scan, to share the search for crossings with. */
  scanAfter?: CrossingScan;
}): MainsFrequency {
  const { sampleRateHz } = input;
  const candidates: { signal: Float64Array | null; source: "voltage" | "current" }[] = [
    { signal: input.voltage, source: "voltage" },
    { signal: input.current, source: "current" },
  ];
  for (const { signal, source } of candidates) {
    if (signal === null) continue;
    // A quarter of a half-cycle at rest marks a blocked stretch rather than a passage through zero.
    const restSamples = sampleRateHz / (8 * input.nominalHz);
    const crossings = zeroCrossingsInTwo(signal, CROSSING_HYSTERESIS * robustPeak(signal), restSamples, input.scanAfter);
    const frequencyHz = frequencyFromCrossings(crossings, sampleRateHz);
    if (frequencyHz !== null) return { frequencyHz, source, crossings };
  }
  return { frequencyHz: input.nominalHz, source: "nominal", crossings: { positions: [], directions: [] } };
}

/**
 * Half-cycle boundaries (fractional sample positions) covering the record:
 * each boundary snaps to a zero crossing found within a quarter of a half-cycle
 * of where the measured frequency puts it, and is placed by the frequency where
 * there is none (a blocked stretch of current). The boundaries follow the
 * supply's slow frequency drift through the crossings, which a single phase
 * from the start would not. Partial half-cycles at either end are left out,
 * and a last half-cycle that would leave a cycle unfinished.
 */
export function halfCycleBoundaries(crossings: ZeroCrossings, sampleRateHz: number, frequencyHz: number, sampleCount: number): Float64Array {
  const halfPeriod = sampleRateHz / (2 * frequencyHz);
  const positions = crossings.positions;
  const anchor = positions[0] ?? 0;
  let boundary = anchor - Math.floor(anchor / halfPeriod) * halfPeriod;
  const boundaries: number[] = [boundary];
  const tolerance = halfPeriod / 4;
  let next = 0;
  for (;;) {
    const expected = boundary + halfPeriod;
    if (expected > sampleCount - 0.5) break;
    while (next < positions.length && (positions[next] as number) < expected - tolerance) next++;
    const crossing = positions[next];
    boundary = crossing !== undefined && crossing <= expected + tolerance ? crossing : expected;
    if (boundary > sampleCount - 0.5) break;
    boundaries.push(boundary);
  }
  // Whole cycles only, so a record's DC and RMS never carry an odd half-cycle.
  if (boundaries.length % 2 === 0) boundaries.pop();
  return Float64Array.from(boundaries);
}

/**
 * Samples inside the span [start, end) of fractional sample positions, each
 * sample standing for the interval half a sample either side of it: samples
 * first … last lie wholly inside, and the two cut by the span's ends count with
 * the share of their interval inside it (leadWeight for sample first − 1,
 * trailWeight for last + 1). Sums weighted this way integrate over exactly the span,
 * whole cycles included, however many samples a cycle holds.
 */
export interface SampleCells {
  first: number;
  last: number;
  leadWeight: number;
  trailWeight: number;
}

export function sampleCells(start: number, end: number): SampleCells {
  const first = Math.ceil(start + 0.5);
  const last = Math.floor(end - 0.5);
  return { first, last, leadWeight: first - 0.5 - start, trailWeight: end - (last + 0.5) };
}

export function peakMagnitude(signal: Float64Array): number {
  let max = 0;
  for (let k = 0; k < signal.length; k++) {
    const magnitude = Math.abs(signal[k] as number);
    if (magnitude > max) max = magnitude;
  }
  return max;
}

/** Sums over a span of samples; whole-record figures are these summed over whole cycles. */
export interface SampleSums {
  count: number;
  current: number;
  currentSquared: number;
  voltage: number;
  voltageSquared: number;
  product: number;
}

export interface CurrentFigures {
  rms: number;
  peak: number;
  crestFactor: number | null;
  dc: number;
}

export interface VoltageFigures {
  rms: number;
  peak: number;
}

export interface PowerFigures {
  real: number;
  apparent: number;
  factor: number | null;
}

export function currentFigures(sums: SampleSums, peak: number): CurrentFigures {
  const rms = Math.sqrt(sums.currentSquared / sums.count);
  return { rms, peak, crestFactor: rms > 0 ? peak / rms : null, dc: sums.current / sums.count };
}

export function voltageFigures(sums: SampleSums, peak: number): VoltageFigures {
  return { rms: Math.sqrt(sums.voltageSquared / sums.count), peak };
}

export function powerFigures(sums: SampleSums): PowerFigures {
  const real = sums.product / sums.count;
  const apparent = Math.sqrt(sums.voltageSquared / sums.count) * Math.sqrt(sums.currentSquared / sums.count);
  return { real, apparent, factor: apparent > 0 ? real / apparent : null };
}

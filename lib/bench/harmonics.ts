// Harmonic currents 2–40 from rectangular windows of exactly 10 cycles (50 Hz)
// or 12 cycles (60 Hz) of the measured frequency, after IEC 61000-4-7 (from
// memory), compared with the IEC 61000-3-2 limits (REFERENCES.md §4).
//
// Harmonic components are reported, not groups: one DFT value at each exact
// harmonic frequency. A window of exactly N cycles rarely holds a whole number
// of samples, so each window's DFT is evaluated straight at h·f over the
// window's true length, the two samples cut by its edges weighted by the share
// of their sample interval inside it; no resampling, and no leakage from the
// fundamental into the harmonic bins.

import { sampleCells } from "./electrical";

export const MAX_HARMONIC_ORDER = 40;

/** Orders run through Goertzel's recurrence together: eight independent chains keep the CPU's pipelines full. */
const LANES = 8;

export type HarmonicClass = "A" | "B";

/** IEC 61000-3-2 Class A, amperes (seen: GOST R 51317.3.2, adoption of IEC 61000-3-2; REFERENCES.md §4). */
export function classALimitAmps(order: number): number {
  if (!Number.isInteger(order) || order < 2 || order > MAX_HARMONIC_ORDER) {
    throw new Error(`IEC 61000-3-2 sets limits for harmonic orders 2 to 40, not ${order}`);
  }
  const odd: Record<number, number> = { 3: 2.3, 5: 1.14, 7: 0.77, 9: 0.4, 11: 0.33, 13: 0.21 };
  const even: Record<number, number> = { 2: 1.08, 4: 0.43, 6: 0.3 };
  if (order % 2 === 1) return odd[order] ?? (0.15 * 15) / order;
  return even[order] ?? (0.23 * 8) / order;
}

/** Class B (portable tools) is Class A × 1.5 (REFERENCES.md §4). */
export function harmonicLimitAmps(order: number, harmonicClass: HarmonicClass): number {
  return classALimitAmps(order) * (harmonicClass === "B" ? 1.5 : 1);
}

/** 10 cycles on 50 Hz systems, 12 on 60 Hz systems: about 200 ms either way. */
export function harmonicWindowCycles(frequencyHz: number): 10 | 12 {
  return frequencyHz >= 55 ? 12 : 10;
}

export interface HarmonicSpectrum {
  windowCycles: number;
  windows: number;
  /** Mean over the windows of each order's RMS current, index = order (0 unused), 1 … 40. */
  amps: Float64Array;
  /** Largest single-window RMS current per order. */
  maxAmps: Float64Array;
}

/**
 * RMS harmonic currents per window of `windowCycles` cycles, windows laid end
 * to end from `startSample` (a zero crossing, so each starts at the same
 * phase), averaged over the windows.
 */
export interface HarmonicsInput {
  current: Float64Array;
  sampleRateHz: number;
  frequencyHz: number;
  startSample: number;
  maxOrder?: number;
}

/**
 * The windows of a record, measured by whichever threads take them: each thread takes the next few by an atomic add
 * on `next`, and writes each window's RMS current per order into its row of `amps` (maxOrder + 1 values a window).
 * The windows are then added up in their order, so the spectrum is the same however they were shared out.
 */
export interface HarmonicWindows {
  count: number;
  next: Int32Array;
  amps: Float64Array;
}

/** Windows taken at a time: enough that the atomic add is lost in them, few enough that the threads finish together. */
const WINDOWS_PER_TAKE = 4;

function windowGeometry(input: HarmonicsInput) {
  const { current, sampleRateHz, frequencyHz, startSample } = input;
  const maxOrder = input.maxOrder ?? MAX_HARMONIC_ORDER;
  const windowCycles = harmonicWindowCycles(frequencyHz);
  const length = (windowCycles * sampleRateHz) / frequencyHz;
  let count = 0;
  // The last sample cut by a window's end must exist: the window ends half a sample before the record does.
  while (startSample + count * length + length <= current.length - 0.5) count++;
  return { maxOrder, windowCycles, length, count };
}

/** Windows for measureHarmonicWindows, on shared memory when other threads are to take some. */
export function harmonicWindows(input: HarmonicsInput, shared: boolean): HarmonicWindows {
  const { maxOrder, count } = windowGeometry(input);
  const memory = (bytes: number) => (shared ? new SharedArrayBuffer(bytes) : new ArrayBuffer(bytes));
  return {
    count,
    next: new Int32Array(memory(Int32Array.BYTES_PER_ELEMENT)),
    amps: new Float64Array(memory(count * (maxOrder + 1) * Float64Array.BYTES_PER_ELEMENT)),
  };
}

/** Measures windows, a few at a time, until none is left to take. */
export function measureHarmonicWindows(input: HarmonicsInput, windows: HarmonicWindows): void {
  const { current, sampleRateHz, frequencyHz, startSample } = input;
  const { maxOrder, length, count } = windowGeometry(input);
  const state = new Float64Array(2 * LANES);
  const cosines = new Float64Array(maxOrder + 1);
  const sines = new Float64Array(maxOrder + 1);
  for (let order = 1; order <= maxOrder; order++) {
    const omega = (2 * Math.PI * order * frequencyHz) / sampleRateHz;
    cosines[order] = Math.cos(omega);
    sines[order] = Math.sin(omega);
  }
  for (let first = Atomics.add(windows.next, 0, WINDOWS_PER_TAKE); first < count; first = Atomics.add(windows.next, 0, WINDOWS_PER_TAKE)) {
    for (let window = first; window < Math.min(count, first + WINDOWS_PER_TAKE); window++) {
      const out = windows.amps.subarray(window * (maxOrder + 1), (window + 1) * (maxOrder + 1));
      windowSpectrum(current, startSample + window * length, length, maxOrder, cosines, sines, state, out);
    }
  }
}

/** The spectrum of measured windows: each order's mean and largest over the windows, added up in window order. */
export function harmonicSpectrum(input: HarmonicsInput, windows: HarmonicWindows): HarmonicSpectrum {
  const { maxOrder, windowCycles, count } = windowGeometry(input);
  const sum = new Float64Array(maxOrder + 1);
  const maxAmps = new Float64Array(maxOrder + 1);
  for (let window = 0; window < count; window++) {
    for (let order = 1; order <= maxOrder; order++) {
      const amps = windows.amps[window * (maxOrder + 1) + order] as number;
      sum[order] = (sum[order] as number) + amps;
      if (amps > (maxAmps[order] as number)) maxAmps[order] = amps;
    }
  }
  const amps = new Float64Array(maxOrder + 1);
  if (count > 0) for (let order = 1; order <= maxOrder; order++) amps[order] = (sum[order] as number) / count;
  return { windowCycles, windows: count, amps, maxAmps };
}

export function measureHarmonics(input: HarmonicsInput): HarmonicSpectrum {
  const windows = harmonicWindows(input, false);
  measureHarmonicWindows(input, windows);
  return harmonicSpectrum(input, windows);
}

/**
 * RMS value of each harmonic over the window [start, start + length) in sample
 * units (see sampleCells). Whole samples go through Goertzel's recurrence; the
 * two cut samples are added with their weights at their own phases.
 */
function windowSpectrum(
  signal: Float64Array,
  start: number,
  length: number,
  maxOrder: number,
  cosines: Float64Array,
  sines: Float64Array,
  state: Float64Array,
  out: Float64Array,
): void {
  const { first, last, leadWeight, trailWeight } = sampleCells(start, start + length);
  const lead = first - 1 >= 0 ? (signal[first - 1] as number) * leadWeight : 0;
  const trail = last + 1 < signal.length ? (signal[last + 1] as number) * trailWeight : 0;
  const n = last - first + 1;
  for (let order = 1; order <= maxOrder; order += LANES) {
    goertzelLanes(signal, first, last + 1, order, maxOrder, cosines, state);
    for (let lane = 0; lane < LANES && order + lane <= maxOrder; lane++) {
      const h = order + lane;
      const c = cosines[h] as number;
      const s = sines[h] as number;
      const omega = Math.atan2(s, c);
      const s1 = state[2 * lane] as number;
      const s2 = state[2 * lane + 1] as number;
      // Σ_m x[first+m]·e^{-jωm} = e^{-jω(n−1)}·(s1 − e^{-jω}·s2), m counted from `first`.
      const yRe = s1 - c * s2;
      const yIm = s * s2;
      const back = -(n - 1) * omega;
      let re = yRe * Math.cos(back) - yIm * Math.sin(back);
      let im = yRe * Math.sin(back) + yIm * Math.cos(back);
      // The cut samples sit at m = −1 and m = n.
      re += lead * c + trail * Math.cos(n * omega);
      im += lead * s - trail * Math.sin(n * omega);
      out[h] = (Math.SQRT2 * Math.hypot(re, im)) / length;
    }
  }
}

/** Goertzel's recurrence for orders order … order + 7 over signal[from, to); leaves s1, s2 of each lane in state. */
function goertzelLanes(
  signal: Float64Array,
  from: number,
  to: number,
  order: number,
  maxOrder: number,
  cosines: Float64Array,
  state: Float64Array,
): void {
  const coefficient = (lane: number) => (order + lane <= maxOrder ? 2 * (cosines[order + lane] as number) : 0);
  const c0 = coefficient(0);
  const c1 = coefficient(1);
  const c2 = coefficient(2);
  const c3 = coefficient(3);
  const c4 = coefficient(4);
  const c5 = coefficient(5);
  const c6 = coefficient(6);
  const c7 = coefficient(7);
  let a1 = 0;
  let a2 = 0;
  let b1 = 0;
  let b2 = 0;
  let d1 = 0;
  let d2 = 0;
  let e1 = 0;
  let e2 = 0;
  let f1 = 0;
  let f2 = 0;
  let g1 = 0;
  let g2 = 0;
  let h1 = 0;
  let h2 = 0;
  let i1 = 0;
  let i2 = 0;
  // Two samples a turn, each lane's newer value written over its older one: stepping one sample at a
  // time copied s1 into s2 in every lane, and those copies cost a quarter of the loop.
  let k = from;
  for (; k + 1 < to; k += 2) {
    const x = signal[k] as number;
    a2 = x + c0 * a1 - a2;
    b2 = x + c1 * b1 - b2;
    d2 = x + c2 * d1 - d2;
    e2 = x + c3 * e1 - e2;
    f2 = x + c4 * f1 - f2;
    g2 = x + c5 * g1 - g2;
    h2 = x + c6 * h1 - h2;
    i2 = x + c7 * i1 - i2;
    const y = signal[k + 1] as number;
    a1 = y + c0 * a2 - a1;
    b1 = y + c1 * b2 - b1;
    d1 = y + c2 * d2 - d1;
    e1 = y + c3 * e2 - e1;
    f1 = y + c4 * f2 - f1;
    g1 = y + c5 * g2 - g1;
    h1 = y + c6 * h2 - h1;
    i1 = y + c7 * i2 - i1;
  }
  const odd = k < to;
  if (odd) {
    const x = signal[k] as number;
    a2 = x + c0 * a1 - a2;
    b2 = x + c1 * b1 - b2;
    d2 = x + c2 * d1 - d2;
    e2 = x + c3 * e1 - e2;
    f2 = x + c4 * f1 - f2;
    g2 = x + c5 * g1 - g2;
    h2 = x + c6 * h1 - h2;
    i2 = x + c7 * i1 - i2;
  }
  // After an odd sample count the newest values sit in the *2 variables.
  state.set(
    odd
      ? [a2, a1, b2, b1, d2, d1, e2, e1, f2, f1, g2, g1, h2, h1, i2, i1]
      : [a1, a2, b1, b2, d1, d2, e1, e2, f1, f2, g1, g2, h1, h2, i1, i2],
  );
}

export interface HarmonicOrder {
  order: number;
  amps: number;
  maxAmps: number;
  limitAmps: number | null;
  withinLimit: boolean | null;
}

export interface HarmonicsReport {
  indicative: true;
  method: string;
  windowCycles: number;
  windows: number;
  class: HarmonicClass;
  applicable: boolean;
  notApplicableReason: string | null;
  status: "within limits" | "above limits" | "not applicable";
  fundamentalAmps: number;
  thdPercent: number | null;
  orders: HarmonicOrder[];
}

/** IEC 61000-3-2 covers equipment up to 16 A per phase; above it IEC 61000-3-12 applies (from memory). */
const MAX_CURRENT_IN_SCOPE_A = 16;

/**
 * Limits and THD = √Σ_{n=2..40}(I_n/I_1)² (REFERENCES.md §4). The standard sets
 * no limits at a rated power of 75 W or less, nor on supplies outside
 * 220–240 V; there the figures are shown without limits.
 */
export function assessHarmonics(input: {
  spectrum: HarmonicSpectrum;
  harmonicClass: HarmonicClass;
  nominalVoltage: number;
  /** The rated power, or the measured power while conducting when no rating is given. */
  powerW: number | null;
  powerIsRated: boolean;
  currentRmsWhileConducting: number | null;
}): HarmonicsReport {
  const { spectrum, harmonicClass, nominalVoltage, powerW, powerIsRated, currentRmsWhileConducting } = input;
  let notApplicableReason: string | null = null;
  if (nominalVoltage < 220 || nominalVoltage > 240) {
    notApplicableReason = `IEC 61000-3-2 sets limits for 220–240 V supplies; this one is ${nominalVoltage} V`;
  } else if (powerW !== null && powerW <= 75) {
    notApplicableReason = `no limits at a ${powerIsRated ? "rated" : "measured"} power of 75 W or less (${powerW.toFixed(1)} W)`;
  } else if (currentRmsWhileConducting !== null && currentRmsWhileConducting > MAX_CURRENT_IN_SCOPE_A) {
    notApplicableReason = `above 16 A per phase (${currentRmsWhileConducting.toFixed(2)} A): IEC 61000-3-12, not 61000-3-2, applies`;
  }
  const applicable = notApplicableReason === null;
  const orders: HarmonicOrder[] = [];
  let sumSquares = 0;
  const fundamental = spectrum.amps[1] ?? 0;
  for (let order = 2; order < spectrum.amps.length; order++) {
    const amps = spectrum.amps[order] as number;
    sumSquares += amps * amps;
    const limitAmps = applicable ? harmonicLimitAmps(order, harmonicClass) : null;
    orders.push({
      order,
      amps,
      maxAmps: spectrum.maxAmps[order] as number,
      limitAmps,
      withinLimit: limitAmps === null ? null : amps <= limitAmps,
    });
  }
  const status = !applicable ? "not applicable" : orders.every((o) => o.withinLimit) ? "within limits" : "above limits";
  return {
    indicative: true,
    method:
      `harmonic components (not groups) by DFT at exact multiples of the measured frequency over rectangular windows of ` +
      `${spectrum.windowCycles} cycles laid end to end; each order's RMS current averaged over ${spectrum.windows} windows; ` +
      `indicative only: a capture of seconds is not a compliance measurement`,
    windowCycles: spectrum.windowCycles,
    windows: spectrum.windows,
    class: harmonicClass,
    applicable,
    notApplicableReason,
    status,
    fundamentalAmps: fundamental,
    thdPercent: fundamental > 0 ? (100 * Math.sqrt(sumSquares)) / fundamental : null,
    orders,
  };
}

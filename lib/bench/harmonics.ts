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

export const MAX_HARMONIC_ORDER = 40;

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
export function measureHarmonics(input: {
  current: Float64Array;
  sampleRateHz: number;
  frequencyHz: number;
  startSample: number;
  maxOrder?: number;
}): HarmonicSpectrum {
  const { current, sampleRateHz, frequencyHz, startSample } = input;
  const maxOrder = input.maxOrder ?? MAX_HARMONIC_ORDER;
  const windowCycles = harmonicWindowCycles(frequencyHz);
  const length = (windowCycles * sampleRateHz) / frequencyHz;
  const sum = new Float64Array(maxOrder + 1);
  const maxAmps = new Float64Array(maxOrder + 1);
  const windowAmps = new Float64Array(maxOrder + 1);
  const state = new Float64Array(8);
  const cosines = new Float64Array(maxOrder + 1);
  const sines = new Float64Array(maxOrder + 1);
  for (let order = 1; order <= maxOrder; order++) {
    const omega = (2 * Math.PI * order * frequencyHz) / sampleRateHz;
    cosines[order] = Math.cos(omega);
    sines[order] = Math.sin(omega);
  }
  let windows = 0;
  // The last sample cut by a window's end must exist: the window ends half a sample before the record does.
  for (let start = startSample; start + length <= current.length - 0.5; start = startSample + windows * length) {
    windowSpectrum(current, start, length, maxOrder, cosines, sines, state, windowAmps);
    for (let order = 1; order <= maxOrder; order++) {
      const amps = windowAmps[order] as number;
      sum[order] = (sum[order] as number) + amps;
      if (amps > (maxAmps[order] as number)) maxAmps[order] = amps;
    }
    windows++;
  }
  const amps = new Float64Array(maxOrder + 1);
  if (windows > 0) for (let order = 1; order <= maxOrder; order++) amps[order] = (sum[order] as number) / windows;
  return { windowCycles, windows, amps, maxAmps };
}

/**
 * RMS value of each harmonic over the window [start, start + length) in sample
 * units, each sample standing for the interval half a sample either side of
 * it. Whole samples go through Goertzel's recurrence, four orders at a time;
 * the two cut samples are added with their weights at their own phases.
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
  const first = Math.ceil(start + 0.5);
  const last = Math.floor(start + length - 0.5);
  const leadWeight = first - 0.5 - start;
  const trailWeight = start + length - (last + 0.5);
  const lead = first - 1 >= 0 ? (signal[first - 1] as number) * leadWeight : 0;
  const trail = last + 1 < signal.length ? (signal[last + 1] as number) * trailWeight : 0;
  const n = last - first + 1;
  for (let order = 1; order <= maxOrder; order += 4) {
    goertzelFour(signal, first, last + 1, order, maxOrder, cosines, state);
    for (let lane = 0; lane < 4 && order + lane <= maxOrder; lane++) {
      const h = order + lane;
      const c = cosines[h] as number;
      const s = sines[h] as number;
      const s1 = state[2 * lane] as number;
      const s2 = state[2 * lane + 1] as number;
      // Σ_m x[first+m]·e^{-jωm} = e^{-jω(n−1)}·(s1 − e^{-jω}·s2); rotate back to phase 0 at `first`.
      const yRe = s1 - c * s2;
      const yIm = s * s2;
      const back = -(n - 1) * Math.atan2(s, c);
      const cb = Math.cos(back);
      const sb = Math.sin(back);
      let re = yRe * cb - yIm * sb;
      let im = yRe * sb + yIm * cb;
      // Lead sample sits at m = −1, the trailing one at m = n.
      re += lead * c;
      im += lead * s;
      const angle = -n * Math.atan2(s, c);
      re += trail * Math.cos(angle);
      im += trail * Math.sin(angle);
      out[h] = (Math.SQRT2 * Math.hypot(re, im)) / length;
    }
  }
}

/** Goertzel's recurrence for orders order … order + 3 over signal[from, to); leaves s1, s2 of each in state. */
function goertzelFour(
  signal: Float64Array,
  from: number,
  to: number,
  order: number,
  maxOrder: number,
  cosines: Float64Array,
  state: Float64Array,
): void {
  const c0 = 2 * (cosines[order] as number);
  const c1 = order + 1 <= maxOrder ? 2 * (cosines[order + 1] as number) : 0;
  const c2 = order + 2 <= maxOrder ? 2 * (cosines[order + 2] as number) : 0;
  const c3 = order + 3 <= maxOrder ? 2 * (cosines[order + 3] as number) : 0;
  let a1 = 0;
  let a2 = 0;
  let b1 = 0;
  let b2 = 0;
  let d1 = 0;
  let d2 = 0;
  let e1 = 0;
  let e2 = 0;
  for (let k = from; k < to; k++) {
    const x = signal[k] as number;
    const a0 = x + c0 * a1 - a2;
    a2 = a1;
    a1 = a0;
    const b0 = x + c1 * b1 - b2;
    b2 = b1;
    b1 = b0;
    const d0 = x + c2 * d1 - d2;
    d2 = d1;
    d1 = d0;
    const e0 = x + c3 * e1 - e2;
    e2 = e1;
    e1 = e0;
  }
  state[0] = a1;
  state[1] = a2;
  state[2] = b1;
  state[3] = b2;
  state[4] = d1;
  state[5] = d2;
  state[6] = e1;
  state[7] = e2;
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

/**
 * Voltage at the point of connection, simulated from a measured current: an ideal sinusoidal
 * source at the nominal voltage behind a supply impedance R + jX,
 *   v_pcc = v_source − R·i − L·di/dt,  L = X / (2π·f_nominal),
 * reduced at once to the r.m.s. value of each half-cycle, which is all that IEC 61000-3-3's
 * d(t), dc and dmax and the flickermeter's demodulator need.
 */
import { peakMagnitude } from "../electrical";

export interface SupplyImpedance {
  resistanceOhm: number;
  reactanceOhm: number;
}

/**
 * IEC 61000-3-3 reference impedance for a single-phase loop (from IEC TR 60725): phase
 * 0.24 + j0.15 Ω plus neutral 0.16 + j0.10 Ω. It is defined only for 220–250 V line-to-neutral
 * supplies at 50 Hz; for lower voltages or 60 Hz the standard has it "under consideration".
 */
export function referenceImpedance(nominalVoltage: number, frequencyHz: number): SupplyImpedance | null {
  const inScope = nominalVoltage >= 220 && nominalVoltage <= 250 && Math.abs(frequencyHz - 50) <= 2.5;
  return inScope ? { resistanceOhm: 0.4, reactanceOhm: 0.25 } : null;
}

export interface HalfCycleVoltage {
  /** R.m.s. voltage of each whole half-cycle of the source, in volts. */
  rms: Float64Array;
  halfCycleSeconds: number;
}

export interface PccSimulation {
  current: Float64Array;
  sampleRateHz: number;
  frequencyHz: number;
  nominalVoltage: number;
  /** The frequency at which the reactance is stated, to turn X into an inductance. */
  nominalFrequencyHz: number;
  impedance: SupplyImpedance;
  /** The current's largest magnitude (peakMagnitude), when the caller has it already. */
  currentPeakAmps?: number;
}

/** Cycles with less than a tenth of the largest fundamental current say too little about where the source's phase is. */
const PHASE_WINDOW_MIN_SHARE = 0.1;
/** Samples below this share of the peak current are left out of the phase fit: they are off-time or noise. */
const CONDUCTING_SHARE = 0.05;
/** A cycle needs current over at least this share of its samples for its fit to be trusted. */
const MIN_CONDUCTING_SHARE = 0.25;

/**
 * Phase of the current's fundamental, cycle by cycle, against a reference rotating at the measured
 * frequency. Taken cycle by cycle rather than over the whole capture because a small error in the
 * measured frequency, or the mains frequency wandering, drifts the phase by whole radians over a
 * long capture. Each cycle is a least-squares fit of A·sin θ + B·cos θ over only the samples that
 * carry current: a plain correlation over the whole cycle is biased wherever a burst starts or ends
 * inside it. Cycles without enough current get the phase interpolated from their neighbours (where
 * it barely matters: with no current the source voltage is the point-of-connection voltage).
 */
function fundamentalPhaseByCycle(current: Float64Array, currentPeakAmps: number, sampleRateHz: number, frequencyHz: number, cycles: number) {
  const samplesPerCycle = sampleRateHz / frequencyHz;
  const step = (2 * Math.PI * frequencyHz) / sampleRateHz;
  const stepCos = Math.cos(step);
  const stepSin = Math.sin(step);
  const threshold = CONDUCTING_SHARE * currentPeakAmps;
  const phase = new Float64Array(cycles);
  const amplitude = new Float64Array(cycles);
  for (let k = 0; k < cycles; k++) {
    const start = Math.round(k * samplesPerCycle);
    const end = Math.round((k + 1) * samplesPerCycle);
    const theta = 2 * Math.PI * (((frequencyHz * start) / sampleRateHz) % 1);
    let c = Math.cos(theta);
    let s = Math.sin(theta);
    let ss = 0;
    let cc = 0;
    let sc = 0;
    let is = 0;
    let ic = 0;
    let conducting = 0;
    for (let n = start; n < end; n++) {
      const i = current[n]!;
      if (Math.abs(i) > threshold) {
        ss += s * s;
        cc += c * c;
        sc += s * c;
        is += i * s;
        ic += i * c;
        conducting++;
      }
      const nextC = c * stepCos - s * stepSin;
      s = s * stepCos + c * stepSin;
      c = nextC;
    }
    const determinant = ss * cc - sc * sc;
    if (conducting >= MIN_CONDUCTING_SHARE * (end - start) && determinant > 0) {
      const inPhase = (is * cc - ic * sc) / determinant;
      const quadrature = (ic * ss - is * sc) / determinant;
      phase[k] = Math.atan2(quadrature, inPhase);
      amplitude[k] = Math.hypot(inPhase, quadrature);
    }
  }

  const largest = amplitude.reduce((a, b) => Math.max(a, b), 0);
  const known: number[] = [];
  for (let k = 0; k < cycles; k++) {
    if (largest > 0 && amplitude[k]! >= PHASE_WINDOW_MIN_SHARE * largest) known.push(k);
  }
  if (known.length === 0) return new Float64Array(cycles);

  // Unwrap along the known cycles, then interpolate (or hold, at the ends) across the others.
  for (let m = 1; m < known.length; m++) {
    const previous = phase[known[m - 1]!]!;
    const wrapped = phase[known[m]!]!;
    phase[known[m]!] = wrapped - 2 * Math.PI * Math.round((wrapped - previous) / (2 * Math.PI));
  }
  const first = known[0]!;
  const last = known[known.length - 1]!;
  phase.fill(phase[first]!, 0, first);
  phase.fill(phase[last]!, last + 1);
  for (let m = 1; m < known.length; m++) {
    const a = known[m - 1]!;
    const b = known[m]!;
    for (let k = a + 1; k < b; k++) phase[k] = phase[a]! + ((phase[b]! - phase[a]!) * (k - a)) / (b - a);
  }
  return phase;
}

/**
 * Half-cycle r.m.s. of v_pcc, the half-cycles bounded by the source's zero crossings. The source
 * is put in phase with the current's fundamental: exact for a resistive load such as a burst-fired
 * heater, which is what this is for.
 */
export function pccHalfCycleRms(sim: PccSimulation): HalfCycleVoltage {
  const { current, sampleRateHz, frequencyHz, nominalVoltage, impedance } = sim;
  const samplesPerCycle = sampleRateHz / frequencyHz;
  const cycles = Math.floor(current.length / samplesPerCycle);
  const phase = fundamentalPhaseByCycle(current, sim.currentPeakAmps ?? peakMagnitude(current), sampleRateHz, frequencyHz, cycles);

  const r = impedance.resistanceOhm;
  const inductance = impedance.reactanceOhm / (2 * Math.PI * sim.nominalFrequencyHz);
  const derivativeScale = (inductance * sampleRateHz) / 2;
  const peak = nominalVoltage * Math.SQRT2;
  const rotation = (2 * Math.PI * frequencyHz) / sampleRateHz;
  const last = current.length - 1;

  const rms = new Float64Array(2 * cycles + 1);
  let count = 0;
  let sum = 0;
  let started = false;
  let positive = true;
  for (let k = 0; k < cycles; k++) {
    const start = Math.round(k * samplesPerCycle);
    const end = Math.round((k + 1) * samplesPerCycle);
    // The phase ramps linearly to the next cycle's value so the source stays continuous.
    const from = phase[k]!;
    const to = k + 1 < cycles ? phase[k + 1]! : from;
    const step = rotation + (to - from) / (end - start);
    const stepCos = Math.cos(step);
    const stepSin = Math.sin(step);
    const theta = 2 * Math.PI * (((frequencyHz * start) / sampleRateHz) % 1) + from;
    let c = Math.cos(theta);
    let s = Math.sin(theta);
    if (k === 0) positive = s >= 0;
    for (let n = start; n < end; n++) {
      if (s >= 0 !== positive) {
        positive = !positive;
        // Divided by the half-period (π / step samples), not the sample count: whether the sample
        // nearest the zero crossing falls on one side or the other must not move the r.m.s.
        if (started) rms[count++] = Math.sqrt((sum * step) / Math.PI);
        started = true;
        sum = 0;
      }
      const i = current[n]!;
      // Central difference; the clamped ends fall in the partial half-cycles that are dropped.
      const di = current[n < last ? n + 1 : n]! - current[n > 0 ? n - 1 : n]!;
      const v = peak * s - r * i - derivativeScale * di;
      sum += v * v;
      const nextC = c * stepCos - s * stepSin;
      s = s * stepCos + c * stepSin;
      c = nextC;
    }
  }
  return { rms: rms.slice(0, count), halfCycleSeconds: 1 / (2 * frequencyHz) };
}

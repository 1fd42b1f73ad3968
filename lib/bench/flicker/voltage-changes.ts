/**
 * Relative voltage changes after IEC 61000-3-3 from the half-cycle r.m.s. voltage U_hp, all as
 * fractions of the nominal voltage Un:
 * - steady state: U_hp stays within ±0.2 % of Un for at least 1 s (tolerance from memory);
 * - d(t): the change of U_hp from the steady-state voltage before a voltage change characteristic;
 * - dc: the difference between two adjacent steady-state voltages;
 * - dmax: the difference between the highest and lowest U_hp of a voltage change characteristic;
 * - Tmax: how long d(t) stays beyond 3.3 % within one voltage change characteristic.
 * The record is taken as repeating end to end, so the last steady state is followed by the first.
 */
import type { HalfCycleVoltage } from "./pcc-voltage";

export const DC_LIMIT_PERCENT = 3.3;
const STEADY_STATE_SECONDS = 1;
const STEADY_STATE_TOLERANCE = 0.002;

/** Changes smaller than this share of Un are read as noise rather than switching. */
const SMALLEST_CHANGE = 0.001;
/** Share of half-cycles that must sit at one of two levels for the changes to count as rectangular. */
const RECTANGULAR_SHARE = 0.9;
const LEVEL_TOLERANCE = 0.1;

export interface VoltageChanges {
  dcPercent: number;
  dmaxPercent: number;
  tmaxSeconds: number;
  /** Changes between the low and high voltage levels, every up and every down counted. */
  changesPerMinute: number;
  /** Whether U_hp switches between two levels, as a step load does. */
  rectangular: boolean;
  /** Difference between the two levels, % of Un. */
  stepPercent: number;
}

interface SteadyState {
  start: number;
  end: number;
  mean: number;
}

function steadyStates(u: Float64Array, minimumCount: number, band: number): SteadyState[] {
  const found: SteadyState[] = [];
  let i = 0;
  while (i < u.length) {
    let low = u[i]!;
    let high = low;
    let sum = low;
    let j = i + 1;
    for (; j < u.length; j++) {
      const x = u[j]!;
      const nextLow = Math.min(low, x);
      const nextHigh = Math.max(high, x);
      if (nextHigh - nextLow > band) break;
      low = nextLow;
      high = nextHigh;
      sum += x;
    }
    if (j - i >= minimumCount) {
      found.push({ start: i, end: j, mean: sum / (j - i) });
      i = j;
    } else {
      i++;
    }
  }
  return found;
}

function rotate(u: Float64Array, start: number): Float64Array {
  const out = new Float64Array(u.length);
  out.set(u.subarray(start));
  out.set(u.subarray(0, start), u.length - start);
  return out;
}

/** dc, dmax and Tmax over the voltage change characteristics between steady states. */
function changeCharacteristics(u: Float64Array, halfCycleSeconds: number, nominalVoltage: number) {
  const minimumCount = Math.ceil(STEADY_STATE_SECONDS / halfCycleSeconds);
  const band = 2 * STEADY_STATE_TOLERANCE * nominalVoltage;
  const limit = (DC_LIMIT_PERCENT / 100) * nominalVoltage;
  const first = steadyStates(u, minimumCount, band)[0];
  if (first === undefined) {
    // Never steady: the whole capture is one characteristic, starting from the unloaded supply.
    let low = nominalVoltage;
    let high = nominalVoltage;
    let beyond = 0;
    for (const x of u) {
      low = Math.min(low, x);
      high = Math.max(high, x);
      if (Math.abs(x - nominalVoltage) > limit) beyond++;
    }
    return { dc: 0, dmax: (high - low) / nominalVoltage, tmax: beyond * halfCycleSeconds };
  }
  // Starting the cycle at a steady state makes every characteristic lie between two of them.
  const cyclic = rotate(u, first.start);
  const states = steadyStates(cyclic, minimumCount, band);
  let dc = 0;
  let dmax = 0;
  let tmax = 0;
  states.forEach((before, m) => {
    const after = states[(m + 1) % states.length]!;
    const end = m + 1 < states.length ? after.start : cyclic.length;
    let low = Math.min(before.mean, after.mean);
    let high = Math.max(before.mean, after.mean);
    let beyond = 0;
    for (let k = before.end; k < end; k++) {
      const x = cyclic[k]!;
      low = Math.min(low, x);
      high = Math.max(high, x);
      if (Math.abs(x - before.mean) > limit) beyond++;
    }
    dc = Math.max(dc, Math.abs(after.mean - before.mean));
    dmax = Math.max(dmax, high - low);
    tmax = Math.max(tmax, beyond * halfCycleSeconds);
  });
  return { dc: dc / nominalVoltage, dmax: dmax / nominalVoltage, tmax };
}

/** Up and down crossings between the two levels with hysteresis; a first pass finds the state the repeated record enters with. */
function countChanges(u: Float64Array, lowThreshold: number, highThreshold: number): number {
  let high = u[u.length - 1]! > (lowThreshold + highThreshold) / 2;
  let changes = 0;
  for (let pass = 0; pass < 2; pass++) {
    for (const x of u) {
      if (high ? x < lowThreshold : x > highThreshold) {
        high = !high;
        if (pass === 1) changes++;
      }
    }
  }
  return changes;
}

export function voltageChanges(halfCycles: HalfCycleVoltage, nominalVoltage: number): VoltageChanges {
  const u = halfCycles.rms;
  const seconds = u.length * halfCycles.halfCycleSeconds;
  const { dc, dmax, tmax } = changeCharacteristics(u, halfCycles.halfCycleSeconds, nominalVoltage);
  const characteristics = { dcPercent: 100 * dc, dmaxPercent: 100 * dmax, tmaxSeconds: tmax };

  const lowest = u.reduce((a, b) => Math.min(a, b), Infinity);
  const highest = u.reduce((a, b) => Math.max(a, b), -Infinity);
  const range = highest - lowest;
  if (!(range >= SMALLEST_CHANGE * nominalVoltage)) {
    return { ...characteristics, changesPerMinute: 0, rectangular: false, stepPercent: 0 };
  }
  const middle = lowest + range / 2;
  let lowSum = 0;
  let lowCount = 0;
  let highSum = 0;
  for (const x of u) {
    if (x < middle) {
      lowSum += x;
      lowCount++;
    } else {
      highSum += x;
    }
  }
  const lowLevel = lowSum / lowCount;
  const highLevel = highSum / (u.length - lowCount);
  const atALevel = u.reduce(
    (n, x) => n + (Math.min(Math.abs(x - lowLevel), Math.abs(x - highLevel)) <= LEVEL_TOLERANCE * range ? 1 : 0),
    0,
  );
  const changes = countChanges(u, lowest + range / 4, highest - range / 4);
  return {
    ...characteristics,
    changesPerMinute: (60 * changes) / seconds,
    rectangular: atALevel >= RECTANGULAR_SHARE * u.length,
    stepPercent: (100 * (highLevel - lowLevel)) / nominalVoltage,
  };
}

// Half-cycle view of a capture: RMS current per half-cycle, which half-cycles
// conduct (the conduction map), duty, switchings per minute, the longest off
// gap, how the controller fires (whole cycles or half-cycles, symmetric or
// not), and the power while conducting apart from the mean over the record.

import { sampleCells, type SampleSums } from "./electrical";

/** A half-cycle conducts when its RMS current exceeds this share of the largest half-cycle RMS current… */
export const CONDUCTING_SHARE_OF_LARGEST = 0.1;

/**
 * …and this floor, so that a capture of a tool that never switched on does not
 * read its clamp's noise as conduction. 10 mA is 2.3 W at 230 V, below any
 * heating element.
 */
export const CONDUCTING_FLOOR_AMPS = 0.01;

/**
 * Conducting positive and negative half-cycles differing by more than this
 * share of the conducting ones (and by more than one, which a record's ends
 * can cut) mark asymmetric control.
 */
const ASYMMETRY_SHARE = 0.05;

export interface HalfCycleTable {
  /** count + 1 fractional sample positions; half-cycle j runs from boundary j up to boundary j + 1. */
  boundaries: Float64Array;
  count: number;
  samples: Float64Array;
  current: Float64Array;
  currentSquared: Float64Array;
  voltage: Float64Array | null;
  voltageSquared: Float64Array | null;
  product: Float64Array | null;
}

/**
 * One pass over the samples between the first and last boundary, summing per
 * half-cycle; a sample cut by a boundary is shared between the two half-cycles
 * by the share of its interval on each side (see sampleCells).
 */
export function tabulateHalfCycles(current: Float64Array, voltage: Float64Array | null, boundaries: Float64Array): HalfCycleTable {
  const count = Math.max(0, boundaries.length - 1);
  const table: HalfCycleTable = {
    boundaries,
    count,
    samples: new Float64Array(count),
    current: new Float64Array(count),
    currentSquared: new Float64Array(count),
    voltage: voltage === null ? null : new Float64Array(count),
    voltageSquared: voltage === null ? null : new Float64Array(count),
    product: voltage === null ? null : new Float64Array(count),
  };
  const lastSample = current.length - 1;
  for (let j = 0; j < count; j++) {
    const start = boundaries[j] as number;
    const end = boundaries[j + 1] as number;
    const { first, last, leadWeight, trailWeight } = sampleCells(start, end);
    let sumI = 0;
    let sumI2 = 0;
    let sumV = 0;
    let sumV2 = 0;
    let sumVI = 0;
    const edges: [number, number][] = [
      [first - 1, leadWeight],
      [last + 1, trailWeight],
    ];
    for (const [k, weight] of edges) {
      if (k < 0 || k > lastSample || weight === 0) continue;
      const i = current[k] as number;
      sumI += weight * i;
      sumI2 += weight * i * i;
      if (voltage !== null) {
        const v = voltage[k] as number;
        sumV += weight * v;
        sumV2 += weight * v * v;
        sumVI += weight * v * i;
      }
    }
    const to = Math.min(last, lastSample);
    if (voltage === null) {
      for (let k = first; k <= to; k++) {
        const i = current[k] as number;
        sumI += i;
        sumI2 += i * i;
      }
    } else {
      for (let k = first; k <= to; k++) {
        const i = current[k] as number;
        const v = voltage[k] as number;
        sumI += i;
        sumI2 += i * i;
        sumV += v;
        sumV2 += v * v;
        sumVI += v * i;
      }
      (table.voltage as Float64Array)[j] = sumV;
      (table.voltageSquared as Float64Array)[j] = sumV2;
      (table.product as Float64Array)[j] = sumVI;
    }
    table.samples[j] = end - start;
    table.current[j] = sumI;
    table.currentSquared[j] = sumI2;
  }
  return table;
}

/** Sums over the half-cycles in [from, to), or only those `include` marks. */
export function sumHalfCycles(table: HalfCycleTable, from: number, to: number, include?: Uint8Array): SampleSums {
  const sums: SampleSums = { count: 0, current: 0, currentSquared: 0, voltage: 0, voltageSquared: 0, product: 0 };
  for (let j = from; j < to; j++) {
    if (include !== undefined && include[j] !== 1) continue;
    sums.count += table.samples[j] as number;
    sums.current += table.current[j] as number;
    sums.currentSquared += table.currentSquared[j] as number;
    sums.voltage += table.voltage?.[j] ?? 0;
    sums.voltageSquared += table.voltageSquared?.[j] ?? 0;
    sums.product += table.product?.[j] ?? 0;
  }
  return sums;
}

export function halfCycleRms(table: HalfCycleTable, j: number): number {
  const samples = table.samples[j] as number;
  return samples > 0 ? Math.sqrt((table.currentSquared[j] as number) / samples) : 0;
}

/**
 * continuous: every half-cycle conducts; none: none does; whole-cycle:
 * conduction comes in whole cycles (burst-fire); half-cycle: some runs of
 * conduction are an odd number of half-cycles.
 */
export type Firing = "continuous" | "none" | "whole-cycle" | "half-cycle";

export interface Conduction {
  halfCycles: number;
  conducting: number;
  /** Conducting share of the half-cycles. */
  duty: number;
  /** Every on and every off edge counts, as changes do in IEC 61000-4-15. */
  switchesPerMinute: number;
  longestOffSeconds: number;
  firing: Firing;
  asymmetric: boolean;
  positiveConducting: number;
  negativeConducting: number;
  thresholdAmps: number;
  /** One character a half-cycle: "1" conducting, "0" blocked. */
  map: string;
  /** 1 where half-cycle j conducts, for summing over conducting half-cycles. */
  conductingMask: Uint8Array;
}

export function classifyConduction(table: HalfCycleTable, sampleRateHz: number): Conduction {
  const { count, boundaries } = table;
  let largest = 0;
  for (let j = 0; j < count; j++) largest = Math.max(largest, halfCycleRms(table, j));
  const thresholdAmps = Math.max(CONDUCTING_FLOOR_AMPS, CONDUCTING_SHARE_OF_LARGEST * largest);
  const mask = new Uint8Array(count);
  let conducting = 0;
  let positiveConducting = 0;
  let negativeConducting = 0;
  for (let j = 0; j < count; j++) {
    if (halfCycleRms(table, j) > thresholdAmps) {
      mask[j] = 1;
      conducting++;
      // The voltage's sign says which half of the cycle it is; without voltage the current's own sign does.
      const polarity = table.voltage?.[j] ?? (table.current[j] as number);
      if (polarity >= 0) positiveConducting++;
      else negativeConducting++;
    }
  }

  let switches = 0;
  for (let j = 1; j < count; j++) if (mask[j] !== mask[j - 1]) switches++;
  const spanSeconds = count > 0 ? ((boundaries[count] as number) - (boundaries[0] as number)) / sampleRateHz : 0;

  let longestOff = 0;
  const runs: { on: boolean; length: number; touchesEnd: boolean }[] = [];
  let runStart = 0;
  for (let j = 1; j <= count; j++) {
    if (j === count || mask[j] !== mask[runStart]) {
      const on = mask[runStart] === 1;
      runs.push({ on, length: j - runStart, touchesEnd: runStart === 0 || j === count });
      if (!on) longestOff = Math.max(longestOff, ((boundaries[j] as number) - (boundaries[runStart] as number)) / sampleRateHz);
      runStart = j;
    }
  }

  let firing: Firing;
  if (conducting === count) firing = "continuous";
  else if (conducting === 0) firing = "none";
  else {
    const onRuns = runs.filter((run) => run.on);
    const inner = onRuns.filter((run) => !run.touchesEnd);
    const judged = inner.length > 0 ? inner : onRuns;
    firing = judged.every((run) => run.length % 2 === 0) ? "whole-cycle" : "half-cycle";
  }
  const imbalance = Math.abs(positiveConducting - negativeConducting);
  const asymmetric = imbalance > 1 && imbalance > ASYMMETRY_SHARE * conducting;

  let map = "";
  for (let j = 0; j < count; j += 4096) map += String.fromCharCode(...Array.from(mask.subarray(j, j + 4096), (on) => 48 + on));

  return {
    halfCycles: count,
    conducting,
    duty: count > 0 ? conducting / count : 0,
    switchesPerMinute: spanSeconds > 0 ? switches / (spanSeconds / 60) : 0,
    longestOffSeconds: longestOff,
    firing,
    asymmetric,
    positiveConducting,
    negativeConducting,
    thresholdAmps,
    map,
    conductingMask: mask,
  };
}

export interface EstimatedPower {
  whileConducting: number;
  mean: number;
  assumedVoltage: number;
  basis: string;
}

/**
 * Without a voltage channel: the load is taken as a resistance R = U_n / I_c,
 * I_c the RMS current over the conducting half-cycles at the nominal voltage
 * U_n, so each half-cycle takes I²·R. Power while conducting is then U_n·I_c
 * and the record mean U_n·I_rec²/I_c (= duty·U_n·I_c for burst-fire), never
 * U_n·I_rec, which is an apparent power.
 */
export function estimatePowerFromCurrent(input: {
  nominalVoltage: number;
  currentRmsWhileConducting: number;
  currentRmsRecord: number;
}): EstimatedPower {
  const { nominalVoltage, currentRmsWhileConducting, currentRmsRecord } = input;
  const resistance = currentRmsWhileConducting > 0 ? nominalVoltage / currentRmsWhileConducting : 0;
  return {
    whileConducting: nominalVoltage * currentRmsWhileConducting,
    mean: resistance * currentRmsRecord * currentRmsRecord,
    assumedVoltage: nominalVoltage,
    basis:
      `estimate, not a measurement: no voltage channel, so the load is taken as a resistance drawing the ` +
      `conducting half-cycles' RMS current at the nominal ${nominalVoltage} V (power factor 1 while conducting)`,
  };
}

// Heat-up and recovery of a soldering or hot-air tool from a temperature log.
// No standard defines heat-up time for these tools, so Benchplate reports the
// time to enter and stay within a stated band around the setpoint (settling
// time as control texts define it) alongside t63.2 and t90, and names a time
// constant only when a first-order fit backs it.

import { requireFinite, requireFiniteList, requirePositive } from "./input-checks";
import { describeSpread, type Spread } from "./statistics";

export interface TemperatureLog {
  timeS: readonly number[];
  temperatureC: readonly number[];
}

/**
 * A band around the setpoint. A percentage is of the step from the start
 * temperature to the setpoint, as control texts define settling bands: a
 * percentage of a Celsius reading would hang on where 0 °C happens to be.
 */
export type Band = { kind: "absolute"; plusMinusC: number } | { kind: "percent"; plusMinusPercent: number };

export interface ResolvedBand {
  lowerC: number;
  upperC: number;
  halfWidthC: number;
  description: string;
}

export interface FirstOrderFit {
  timeConstantS: number;
  deadTimeS: number;
  /** Of the straight-line fit of ln(1 − fraction of step) against time. */
  rSquared: number;
  /** RMS of measured − fitted temperature over the fitted span. */
  rmsResidualC: number;
  fromS: number;
  toS: number;
}

export interface SteadyState extends Spread {
  fromS: number;
  toS: number;
  basis: string;
  offsetFromSetpointC: number;
}

export interface HeatUp {
  setpointC: number;
  band: ResolvedBand;
  startTemperatureC: number;
  /** Time from the start of the log to entering the band for good; null when the log ends outside it. */
  bandEntryS: number | null;
  /** Steady-state mean: the final value t10, t63.2 and t90 are measured against. */
  finalTemperatureC: number;
  t10S: number | null;
  t63S: number | null;
  t90S: number | null;
  riseTime10To90S: number | null;
  peakC: number;
  /** Peak above the setpoint, 0 when the log never exceeds it. */
  overshootC: number;
  overshootPercentOfStep: number;
  steadyState: SteadyState;
  firstOrderFit: FirstOrderFit | null;
}

const FRACTION_63 = 1 - Math.exp(-1);
const DEFAULT_STEADY_SHARE = 0.2;
const MIN_FIT_POINTS = 3;

function requireLog(log: TemperatureLog): TemperatureLog {
  if (typeof log !== "object" || log === null) throw new Error("log must have timeS and temperatureC lists");
  requireFiniteList("log.timeS", log.timeS, 2);
  requireFiniteList("log.temperatureC", log.temperatureC, 2);
  if (log.timeS.length !== log.temperatureC.length) {
    throw new Error(`log.timeS has ${log.timeS.length} values but log.temperatureC has ${log.temperatureC.length}`);
  }
  for (let i = 1; i < log.timeS.length; i++) {
    const previous = log.timeS[i - 1] ?? Number.NaN;
    const current = log.timeS[i] ?? Number.NaN;
    if (!(current > previous)) throw new Error(`log.timeS must increase: log.timeS[${i}] = ${current} after ${previous}`);
  }
  return log;
}

function at(values: readonly number[], index: number): number {
  const value = values[index];
  if (value === undefined) throw new Error(`index ${index} is outside a list of ${values.length}`);
  return value;
}

function resolveBand(band: Band, setpointC: number, startTemperatureC: number): ResolvedBand {
  let halfWidthC: number;
  let description: string;
  if (band?.kind === "absolute") {
    halfWidthC = requirePositive("band.plusMinusC", band.plusMinusC);
    description = `±${halfWidthC} °C`;
  } else if (band?.kind === "percent") {
    const percent = requirePositive("band.plusMinusPercent", band.plusMinusPercent);
    const step = setpointC - startTemperatureC;
    if (step <= 0) {
      throw new Error(`A percentage band needs the log to start below the setpoint; it starts at ${startTemperatureC} °C, setpoint ${setpointC} °C`);
    }
    halfWidthC = (step * percent) / 100;
    description = `±${percent} % of the ${round(step)} °C step = ±${round(halfWidthC)} °C`;
  } else {
    throw new Error('band must be { kind: "absolute", plusMinusC } or { kind: "percent", plusMinusPercent }');
  }
  return { lowerC: setpointC - halfWidthC, upperC: setpointC + halfWidthC, halfWidthC, description };
}

function round(value: number): number {
  return Number(value.toFixed(3));
}

function prepare(log: TemperatureLog, setpointInput: number, band: Band) {
  requireLog(log);
  const setpointC = requireFinite("setpointC", setpointInput);
  const startTemperatureC = at(log.temperatureC, 0);
  return { setpointC, startTemperatureC, band: resolveBand(band, setpointC, startTemperatureC), t0: at(log.timeS, 0) };
}

/** Time (from the log's first sample) at which the line between samples i and i + 1 crosses a level. */
function crossing(log: TemperatureLog, i: number, level: number): number {
  const t1 = at(log.timeS, i);
  const t2 = at(log.timeS, i + 1);
  const y1 = at(log.temperatureC, i);
  const y2 = at(log.temperatureC, i + 1);
  const share = y2 === y1 ? 0 : (level - y1) / (y2 - y1);
  return t1 + share * (t2 - t1) - at(log.timeS, 0);
}

function firstTimeAtOrAbove(log: TemperatureLog, level: number): number | null {
  if (at(log.temperatureC, 0) >= level) return 0;
  for (let i = 1; i < log.temperatureC.length; i++) {
    if (at(log.temperatureC, i) >= level) return crossing(log, i - 1, level);
  }
  return null;
}

function bandEntry(log: TemperatureLog, band: ResolvedBand): number | null {
  const last = log.temperatureC.length - 1;
  const inBand = (index: number) => {
    const value = at(log.temperatureC, index);
    return value >= band.lowerC && value <= band.upperC;
  };
  if (!inBand(last)) return null;
  let outside = last - 1;
  while (outside >= 0 && inBand(outside)) outside--;
  if (outside < 0) return 0;
  const edge = at(log.temperatureC, outside) < band.lowerC ? band.lowerC : band.upperC;
  return crossing(log, outside, edge);
}

function fitFirstOrder(
  log: TemperatureLog,
  startTemperatureC: number,
  finalTemperatureC: number,
  t10S: number | null,
  t90S: number | null,
): FirstOrderFit | null {
  if (t10S === null || t90S === null) return null;
  const step = finalTemperatureC - startTemperatureC;
  const times: number[] = [];
  const temperatures: number[] = [];
  const logs: number[] = [];
  for (let i = 0; i < log.timeS.length; i++) {
    const t = at(log.timeS, i) - at(log.timeS, 0);
    const temperature = at(log.temperatureC, i);
    const fraction = (temperature - startTemperatureC) / step;
    if (t < t10S || t > t90S || fraction <= 0 || fraction >= 1) continue;
    times.push(t);
    temperatures.push(temperature);
    logs.push(Math.log(1 - fraction));
  }
  if (times.length < MIN_FIT_POINTS) return null;
  // ln(1 − fraction) = (θ − t)/τ: a straight line in t of slope −1/τ through θ/τ.
  const n = times.length;
  const meanT = times.reduce((sum, t) => sum + t, 0) / n;
  const meanY = logs.reduce((sum, y) => sum + y, 0) / n;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = at(times, i) - meanT;
    const dy = at(logs, i) - meanY;
    sxx += dx * dx;
    sxy += dx * dy;
    syy += dy * dy;
  }
  const slope = sxy / sxx;
  if (!(slope < 0)) return null;
  const intercept = meanY - slope * meanT;
  const timeConstantS = -1 / slope;
  const deadTimeS = intercept * timeConstantS;
  let sumOfSquares = 0;
  for (let i = 0; i < n; i++) {
    const fitted = finalTemperatureC - step * Math.exp(-(at(times, i) - deadTimeS) / timeConstantS);
    sumOfSquares += (at(temperatures, i) - fitted) ** 2;
  }
  return {
    timeConstantS,
    deadTimeS,
    rSquared: syy === 0 ? 1 : (sxy * sxy) / (sxx * syy),
    rmsResidualC: Math.sqrt(sumOfSquares / n),
    fromS: at(times, 0),
    toS: at(times, n - 1),
  };
}

/**
 * Heat-up from a log starting when power is applied. t10, t63.2 and t90 are
 * first crossings of those fractions of the rise from the first sample to the
 * steady-state mean. The steady state is the log's tail: the last
 * steadyWindowS seconds (default the last 20 % of the log), starting no
 * earlier than band entry. Trim a load step off the log first: a dip would
 * move band entry to after its recovery (see loadStepRecovery).
 */
export function analyzeHeatUp(input: {
  log: TemperatureLog;
  setpointC: number;
  band: Band;
  steadyWindowS?: number;
  fitFirstOrder?: boolean;
}): HeatUp {
  const { log } = input;
  const { setpointC, startTemperatureC, band, t0 } = prepare(log, input.setpointC, input.band);
  if (setpointC <= startTemperatureC) {
    throw new Error(`setpointC ${setpointC} °C must be above the log's start temperature ${startTemperatureC} °C for a heat-up`);
  }
  const durationS = at(log.timeS, log.timeS.length - 1) - t0;
  const steadyWindowS =
    input.steadyWindowS === undefined ? durationS * DEFAULT_STEADY_SHARE : requirePositive("steadyWindowS", input.steadyWindowS);
  if (steadyWindowS > durationS) throw new Error(`steadyWindowS ${steadyWindowS} s is longer than the log (${durationS} s)`);

  const bandEntryS = bandEntry(log, band);
  const windowFromS = durationS - steadyWindowS;
  const steadyFromS = bandEntryS === null ? windowFromS : Math.max(windowFromS, bandEntryS);
  const tail = log.temperatureC.filter((_, i) => at(log.timeS, i) - t0 >= steadyFromS);
  const spread = describeSpread(tail, "steady-state tail");
  const basis =
    bandEntryS === null
      ? `last ${steadyWindowS} s of the log; the log never settled in the band`
      : steadyFromS === bandEntryS
        ? "from band entry to the end of the log"
        : `last ${steadyWindowS} s of the log, after band entry`;
  const finalTemperatureC = spread.mean;
  if (finalTemperatureC <= startTemperatureC) {
    throw new Error(`The log does not rise: steady-state mean ${finalTemperatureC} °C is not above the start ${startTemperatureC} °C`);
  }

  const step = finalTemperatureC - startTemperatureC;
  const timeAt = (fraction: number) => firstTimeAtOrAbove(log, startTemperatureC + fraction * step);
  const t10S = timeAt(0.1);
  const t63S = timeAt(FRACTION_63);
  const t90S = timeAt(0.9);
  const peakC = describeSpread(log.temperatureC, "log.temperatureC").max;
  const overshootC = Math.max(0, peakC - setpointC);

  return {
    setpointC,
    band,
    startTemperatureC,
    bandEntryS,
    finalTemperatureC,
    t10S,
    t63S,
    t90S,
    riseTime10To90S: t10S === null || t90S === null ? null : t90S - t10S,
    peakC,
    overshootC,
    overshootPercentOfStep: (overshootC / (setpointC - startTemperatureC)) * 100,
    steadyState: {
      ...spread,
      fromS: steadyFromS,
      toS: durationS,
      basis,
      offsetFromSetpointC: finalTemperatureC - setpointC,
    },
    firstOrderFit: input.fitFirstOrder === false ? null : fitFirstOrder(log, startTemperatureC, finalTemperatureC, t10S, t90S),
  };
}

export interface Dip {
  /** When the temperature fell below the band, from the start of the log. */
  leftBandAtS: number;
  lowestC: number;
  lowestAtS: number;
  /** Setpoint minus the lowest temperature. */
  dipDepthC: number;
  /** Null when the log ends before the temperature is back in the band. */
  backInBandAtS: number | null;
  recoveryS: number | null;
}

/**
 * Dips below the band after a load step (a tip touching a heavy joint, a
 * nozzle over a board), each with its depth and the time back into the band.
 * Only the time after fromS counts, by default after the log first reaches
 * the band, so the heat-up itself is not a dip.
 */
export function loadStepRecovery(input: { log: TemperatureLog; setpointC: number; band: Band; fromS?: number }): {
  band: ResolvedBand;
  fromS: number | null;
  dips: Dip[];
} {
  const { log } = input;
  const { band, setpointC, t0 } = prepare(log, input.setpointC, input.band);
  const fromS =
    input.fromS === undefined ? firstTimeAtOrAbove(log, band.lowerC) : requireFinite("fromS", input.fromS);
  const dips: Dip[] = [];
  if (fromS === null) return { band, fromS, dips };

  let current: Dip | null = null;
  for (let i = 0; i < log.timeS.length; i++) {
    const t = at(log.timeS, i) - t0;
    const temperature = at(log.temperatureC, i);
    if (t < fromS) continue;
    if (temperature < band.lowerC) {
      if (current === null) {
        const leftBandAtS = i > 0 && at(log.temperatureC, i - 1) >= band.lowerC ? crossing(log, i - 1, band.lowerC) : t;
        current = { leftBandAtS, lowestC: temperature, lowestAtS: t, dipDepthC: 0, backInBandAtS: null, recoveryS: null };
        dips.push(current);
      }
      if (temperature < current.lowestC) {
        current.lowestC = temperature;
        current.lowestAtS = t;
      }
      current.dipDepthC = setpointC - current.lowestC;
    } else if (current !== null) {
      current.backInBandAtS = crossing(log, i - 1, band.lowerC);
      current.recoveryS = current.backInBandAtS - current.leftBandAtS;
      current = null;
    }
  }
  return { band, fromS, dips };
}

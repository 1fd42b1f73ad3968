import { describe, expect, it } from "vitest";
import { analyzeHeatUp, loadStepRecovery, type TemperatureLog } from "@/lib/bench/thermal";
import { mulberry32, rectangular } from "./monte-carlo";

const START_C = 25;
const SETPOINT_C = 350;
const TAU_S = 20;

/** A first-order heat-up sampled every dtS: T = T∞ − (T∞ − T0)·exp(−(t − θ)/τ) after a dead time θ. */
function firstOrderLog(options: { deadTimeS?: number; noiseC?: number; dtS?: number; durationS?: number } = {}): TemperatureLog {
  const { deadTimeS = 0, noiseC = 0, dtS = 0.01, durationS = 15 * TAU_S } = options;
  const random = mulberry32(7);
  const timeS: number[] = [];
  const temperatureC: number[] = [];
  const samples = Math.round(durationS / dtS);
  for (let i = 0; i <= samples; i++) {
    const t = i * dtS;
    const rise = t <= deadTimeS ? 0 : 1 - Math.exp(-(t - deadTimeS) / TAU_S);
    timeS.push(t);
    temperatureC.push(START_C + (SETPOINT_C - START_C) * rise + (i === 0 ? 0 : rectangular(random, noiseC)));
  }
  return { timeS, temperatureC };
}

function linearLog(points: Array<[number, number]>, dtS = 1): TemperatureLog {
  const timeS: number[] = [];
  const temperatureC: number[] = [];
  for (let k = 0; k < points.length - 1; k++) {
    const [t1, y1] = points[k] ?? [0, 0];
    const [t2, y2] = points[k + 1] ?? [0, 0];
    for (let t = t1; t < t2; t += dtS) {
      timeS.push(t);
      temperatureC.push(y1 + ((y2 - y1) * (t - t1)) / (t2 - t1));
    }
  }
  const [lastT, lastY] = points[points.length - 1] ?? [0, 0];
  timeS.push(lastT);
  temperatureC.push(lastY);
  return { timeS, temperatureC };
}

// First-order step response, t_x = −τ ln(1 − x) (REFERENCES.md §9, seen/derived from control texts).
describe("heat-up of a first-order response", () => {
  const heatUp = analyzeHeatUp({ log: firstOrderLog(), setpointC: SETPOINT_C, band: { kind: "percent", plusMinusPercent: 5 } });

  it("reaches 63.2 % at τ", () => {
    expect(heatUp.t63S).toBeCloseTo(TAU_S, 2);
  });

  it("reaches 90 % at 2.303 τ", () => {
    expect(heatUp.t90S).toBeCloseTo(2.302585 * TAU_S, 2);
  });

  it("rises from 10 % to 90 % in 2.197 τ", () => {
    expect(heatUp.t10S).toBeCloseTo(0.1053605 * TAU_S, 2);
    expect(heatUp.riseTime10To90S).toBeCloseTo(2.1972246 * TAU_S, 2);
  });

  it("enters a ±5 % band (95 % of the step) for good at 2.996 τ", () => {
    expect(heatUp.band).toMatchObject({ lowerC: 333.75, upperC: 366.25, description: "±5 % of the 325 °C step = ±16.25 °C" });
    expect(heatUp.bandEntryS).toBeCloseTo(2.9957323 * TAU_S, 2);
  });

  it("enters a ±2 % band at 3.912 τ", () => {
    const tight = analyzeHeatUp({ log: firstOrderLog(), setpointC: SETPOINT_C, band: { kind: "percent", plusMinusPercent: 2 } });
    expect(tight.bandEntryS).toBeCloseTo(3.912023 * TAU_S, 2);
  });

  it("takes the steady state from the last 20 % of the log", () => {
    expect(heatUp.steadyState).toMatchObject({ fromS: 240, toS: 300, basis: "last 60 s of the log, after band entry" });
    // The tail's mean sits e^−12-ish short of the final value: under 0.001 °C.
    expect(heatUp.finalTemperatureC).toBeCloseTo(SETPOINT_C, 2);
    expect(heatUp.steadyState.offsetFromSetpointC).toBeCloseTo(0, 2);
    expect(heatUp.overshootC).toBe(0);
  });

  it("fits τ and a zero dead time, calling it a time constant only with the fit", () => {
    expect(heatUp.firstOrderFit?.timeConstantS).toBeCloseTo(TAU_S, 3);
    expect(heatUp.firstOrderFit?.deadTimeS).toBeCloseTo(0, 3);
    expect(heatUp.firstOrderFit?.rSquared).toBeCloseTo(1, 9);
    expect(heatUp.firstOrderFit?.rmsResidualC).toBeLessThan(1e-3);
    expect(analyzeHeatUp({ log: firstOrderLog(), setpointC: SETPOINT_C, band: { kind: "absolute", plusMinusC: 5 }, fitFirstOrder: false }).firstOrderFit).toBeNull();
  });

  it("fits a dead time, which t63.2 then includes", () => {
    const delayed = analyzeHeatUp({ log: firstOrderLog({ deadTimeS: 3 }), setpointC: SETPOINT_C, band: { kind: "absolute", plusMinusC: 5 } });
    expect(delayed.firstOrderFit?.timeConstantS).toBeCloseTo(TAU_S, 3);
    expect(delayed.firstOrderFit?.deadTimeS).toBeCloseTo(3, 3);
    expect(delayed.t63S).toBeCloseTo(3 + TAU_S, 2);
  });

  it("reports the fit's quality on a noisy log", () => {
    const noisy = analyzeHeatUp({
      log: firstOrderLog({ noiseC: 0.5, dtS: 0.1 }),
      setpointC: SETPOINT_C,
      band: { kind: "absolute", plusMinusC: 5 },
    });
    const fit = noisy.firstOrderFit;
    expect(fit?.timeConstantS).toBeGreaterThan(0.98 * TAU_S);
    expect(fit?.timeConstantS).toBeLessThan(1.02 * TAU_S);
    expect(fit?.rSquared).toBeGreaterThan(0.99);
    // Uniform noise of ±0.5 °C has a standard deviation of 0.289 °C.
    expect(fit?.rmsResidualC).toBeGreaterThan(0.2);
    expect(fit?.rmsResidualC).toBeLessThan(0.4);
    expect(noisy.steadyState.standardDeviation).toBeGreaterThan(0.2);
    expect(noisy.steadyState.standardDeviation).toBeLessThan(0.4);
    expect(noisy.steadyState.max - noisy.steadyState.min).toBeLessThanOrEqual(1);
  });
});

describe("heat-up with overshoot and steady-state spread", () => {
  const log = linearLog([
    [0, 25],
    [10, 200],
    [20, 340],
    [30, 362],
    [40, 352],
    [50, 350],
    [60, 348],
    [70, 350],
  ]);
  const heatUp = analyzeHeatUp({ log, setpointC: 350, band: { kind: "absolute", plusMinusC: 5 }, steadyWindowS: 20 });

  it("measures overshoot above the setpoint", () => {
    expect(heatUp.peakC).toBe(362);
    expect(heatUp.overshootC).toBe(12);
    expect(heatUp.overshootPercentOfStep).toBeCloseTo((12 / 325) * 100, 9);
  });

  it("enters the band when it comes down through the upper edge for the last time", () => {
    // 362 °C at 30 s falling to 352 °C at 40 s crosses 355 °C at 37 s.
    expect(heatUp.bandEntryS).toBeCloseTo(37, 9);
  });

  it("gives the steady-state mean, standard deviation, min and max over the tail", () => {
    expect(heatUp.steadyState).toMatchObject({ fromS: 50, toS: 70, count: 21, min: 348, max: 350 });
    // Samples 350, 349.8 … 348 … 349.8, 350 at 1 s: (11·350 + 10·348) / 21.
    expect(heatUp.steadyState.mean).toBeCloseTo(7330 / 21, 9);
    expect(heatUp.steadyState.offsetFromSetpointC).toBeCloseTo(7330 / 21 - 350, 9);
  });

  it("starts the steady state at band entry when that is later than the window", () => {
    const late = analyzeHeatUp({ log, setpointC: 350, band: { kind: "absolute", plusMinusC: 5 }, steadyWindowS: 60 });
    expect(late.steadyState.fromS).toBeCloseTo(37, 9);
    expect(late.steadyState.basis).toBe("from band entry to the end of the log");
  });

  it("says when the log never settles in the band", () => {
    const unsettled = analyzeHeatUp({
      log: linearLog([
        [0, 25],
        [30, 300],
        [60, 320],
      ]),
      setpointC: 350,
      band: { kind: "absolute", plusMinusC: 5 },
    });
    expect(unsettled.bandEntryS).toBeNull();
    expect(unsettled.steadyState.basis).toContain("never settled in the band");
  });
});

describe("recovery after a load step", () => {
  // Steady at 350 °C; at 100 s a load pulls it to 320 °C by 105 s; it is back at 350 °C by 115 s.
  const log = linearLog([
    [0, 25],
    [40, 350],
    [100, 350],
    [105, 320],
    [115, 350],
    [150, 350],
  ]);

  it("times the dip from leaving the band to coming back into it, with its depth", () => {
    const { dips, fromS } = loadStepRecovery({ log, setpointC: 350, band: { kind: "absolute", plusMinusC: 5 } });
    expect(fromS).toBeCloseTo((320 / 325) * 40, 9);
    expect(dips).toHaveLength(1);
    const [dip] = dips;
    expect(dip?.leftBandAtS).toBeCloseTo(100 + (5 / 30) * 5, 9);
    expect(dip?.backInBandAtS).toBeCloseTo(105 + (25 / 30) * 10, 9);
    expect(dip?.recoveryS).toBeCloseTo(12.5, 9);
    expect(dip).toMatchObject({ lowestC: 320, lowestAtS: 105, dipDepthC: 30 });
  });

  it("leaves the recovery open when the log ends below the band", () => {
    const cut = { timeS: log.timeS.slice(0, 108), temperatureC: log.temperatureC.slice(0, 108) };
    const [dip] = loadStepRecovery({ log: cut, setpointC: 350, band: { kind: "absolute", plusMinusC: 5 } }).dips;
    expect(dip).toMatchObject({ backInBandAtS: null, recoveryS: null });
  });

  it("analyses a log that starts already at temperature", () => {
    const hot = { timeS: log.timeS.slice(60), temperatureC: log.temperatureC.slice(60) };
    const { dips } = loadStepRecovery({ log: hot, setpointC: 350, band: { kind: "absolute", plusMinusC: 5 } });
    expect(dips[0]?.recoveryS).toBeCloseTo(12.5, 9);
  });
});

describe("input checks", () => {
  const log = firstOrderLog({ dtS: 1 });
  const band = { kind: "absolute", plusMinusC: 5 } as const;

  it("rejects bad logs and settings, naming the value", () => {
    expect(() => analyzeHeatUp({ log: { timeS: [0, 1, 1], temperatureC: [25, 30, 35] }, setpointC: 350, band })).toThrow(
      "log.timeS must increase: log.timeS[2] = 1 after 1",
    );
    expect(() => analyzeHeatUp({ log: { timeS: [0, 1], temperatureC: [25] }, setpointC: 350, band })).toThrow(
      "log.temperatureC needs at least 2 values, got 1",
    );
    expect(() => analyzeHeatUp({ log: { timeS: [0, 1, 2], temperatureC: [25, 30] }, setpointC: 350, band })).toThrow(
      "log.timeS has 3 values but log.temperatureC has 2",
    );
    expect(() => analyzeHeatUp({ log: { timeS: [0, 1], temperatureC: [25, Number.NaN] }, setpointC: 350, band })).toThrow(
      "log.temperatureC[1] must be a finite number, got NaN",
    );
    expect(() => analyzeHeatUp({ log, setpointC: 350, band: { kind: "absolute", plusMinusC: 0 } })).toThrow("band.plusMinusC must be greater than 0, got 0");
    expect(() => analyzeHeatUp({ log, setpointC: 350, band: { kind: "percent", plusMinusPercent: -2 } })).toThrow(
      "band.plusMinusPercent must be greater than 0, got -2",
    );
    expect(() => analyzeHeatUp({ log, setpointC: 350, band: { kind: "kelvin" } as never })).toThrow("band must be");
    expect(() => analyzeHeatUp({ log, setpointC: 20, band })).toThrow("setpointC 20 °C must be above the log's start temperature 25 °C");
    expect(() => analyzeHeatUp({ log, setpointC: 350, band, steadyWindowS: 1000 })).toThrow("steadyWindowS 1000 s is longer than the log (300 s)");
    expect(() => loadStepRecovery({ log, setpointC: Number.POSITIVE_INFINITY, band })).toThrow("setpointC must be a finite number, got Infinity");
  });
});

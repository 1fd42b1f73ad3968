import FFT from "fft.js";
import { describe, expect, it } from "vitest";
import {
  assessHarmonics,
  classALimitAmps,
  harmonicLimitAmps,
  harmonicWindowCycles,
  measureHarmonics,
  type HarmonicSpectrum,
} from "@/lib/bench/harmonics";
import { harmonicCurrent } from "./waveforms";

describe("IEC 61000-3-2 limits", () => {
  // IEC 61000-3-2 Class A, Table 1 (seen: GOST R 51317.3.2, adoption of IEC 61000-3-2; REFERENCES.md §4).
  it("gives the Class A limit table", () => {
    const table: [number, number][] = [
      [2, 1.08],
      [3, 2.3],
      [4, 0.43],
      [5, 1.14],
      [6, 0.3],
      [7, 0.77],
      [8, 0.23],
      [9, 0.4],
      [10, 0.184],
      [11, 0.33],
      [13, 0.21],
      [15, 0.15],
      [16, 0.115],
      [21, 0.15 * (15 / 21)],
      [39, 0.15 * (15 / 39)],
      [40, 0.046],
    ];
    for (const [order, amps] of table) expect(classALimitAmps(order)).toBeCloseTo(amps, 12);
    expect(() => classALimitAmps(1)).toThrow(/orders 2 to 40/);
    expect(() => classALimitAmps(41)).toThrow(/orders 2 to 40/);
  });

  // IEC 61000-3-2: Class B = Class A × 1.5 (seen; REFERENCES.md §4).
  it("makes Class B one and a half times Class A", () => {
    for (let order = 2; order <= 40; order++) expect(harmonicLimitAmps(order, "B")).toBeCloseTo(1.5 * classALimitAmps(order), 12);
  });

  // IEC 61000-4-7 (from memory): 10-cycle windows on 50 Hz, 12-cycle windows on 60 Hz.
  it("measures over 10 cycles at 50 Hz and 12 at 60 Hz", () => {
    expect(harmonicWindowCycles(49.8)).toBe(10);
    expect(harmonicWindowCycles(60.1)).toBe(12);
  });
});

/**
 * The reference: each window of exactly 10 cycles resampled (linear
 * interpolation) to 4096 points, a power of two, and transformed with fft.js,
 * a general-purpose FFT from the registry; bin 10·h is harmonic h.
 */
function fftReference(signal: Float64Array, sampleRateHz: number, frequencyHz: number, windows: number): Float64Array {
  const points = 4096;
  const fft = new FFT(points);
  const length = (10 * sampleRateHz) / frequencyHz;
  const rms = new Float64Array(41);
  const input = new Array<number>(points);
  const output = fft.createComplexArray() as number[];
  for (let window = 0; window < windows; window++) {
    for (let m = 0; m < points; m++) {
      const at = window * length + (m * length) / points;
      const k = Math.floor(at);
      const fraction = at - k;
      input[m] = (signal[k] as number) * (1 - fraction) + (signal[k + 1] as number) * fraction;
    }
    fft.realTransform(output, input);
    for (let order = 1; order <= 40; order++) {
      const re = output[2 * 10 * order] as number;
      const im = output[2 * 10 * order + 1] as number;
      rms[order] = (rms[order] as number) + (Math.SQRT2 * Math.hypot(re, im)) / points / windows;
    }
  }
  return rms;
}

describe("harmonic currents", () => {
  const mains = { frequencyHz: 49.8, sampleRateHz: 20_000, seconds: 1 };
  const content = { 1: 5, 2: 0.05, 3: 0.8, 5: 0.3, 7: 0.12, 9: 0.04 };
  const current = harmonicCurrent(mains, content, { 1: 0.3, 2: 1, 3: 2.1, 5: -0.7, 7: 0.2, 9: 3 });
  const spectrum = measureHarmonics({ current, sampleRateHz: mains.sampleRateHz, frequencyHz: mains.frequencyHz, startSample: 0 });

  it("lays whole 10-cycle windows end to end", () => {
    expect(mains.sampleRateHz / mains.frequencyHz % 1).not.toBe(0);
    expect(spectrum.windowCycles).toBe(10);
    expect(spectrum.windows).toBe(4);
  });

  // Issue 3: at 49.8 Hz with a non-integer number of samples per cycle, the harmonics match a general-purpose FFT (fft.js) within 1 %.
  it("matches fft.js on windows resampled to a power of two, within 1 %", () => {
    const reference = fftReference(current, mains.sampleRateHz, mains.frequencyHz, spectrum.windows);
    for (const order of [1, 2, 3, 5, 7, 9]) {
      const ours = spectrum.amps[order] as number;
      expect(Math.abs(ours / (reference[order] as number) - 1)).toBeLessThan(0.01);
    }
    for (const order of [4, 6, 8, 10, 20, 40]) {
      expect(Math.abs((spectrum.amps[order] as number) - (reference[order] as number))).toBeLessThan(0.01 * 0.04);
    }
  });

  it("reads the known harmonic currents", () => {
    for (const [order, rms] of Object.entries(content)) expect(spectrum.amps[Number(order)]).toBeCloseTo(rms, 5);
    expect(spectrum.amps[4]).toBeLessThan(1e-6);
  });

  it("needs windows synchronised to the measured frequency: the nominal leaks the fundamental into other orders", () => {
    const sine = harmonicCurrent(mains, { 1: 5 });
    const synchronised = measureHarmonics({ current: sine, sampleRateHz: mains.sampleRateHz, frequencyHz: 49.8, startSample: 0 });
    const nominal = measureHarmonics({ current: sine, sampleRateHz: mains.sampleRateHz, frequencyHz: 50, startSample: 0 });
    expect(synchronised.amps[2]).toBeLessThan(5e-6);
    expect(nominal.amps[2]).toBeGreaterThan(5e-3);
  });

  // REFERENCES.md §4 (seen): THD = √Σ_{n=2..40} (I_n / I_1)².
  it("gives THD over orders 2 to 40", () => {
    const report = assessHarmonics({
      spectrum,
      harmonicClass: "A",
      nominalVoltage: 230,
      powerW: 1000,
      powerIsRated: true,
      currentRmsWhileConducting: 5,
    });
    const expected = (100 * Math.hypot(0.05, 0.8, 0.3, 0.12, 0.04)) / 5;
    expect(report.thdPercent).toBeCloseTo(expected, 4);
    expect(report.indicative).toBe(true);
    expect(report.method).toMatch(/components \(not groups\)/);
    expect(report.orders).toHaveLength(39);
    expect(report.status).toBe("within limits");
  });
});

describe("applying the limits", () => {
  const spectrum: HarmonicSpectrum = {
    windowCycles: 10,
    windows: 1,
    amps: Float64Array.from({ length: 41 }, (_, order) => (order === 1 ? 10 : order === 3 ? 3 : 0)),
    maxAmps: new Float64Array(41),
  };
  const base = { spectrum, harmonicClass: "A" as const, nominalVoltage: 230, powerW: 2000, powerIsRated: true, currentRmsWhileConducting: 9 };

  it("marks an order above its Class A limit, and within the larger Class B limit", () => {
    const classA = assessHarmonics(base);
    expect(classA.status).toBe("above limits");
    expect(classA.orders.find((order) => order.order === 3)).toMatchObject({ amps: 3, limitAmps: 2.3, withinLimit: false });
    expect(assessHarmonics({ ...base, harmonicClass: "B" }).status).toBe("within limits");
  });

  // IEC 61000-3-2 scope as issue 3 states it (from memory, not in REFERENCES.md): no limits at 75 W or less, nor outside 220–240 V.
  it("is not applicable at 75 W or less, outside 220–240 V, or above 16 A", () => {
    const small = assessHarmonics({ ...base, powerW: 75 });
    expect(small).toMatchObject({ applicable: false, status: "not applicable" });
    expect(small.notApplicableReason).toBe("no limits at a rated power of 75 W or less (75.0 W)");
    expect(small.orders.every((order) => order.limitAmps === null && order.withinLimit === null)).toBe(true);
    expect(assessHarmonics({ ...base, nominalVoltage: 120 }).notApplicableReason).toBe(
      "IEC 61000-3-2 sets limits for 220–240 V supplies; this one is 120 V",
    );
    // IEC 61000-3-12 above 16 A per phase: from memory.
    expect(assessHarmonics({ ...base, currentRmsWhileConducting: 17 }).notApplicableReason).toMatch(/IEC 61000-3-12/);
  });
});

import { describe, expect, it } from "vitest";
import { analyzeSamples, type AnalysisOptions } from "@/lib/bench/analysis";
import { findZeroCrossings, firstOutside, frequencyFromCrossings, halfCycleBoundaries, measureMainsFrequency } from "@/lib/bench/electrical";
import { addNoise, burstFire, harmonicCurrent, mainsVoltage, switchedResistor, type Mains } from "./waveforms";

function analyse(mains: Mains, current: Float64Array, voltage: Float64Array | null, options: AnalysisOptions = {}) {
  return analyzeSamples({ current, voltage, sampleRateHz: mains.sampleRateHz }, options);
}

describe("whole-record figures", () => {
  // REFERENCES.md §7 (seen): RMS over whole cycles; crest factor = peak/RMS, √2 for a sine.
  it("a sine's true RMS is its peak / √2 and its crest factor √2", () => {
    const mains = { frequencyHz: 49.8, sampleRateHz: 10_000, seconds: 1 };
    const result = analyse(mains, harmonicCurrent(mains, { 1: 10 / Math.SQRT2 }), null);
    expect(result.current.peak).toBeCloseTo(10, 3);
    expect(result.current.rms).toBeCloseTo(result.current.peak / Math.SQRT2, 4);
    expect(result.current.crestFactor).toBeCloseTo(Math.SQRT2, 3);
    expect(result.current.dc).toBeCloseTo(0, 5);
  });

  // REFERENCES.md §7 (seen): P = mean of v·i, S = Vrms·Irms, PF = P/S.
  it("real power, apparent power and power factor follow their definitions", () => {
    const mains = { frequencyHz: 50, sampleRateHz: 10_000, seconds: 1 };
    const voltage = mainsVoltage(mains, 230);
    const resistive = analyse(mains, switchedResistor(mains, voltage, 52.9, () => true), voltage);
    expect(resistive.power?.real).toBeCloseTo((230 * 230) / 52.9, 3);
    expect(resistive.power?.apparent).toBeCloseTo((230 * 230) / 52.9, 3);
    expect(resistive.power?.factor).toBeCloseTo(1, 9);
    expect(resistive.voltage?.rms).toBeCloseTo(230, 6);
    expect(resistive.voltage?.peak).toBeCloseTo(230 * Math.SQRT2, 1);

    // 4 A lagging the voltage by 30°: P = U·I·cos 30°.
    const lagging = harmonicCurrent(mains, { 1: 4 }, { 1: -Math.PI / 6 });
    const result = analyse(mains, lagging, voltage);
    expect(result.power?.factor).toBeCloseTo(Math.cos(Math.PI / 6), 6);
    expect(result.power?.real).toBeCloseTo(230 * 4 * Math.cos(Math.PI / 6), 3);
    expect(result.power?.apparent).toBeCloseTo(230 * 4, 3);
  });

  it("warns when the measured supply is far from the nominal", () => {
    const mains = { frequencyHz: 60, sampleRateHz: 12_000, seconds: 0.5 };
    const voltage = mainsVoltage(mains, 120);
    const result = analyse(mains, switchedResistor(mains, voltage, 14.4, () => true), voltage, { nominalFrequencyHz: 60 });
    expect(result.warnings).toContain("measured supply 120 V is more than 10 % from the nominal 230 V: check the nominal voltage");
  });

  it("flags negative real power as a reversed probe", () => {
    const mains = { frequencyHz: 50, sampleRateHz: 10_000, seconds: 0.5 };
    const voltage = mainsVoltage(mains, 230);
    const reversed = switchedResistor(mains, voltage, -52.9, () => true);
    expect(analyse(mains, reversed, voltage).warnings.join(" ")).toMatch(/negative real power/);
  });
});

describe("mains frequency", () => {
  it("comes from the voltage's zero crossings, noise and all", () => {
    const mains = { frequencyHz: 49.8, sampleRateHz: 10_000, seconds: 2 };
    const voltage = addNoise(mainsVoltage(mains, 230, 0.4), 3);
    const result = measureMainsFrequency({ current: new Float64Array(voltage.length), voltage, sampleRateHz: 10_000, nominalHz: 50 });
    expect(result.source).toBe("voltage");
    expect(result.frequencyHz).toBeCloseTo(49.8, 3);
  });

  it("comes from the current's zero crossings while it conducts when there is no voltage channel", () => {
    const mains = { frequencyHz: 50.3, sampleRateHz: 10_000, seconds: 3 };
    const voltage = mainsVoltage(mains, 230);
    const current = addNoise(switchedResistor(mains, voltage, 52.9, burstFire(3, 17)), 0.01);
    const result = analyse(mains, current, null);
    expect(result.frequencySource).toBe("current");
    expect(result.frequencyHz).toBeCloseTo(50.3, 3);
  });

  it("falls back to the nominal when nothing crosses zero, and says so", () => {
    const mains = { frequencyHz: 50, sampleRateHz: 10_000, seconds: 0.5 };
    const result = analyse(mains, new Float64Array(5000), null, { nominalVoltage: 230 });
    expect(result.frequencySource).toBe("nominal");
    expect(result.frequencyHz).toBe(50);
    expect(result.warnings[0]).toMatch(/nominal 50 Hz is used/);
    expect(result.halfCycles.firing).toBe("none");
  });

  it("counts the cycles of an off gap rather than taking it for one long cycle", () => {
    // Rising crossings at 0, 200, 400 samples, then 20 cycles off, then 4400, 4600.
    const crossings = { positions: [0, 200, 400, 4400, 4600], directions: [1, 1, 1, 1, 1] };
    expect(frequencyFromCrossings(crossings, 10_000)).toBeCloseTo(50, 9);
  });

  it("finds the same crossings in two parts, split after any sample outside the band, as in one scan", () => {
    const mains = { frequencyHz: 49.9, sampleRateHz: 10_000, seconds: 2 };
    const voltage = addNoise(mainsVoltage(mains, 230), 20);
    // A burst-fired current rests at zero between bursts, so the scan's rest rule comes into play.
    const current = addNoise(switchedResistor(mains, voltage, 52.9, burstFire(3, 2)), 0.2);
    for (const [signal, threshold] of [[voltage, 32.5], [current, 0.6]] as const) {
      const whole = findZeroCrossings(signal, threshold, 25);
      expect(whole.positions.length).toBeGreaterThan(100);
      for (let from = 101; from < signal.length; from += 1_999) {
        const split = firstOutside(signal, threshold, from)!;
        const earlier = findZeroCrossings(signal, threshold, 25, -1, split + 1);
        const later = findZeroCrossings(signal, threshold, 25, split);
        expect([...earlier.positions, ...later.positions]).toEqual(whole.positions);
        expect([...earlier.directions, ...later.directions]).toEqual(whole.directions);
      }
    }
  });

  it("measures the same frequency from the same crossings with the later half scanned apart", () => {
    const mains = { frequencyHz: 50.03, sampleRateHz: 10_000, seconds: 3 };
    const voltage = addNoise(mainsVoltage(mains, 230), 5);
    const current = switchedResistor(mains, voltage, 52.9, burstFire(2, 3));
    const scans: number[] = [];
    const scanAfter = (signal: Float64Array, threshold: number, restSamples: number, after: number) => {
      scans.push(after);
      const found = findZeroCrossings(signal, threshold, restSamples, after);
      return () => found;
    };
    for (const signals of [{ current, voltage }, { current, voltage: null }]) {
      const alone = measureMainsFrequency({ ...signals, sampleRateHz: 10_000, nominalHz: 50 });
      const shared = measureMainsFrequency({ ...signals, sampleRateHz: 10_000, nominalHz: 50, scanAfter });
      expect(shared).toEqual(alone);
    }
    expect(scans.length).toBe(2);
    expect(scans.every((after) => after >= voltage.length / 2)).toBe(true);
  });

  it("makes no crossings from noise inside the hysteresis band", () => {
    const noise = addNoise(new Float64Array(10_000), 0.05);
    expect(findZeroCrossings(noise, 0.1).positions).toEqual([]);
  });

  // Common practice, no source: 50 Hz → 20 ms a cycle.
  it("puts half-cycle boundaries 10 ms apart at 50 Hz, two to each 20 ms cycle", () => {
    const mains = { frequencyHz: 50, sampleRateHz: 10_000, seconds: 0.2 };
    const voltage = mainsVoltage(mains, 230, 1);
    const crossings = findZeroCrossings(voltage, 30);
    const boundaries = halfCycleBoundaries(crossings, 10_000, 50, voltage.length);
    const spacings = Array.from(boundaries.subarray(1), (boundary, j) => (boundary - (boundaries[j] as number)) / 10_000);
    for (const spacing of spacings) expect(spacing).toBeCloseTo(0.01, 9);
    expect((spacings[0] ?? 0) + (spacings[1] ?? 0)).toBeCloseTo(0.02, 9);
  });
});

describe("trade check values (common practice, no source)", () => {
  const mains = { frequencyHz: 50, sampleRateHz: 10_000, seconds: 1 };

  // Common practice, no source: 4.5 A RMS at 240 V into a heater ≈ 1080 W.
  it("4.5 A at 240 V into a heater is about 1080 W, measured or estimated", () => {
    const voltage = mainsVoltage(mains, 240);
    const current = switchedResistor(mains, voltage, 240 / 4.5, () => true);
    expect(analyse(mains, current, voltage).power?.real).toBeCloseTo(1080, 0);
    const estimated = analyse(mains, current, null, { nominalVoltage: 240 }).estimatedPower;
    expect(estimated?.whileConducting).toBeCloseTo(1080, 0);
  });

  // Common practice, no source: 2.6 A at 240 V ≈ 620 W, below a 700 W rating.
  it("2.6 A at 240 V is about 620 W, below a 700 W rating", () => {
    const current = switchedResistor(mains, mainsVoltage(mains, 240), 240 / 2.6, () => true);
    const result = analyse(mains, current, null, { nominalVoltage: 240, rating: { ratedPowerW: 700, ratedVoltage: 240 } });
    expect(Math.abs((result.estimatedPower?.whileConducting ?? 0) / 620 - 1)).toBeLessThan(0.01);
    expect(result.verdict?.result).toBe("below rating");
  });

  // Common practice, no source: a 700 W rating at 240 V ≈ 2.9 A.
  it("a 700 W heater at 240 V draws about 2.9 A", () => {
    const voltage = mainsVoltage(mains, 240);
    const current = switchedResistor(mains, voltage, (240 * 240) / 700, () => true);
    expect(Math.abs(analyse(mains, current, voltage).current.rms / 2.9 - 1)).toBeLessThan(0.01);
  });
});

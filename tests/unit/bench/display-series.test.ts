import { describe, expect, it } from "vitest";
import { analyzeSamples } from "@/lib/bench/analysis";
import { halfCycleSeries, thinSeries, waveformEnvelope } from "@/lib/bench/display-series";
import { burstFire, mainsVoltage, switchedResistor } from "./waveforms";

const mains = { frequencyHz: 50, sampleRateHz: 10_000, seconds: 1 };
const voltage = mainsVoltage(mains, 230);
const current = switchedResistor(mains, voltage, 75, burstFire(3, 2));

describe("waveformEnvelope", () => {
  it("keeps every peak of a long capture in a fixed number of points", () => {
    const envelope = waveformEnvelope({ current, voltage, sampleRateHz: mains.sampleRateHz, points: 200 });
    expect(envelope.timeS).toHaveLength(200);
    expect(envelope.current).toHaveLength(200);
    expect(Math.max(...envelope.current)).toBe(Math.max(...current));
    expect(Math.min(...envelope.voltage!)).toBe(Math.min(...voltage));
    expect(envelope.timeS).toEqual([...envelope.timeS].sort((a, b) => a - b));
  });

  it("passes a short capture through whole", () => {
    const envelope = waveformEnvelope({ current: current.subarray(0, 50), voltage: null, sampleRateHz: 10_000 });
    expect(envelope.current).toEqual(Array.from(current.subarray(0, 50)));
    expect(envelope.voltage).toBeNull();
    expect(envelope.timeS[49]).toBeCloseTo(0.0049, 10);
  });
});

describe("halfCycleSeries", () => {
  it("finds the half-cycles and the conduction the analysis reports", () => {
    const analysis = analyzeSamples({ current, voltage, sampleRateHz: mains.sampleRateHz }, { nominalVoltage: 230 });
    const series = halfCycleSeries({ current, voltage, sampleRateHz: mains.sampleRateHz, nominalHz: 50 });
    expect(series.halfCycleSeconds).toBeCloseTo(0.01, 6);
    expect(series.conducting).toHaveLength(analysis.halfCycles.count);
    expect(series.conducting.map((on) => (on ? "1" : "0")).join("")).toBe(analysis.halfCycles.conductionMap);
    expect(Math.max(...series.rmsCurrent)).toBeCloseTo(230 / 75, 2);
  });

  it("shows at most the first half-cycles asked for", () => {
    expect(halfCycleSeries({ current, voltage, sampleRateHz: mains.sampleRateHz, nominalHz: 50, maxHalfCycles: 10 }).rmsCurrent).toHaveLength(10);
  });
});

describe("thinSeries", () => {
  it("takes every k-th value and always the last", () => {
    expect(thinSeries(Array.from({ length: 10 }, (_, k) => k), 4)).toEqual([0, 3, 6, 9]);
    expect(thinSeries(Array.from({ length: 11 }, (_, k) => k), 4)).toEqual([0, 3, 6, 9, 10]);
    expect(thinSeries([1, 2], 4)).toEqual([1, 2]);
  });
});

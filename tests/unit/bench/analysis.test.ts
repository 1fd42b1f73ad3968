import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { ANALYSIS_VERSION, analyzeCapture, analyzeSamples } from "@/lib/bench/analysis";
import { burstFire, mainsVoltage, switchedResistor } from "./waveforms";

const fixtures = join(import.meta.dirname, "../../fixtures/captures");
const hotAir = join(fixtures, "orrery-orm42-hot-air.csv");
const hotAirOptions = {
  current: { column: "CH1", scale: 10 },
  voltage: { column: "CH2", scale: 1 },
  rating: { ratedPowerW: 600, ratedVoltage: 230, currentAccuracy: "1.5%+0.05", voltageAccuracy: "0.5%+0.2", rule: "guarded" as const },
};

describe("analyzeCapture", () => {
  it("produces the documented object", async () => {
    const result = await analyzeCapture({ path: hotAir }, hotAirOptions);
    expect(result.analysisVersion).toBe(ANALYSIS_VERSION);
    expect(ANALYSIS_VERSION).toMatch(/^\d+\.\d+\.\d+$/);
    expect(result.frequencyHz).toBeCloseTo(49.9, 2);
    expect(result.frequencySource).toBe("voltage");
    expect(result.sampleRateHz).toBeCloseTo(5000, 6);
    expect(Object.keys(result.current).sort()).toEqual(["crestFactor", "dc", "peak", "rms"]);
    expect(result.voltage?.rms).toBeCloseTo(230, 0);
    expect(result.power).toMatchObject({ real: expect.any(Number), apparent: expect.any(Number), factor: expect.any(Number) });
    expect(result.power?.whileConducting).toBeCloseTo(600, -1);
    expect(result.estimatedPower).toBeNull();
    expect(result.halfCycles).toMatchObject({ firing: "whole-cycle", asymmetric: false });
    expect(result.halfCycles.duty).toBeGreaterThan(0.5);
    expect(result.harmonics.orders[0]).toMatchObject({ order: 2, amps: expect.any(Number), limitAmps: 1.08 });
    expect(result.harmonics.thdPercent).toBeLessThan(1);
    // 0.25 s of capture is too short to estimate flicker; the reason is given instead.
    expect(result.flicker).toBeNull();
    expect(result.flickerUnavailableReason).toMatch(/at least 1 s/);
    expect(result.verdict).toMatchObject({
      rated: 600,
      rule: "guarded",
      lower: 540,
      upper: 630,
      result: "meets rating",
    });
    for (const field of ["measured", "normalized", "acceptanceLower", "acceptanceUpper", "expandedUncertainty"] as const) {
      expect(result.verdict?.[field]).toEqual(expect.any(Number));
    }
    expect(JSON.parse(JSON.stringify(result))).toEqual(result);
  });

  it("reads chunks from storage the same way as a file", async () => {
    const bytes = readFileSync(hotAir);
    const chunks = async function* () {
      for (let at = 0; at < bytes.length; at += 1000) yield bytes.subarray(at, at + 1000);
    };
    const fromChunks = await analyzeCapture({ data: chunks(), sizeBytes: bytes.length }, hotAirOptions);
    expect(fromChunks).toEqual(await analyzeCapture({ path: hotAir }, hotAirOptions));
  });

  it("without a voltage channel leaves voltage, power and power factor null and labels the estimate", async () => {
    const result = await analyzeCapture({ path: join(fixtures, "tallowmere-tl8-heat-gun.csv") }, { current: { column: "Clamp A", scale: 10 } });
    expect(result.voltage).toBeNull();
    expect(result.power).toBeNull();
    expect(result.estimatedPower?.whileConducting).toBeCloseTo(800, -1);
    expect(result.assumptions.join(" ")).toMatch(/Power is estimated \(no voltage channel\)/);
  });

  it("turns away bad options before reading", async () => {
    await expect(analyzeCapture({ path: hotAir }, { current: { column: "CH1", scale: 0 } })).rejects.toThrow(/scale must not be 0/);
  });
});

describe("flicker and verdicts in the analysis", () => {
  const mains = { frequencyHz: 50, sampleRateHz: 5000, seconds: 3 };
  const voltage = mainsVoltage(mains, 230);
  const current = switchedResistor(mains, voltage, (230 * 230) / 1000, burstFire(5, 5));

  // REFERENCES.md §2 (derived): a resistive P watts on the 230 V reference impedance gives d ≈ 0.4·P/230²; 1000 W → 0.756 %.
  it("estimates flicker on the reference impedance with the limits beside it", () => {
    const { flicker } = analyzeSamples({ current, voltage, sampleRateHz: mains.sampleRateHz }, { dmaxLimitPercent: 7 });
    expect(flicker).not.toBeNull();
    expect(Math.abs((flicker?.dmaxPercent ?? 0) / 0.756 - 1)).toBeLessThan(0.02);
    expect(flicker).toMatchObject({ pstLimit: 1, dmaxLimitPercent: 7, dcLimitPercent: 3.3, tmaxLimitSeconds: 0.5 });
  });

  // REFERENCES.md §2 (seen): no reference impedance is defined for 120 V / 60 Hz; the user must give one.
  it("gives no flicker at 120 V without an impedance, and says why", () => {
    const sixty = { frequencyHz: 60, sampleRateHz: 6000, seconds: 2 };
    const volts120 = mainsVoltage(sixty, 120);
    const amps = switchedResistor(sixty, volts120, 14.4, burstFire(3, 3));
    const result = analyzeSamples({ current: amps, voltage: volts120, sampleRateHz: 6000 }, { nominalVoltage: 120 });
    expect(result.nominalFrequencyHz).toBe(60);
    expect(result.harmonics.windowCycles).toBe(12);
    expect(result.flicker).toBeNull();
    expect(result.flickerUnavailableReason).toMatch(/impedance/);
    const given = analyzeSamples({ current: amps, voltage: volts120, sampleRateHz: 6000 }, { nominalVoltage: 120, impedance: { resistanceOhm: 0.3, reactanceOhm: 0.2 } });
    expect(given.flicker?.pst).toEqual(expect.any(Number));
  });

  it("gives no verdict for a tool that never conducted", () => {
    const result = analyzeSamples(
      { current: new Float64Array(voltage.length), voltage, sampleRateHz: mains.sampleRateHz },
      { rating: { ratedPowerW: 1000, ratedVoltage: 230 } },
    );
    expect(result.verdict).toBeNull();
    expect(result.verdictUnavailableReason).toMatch(/never conducted/);
  });
});

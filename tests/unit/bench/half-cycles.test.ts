import { describe, expect, it } from "vitest";
import { analyzeSamples } from "@/lib/bench/analysis";
import { estimatePowerFromCurrent } from "@/lib/bench/half-cycles";
import { addNoise, burstFire, mainsVoltage, switchedResistor } from "./waveforms";

const mains = { frequencyHz: 50, sampleRateHz: 10_000, seconds: 2 };
const ohms = (230 * 230) / 1000;

describe("burst-fire", () => {
  const voltage = mainsVoltage(mains, 230);
  const current = addNoise(switchedResistor(mains, voltage, ohms, burstFire(6, 4)), 0.005);
  const result = analyzeSamples({ current, voltage, sampleRateHz: mains.sampleRateHz }, {});

  it("maps conduction, duty, switchings per minute and the longest off gap", () => {
    const { halfCycles } = result;
    // The record's whole cycles end part-way through a burst, so the duty is near, not at, 6/10.
    expect(Math.abs(halfCycles.duty - 0.6)).toBeLessThan(0.01);
    // Six cycles on, four off; the record may start a half-cycle into the first burst.
    expect(halfCycles.conductionMap).toMatch(/^1{11,12}0{8}(1{12}0{8})+/);
    // An on and an off edge every 10 cycles (0.2 s) makes 600 a minute; a 2 s record holds 19 of its 20.
    expect(halfCycles.switchesPerMinute).toBeGreaterThan(0.95 * 600);
    expect(halfCycles.switchesPerMinute).toBeLessThanOrEqual(600);
    expect(halfCycles.longestOffSeconds).toBeCloseTo(0.08, 6);
    expect(halfCycles.firing).toBe("whole-cycle");
    expect(halfCycles.asymmetric).toBe(false);
    expect(halfCycles.asymmetricNote).toBeNull();
  });

  // Issue 3 and REFERENCES.md §7 definitions (seen): over the record PF = P/S, which for a burst-fired resistor is √duty, not 1.
  it("gives a record power factor of √duty, and the full-demand power while conducting", () => {
    const { power, halfCycles } = result;
    expect(power?.factor).toBeCloseTo(Math.sqrt(halfCycles.duty), 3);
    expect(power?.factor).toBeCloseTo(Math.sqrt(0.6), 2);
    expect(power?.factorWhileConducting).toBeCloseTo(1, 4);
    expect(power?.whileConducting).toBeCloseTo(1000, 0);
    expect(power?.real).toBeCloseTo(1000 * halfCycles.duty, -1);
  });

  it("without a voltage channel estimates the mean as duty × the power while conducting, not nominal voltage × record RMS", () => {
    const estimate = analyzeSamples({ current, voltage: null, sampleRateHz: mains.sampleRateHz }, { nominalVoltage: 230 });
    expect(estimate.voltage).toBeNull();
    expect(estimate.power).toBeNull();
    const estimated = estimate.estimatedPower;
    expect(estimated?.whileConducting).toBeCloseTo(1000, -1);
    expect(estimated?.mean).toBeCloseTo(estimate.halfCycles.duty * 1000, -1);
    expect(estimated?.mean).not.toBeCloseTo(230 * estimate.current.rms, -1);
    expect(estimated?.basis).toMatch(/^estimate, not a measurement/);
  });
});

describe("half-cycle firing", () => {
  const voltage = mainsVoltage(mains, 230);

  it("flags a heater fed through a diode (positive half-cycles only) as asymmetric, with DC and even harmonics", () => {
    const current = switchedResistor(mains, voltage, ohms, (halfCycle) => halfCycle % 2 === 0);
    const result = analyzeSamples({ current, voltage, sampleRateHz: mains.sampleRateHz }, {});
    const peak = (230 * Math.SQRT2) / ohms;
    expect(result.halfCycles.firing).toBe("half-cycle");
    expect(result.halfCycles.asymmetric).toBe(true);
    expect(result.halfCycles.asymmetricNote).toMatch(/IEC 61000-3-2 clause 6\.2/);
    expect(result.halfCycles.negativeConducting).toBe(0);
    // Derived from the Fourier series of a half-wave rectified sine: DC = Î/π, 2nd harmonic amplitude = 2Î/(3π).
    expect(result.current.dc).toBeCloseTo(peak / Math.PI, 3);
    const second = result.harmonics.orders.find((order) => order.order === 2);
    expect(second?.amps).toBeCloseTo((2 * peak) / (3 * Math.PI) / Math.SQRT2, 3);
  });

  it("finds the frequency and the asymmetry of a diode-fed heater from its current alone", () => {
    const current = switchedResistor(mains, voltage, ohms, (halfCycle) => halfCycle % 2 === 0);
    const result = analyzeSamples({ current, voltage: null, sampleRateHz: mains.sampleRateHz }, {});
    expect(result.frequencySource).toBe("current");
    expect(result.frequencyHz).toBeCloseTo(50, 3);
    expect(result.halfCycles).toMatchObject({ firing: "half-cycle", asymmetric: true, negativeConducting: 0 });
    expect(result.halfCycles.duty).toBeCloseTo(0.5, 2);
  });

  it("keeps symmetric half-cycle firing apart from asymmetric control", () => {
    const current = switchedResistor(mains, voltage, ohms, (halfCycle) => halfCycle % 3 === 0);
    const result = analyzeSamples({ current, voltage, sampleRateHz: mains.sampleRateHz }, {});
    expect(result.halfCycles.firing).toBe("half-cycle");
    expect(result.halfCycles.asymmetric).toBe(false);
    expect(result.halfCycles.duty).toBeCloseTo(1 / 3, 2);
  });

  it("reports a steady load as continuous, with no switching", () => {
    const current = switchedResistor(mains, voltage, ohms, () => true);
    const { halfCycles } = analyzeSamples({ current, voltage, sampleRateHz: mains.sampleRateHz }, {});
    expect(halfCycles.firing).toBe("continuous");
    expect(halfCycles.duty).toBe(1);
    expect(halfCycles.switchesPerMinute).toBe(0);
    expect(halfCycles.longestOffSeconds).toBe(0);
  });
});

describe("a tool that never switched on", () => {
  it("reads a clamp's noise as no conduction at all", () => {
    const noise = addNoise(new Float64Array(20_000), 0.004);
    const result = analyzeSamples({ current: noise, voltage: mainsVoltage(mains, 230), sampleRateHz: mains.sampleRateHz }, {});
    expect(result.halfCycles).toMatchObject({ firing: "none", conducting: 0, duty: 0 });
    expect(result.power?.whileConducting).toBeNull();
  });
});

describe("power estimated from current", () => {
  it("takes the load as the resistance that draws the conducting current at the nominal voltage", () => {
    const estimate = estimatePowerFromCurrent({ nominalVoltage: 230, currentRmsWhileConducting: 4, currentRmsRecord: 2 });
    expect(estimate.whileConducting).toBe(920);
    // I_rec² / I_c² = 1/4 is the share of energy: a quarter duty.
    expect(estimate.mean).toBe(230);
    expect(estimate.assumedVoltage).toBe(230);
  });
});

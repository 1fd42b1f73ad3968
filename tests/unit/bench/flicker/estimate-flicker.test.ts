import { describe, expect, it } from "vitest";
import { analyticalPst } from "@/lib/bench/flicker/analytical";
import {
  estimateFlicker,
  referenceImpedance,
  type FlickerInput,
  type FlickerResult,
  type FlickerUnavailable,
} from "@/lib/bench/flicker";
import { burstFiredHeaterCurrent, type BurstFiredHeater } from "./test-signals";

const REFERENCE_R = 0.4;

/** Whole-cycle interval lengths that average exactly `changesPerMinute` over `cyclesPerRepeat` cycles. */
function burstPattern(changesPerMinute: number, supplyHz: number, cyclesPerRepeat: number): number[] {
  const changes = Math.round((changesPerMinute * cyclesPerRepeat) / (60 * supplyHz));
  return Array.from(
    { length: changes },
    (_, k) => Math.round(((k + 1) * cyclesPerRepeat) / changes) - Math.round((k * cyclesPerRepeat) / changes),
  );
}

/**
 * Heater power whose current steps the point-of-connection voltage by `dPercent` on a resistance R:
 * d ≈ R·P/U² (REFERENCES.md §2, derived: 1000 W on the 230 V reference impedance → 0.756 %).
 */
function wattsForD(dPercent: number, nominalVoltage: number, resistanceOhm: number): number {
  return ((dPercent / 100) * nominalVoltage ** 2) / resistanceOhm;
}

function heater(h: Omit<BurstFiredHeater, "sampleRateHz"> & { sampleRateHz?: number }) {
  return burstFiredHeaterCurrent({ sampleRateHz: 10_000, ...h });
}

function estimate(current: Float64Array, overrides: Partial<FlickerInput> = {}): FlickerResult {
  const result = estimateFlicker({
    current,
    sampleRateHz: 10_000,
    frequencyHz: 50,
    nominalVoltage: 230,
    lamp: 230,
    impedance: null,
    dmaxLimitPercent: 4,
    ...overrides,
  });
  if (result.pst === null) throw new Error(`flicker unavailable: ${result.reason}`);
  return result;
}

describe("referenceImpedance (IEC 61000-3-3 / IEC TR 60725, single-phase loop)", () => {
  it("is 0.4 + j0.25 Ω on 230 V, 50 Hz", () => {
    expect(referenceImpedance(230, 50)).toEqual({ resistanceOhm: 0.4, reactanceOhm: 0.25 });
    expect(referenceImpedance(240, 49.9)).toEqual({ resistanceOhm: 0.4, reactanceOhm: 0.25 });
  });

  it("is not defined for 120 V or 60 Hz supplies", () => {
    expect(referenceImpedance(120, 60)).toBeNull();
    expect(referenceImpedance(230, 60)).toBeNull();
  });
});

describe("burst-fired 1000 W heater on the 230 V reference impedance", () => {
  // 39 changes/min in whole cycles: 26 on/off intervals of 76–77 cycles every 2000 cycles.
  const pattern = burstPattern(39, 50, 2000);
  const current = heater({ watts: 1000, nominalVoltage: 230, supplyHz: 50, intervalCycles: pattern, cycles: 4000, noiseAmps: 0.01 });
  const result = estimate(current);

  it("steps the voltage by d ≈ 0.756 % (REFERENCES.md §2, derived), within 1 %", () => {
    expect(Math.abs(result.dmaxPercent / 0.756 - 1)).toBeLessThan(0.01);
    // Each level lasts over 1 s, so each is a steady state and dc is the same step.
    expect(Math.abs(result.dcPercent / 0.756 - 1)).toBeLessThan(0.01);
    expect(result.tmaxSeconds).toBe(0);
    // The partial half-cycle before the first zero crossing is dropped: 52 changes in 79.99 s.
    expect(result.changesPerMinute).toBeCloseTo(39, 1);
  });

  it("gives Pst within 5 % of IEC 61000-4-15:2010 Table 5 (230 V, 39/min: ΔV/V = 0.894 % for Pst = 1), scaled by d", () => {
    // Pinst grows with (ΔV/V)² and Pst with its square root, so Pst = d / 0.894 %.
    const expected = result.dmaxPercent / 0.894;
    expect(Math.abs(result.pst / expected - 1)).toBeLessThan(0.05);
  });

  it("states the limits, the impedance and its assumptions", () => {
    expect(result).toMatchObject({
      pstLimit: 1,
      dcLimitPercent: 3.3,
      dmaxLimitPercent: 4,
      tmaxLimitSeconds: 0.5,
      impedance: { resistanceOhm: 0.4, reactanceOhm: 0.25, source: "IEC 61000-3-3 reference" },
    });
    expect(result.assumptions.join(" ")).toMatch(/repeated end to end/);
  });
});

// IEC 61000-4-15:2010 Table 5 rows reproduced through the whole chain: the heater power is chosen
// so that d matches the row's ΔV/V (d = R·P/U², REFERENCES.md §2), so the row's Pst is 1.
describe("burst-fired heater sized to a Table 5 row reads Pst = 1 within 5 %", () => {
  it.each([
    { changesPerMinute: 1, deltaVOverV: 2.715, cyclesPerRepeat: 6000 },
    { changesPerMinute: 2, deltaVOverV: 2.191, cyclesPerRepeat: 3000 },
    { changesPerMinute: 7, deltaVOverV: 1.45, cyclesPerRepeat: 6000 },
    { changesPerMinute: 39, deltaVOverV: 0.894, cyclesPerRepeat: 2000 },
    { changesPerMinute: 110, deltaVOverV: 0.722, cyclesPerRepeat: 600 },
  ])("230 V lamp, 50 Hz, $changesPerMinute changes/min at d = $deltaVOverV %", ({ changesPerMinute, deltaVOverV, cyclesPerRepeat }) => {
    const current = heater({
      watts: wattsForD(deltaVOverV, 230, REFERENCE_R),
      nominalVoltage: 230,
      supplyHz: 50,
      intervalCycles: burstPattern(changesPerMinute, 50, cyclesPerRepeat),
      // Whole repeats of the pattern, so the capture repeated end to end keeps the row's rhythm.
      cycles: cyclesPerRepeat * Math.ceil(2000 / cyclesPerRepeat),
    });
    const result = estimate(current);
    expect(Math.abs(result.dmaxPercent / deltaVOverV - 1)).toBeLessThan(0.01);
    expect(Math.abs(result.pst - 1)).toBeLessThan(0.05);
  });

  it("120 V lamp, 60 Hz, 39 changes/min at d = 1.040 % (Table 5, 120 V 2010 column) with a user impedance", () => {
    const impedance = { resistanceOhm: 0.4, reactanceOhm: 0.25 };
    const current = heater({
      watts: wattsForD(1.04, 120, impedance.resistanceOhm),
      nominalVoltage: 120,
      supplyHz: 60,
      intervalCycles: burstPattern(39, 60, 2400),
      cycles: 2400,
    });
    const result = estimate(current, { frequencyHz: 60, nominalVoltage: 120, lamp: 120, impedance });
    expect(Math.abs(result.pst - 1)).toBeLessThan(0.05);
    expect(result.impedance.source).toBe("user");
    expect(result.assumptions.join(" ")).toMatch(/limits are shown for comparison/);
  });
});

describe("voltage change characteristics (IEC 61000-3-3 definitions)", () => {
  it("has no steady state and so no dc when the levels last under 1 s (110 changes/min)", () => {
    const current = heater({ watts: 1000, nominalVoltage: 230, supplyHz: 50, intervalCycles: burstPattern(110, 50, 600), cycles: 1200 });
    const result = estimate(current);
    expect(result.dcPercent).toBe(0);
    expect(Math.abs(result.dmaxPercent / 0.756 - 1)).toBeLessThan(0.01);
  });

  it("times a dip beyond 3.3 % (Tmax) between two steady states", () => {
    // 20 A for 30 cycles every 30 s: 0.4 Ω · 20 A / 230 V = 3.48 % for 0.6 s.
    const current = heater({ watts: 20 * 230, nominalVoltage: 230, supplyHz: 50, intervalCycles: [30, 1470], cycles: 3000 });
    const result = estimate(current);
    expect(result.tmaxSeconds).toBeCloseTo(0.6, 2);
    expect(result.dmaxPercent).toBeCloseTo(3.478, 1);
    expect(result.dcPercent).toBeLessThan(0.01);
  });

  it("reports dc for a load that changes the steady-state voltage", () => {
    // 5000 W switched once a minute: d = 0.4 · 5000 / 230² = 3.78 %, above the 3.3 % dc limit.
    const current = heater({ watts: 5000, nominalVoltage: 230, supplyHz: 50, intervalCycles: [3000, 3000], cycles: 6000, sampleRateHz: 5000 });
    const result = estimate(current, { sampleRateHz: 5000 });
    expect(result.dcPercent).toBeCloseTo(3.78, 1);
    expect(result.tmaxSeconds).toBe(0);
  });

  it("reads no flicker from a steady load", () => {
    const current = heater({ watts: 1000, nominalVoltage: 230, supplyHz: 50, intervalCycles: [500], cycles: 500 });
    const result = estimate(current);
    expect(result.pst).toBeLessThan(0.01);
    expect(result.dcPercent).toBe(0);
    expect(result.changesPerMinute).toBe(0);
    expect(result.analytical).toBeNull();
  });

  it("does not depend on a small error in the measured frequency", () => {
    const current = heater({ watts: 1000, nominalVoltage: 230, supplyHz: 50, intervalCycles: burstPattern(39, 50, 2000), cycles: 2000 });
    const exact = estimate(current);
    const off = estimate(current, { frequencyHz: 50.01 });
    expect(Math.abs(off.dmaxPercent / exact.dmaxPercent - 1)).toBeLessThan(0.002);
    expect(Math.abs(off.pst / exact.pst - 1)).toBeLessThan(0.01);
  });
});

describe("IEC 61000-3-3 analytical method", () => {
  it("follows t_f = 2.3·d^3.2 and Pst = (Σt_f / 600)^(1/3.2)", () => {
    // 10 steps of 2 % in 10 minutes: Σt_f = 10 · 2.3 · 2^3.2 = 10 · 2.3 · 9.1896 = 211.36 s
    // → Pst = (211.36 / 600)^(1/3.2) = 0.35227^0.3125 = 0.72177.
    expect(analyticalPst(2, 1)).toBeCloseTo(0.72177, 4);
  });

  // REFERENCES.md §2 (derived): within ±4 % of the flickermeter table up to about 40 changes/min,
  // reading 1.13 at 110/min and 1.48 at 1620/min.
  it.each([
    { changesPerMinute: 1, deltaVOverV: 2.715 },
    { changesPerMinute: 2, deltaVOverV: 2.191 },
    { changesPerMinute: 7, deltaVOverV: 1.45 },
    { changesPerMinute: 39, deltaVOverV: 0.894 },
  ])("agrees with Table 5 (Pst = 1) within 4 % at $changesPerMinute changes/min", ({ changesPerMinute, deltaVOverV }) => {
    expect(Math.abs(analyticalPst(deltaVOverV, changesPerMinute) - 1)).toBeLessThan(0.04);
  });

  it("drifts high beyond 40 changes/min", () => {
    expect(analyticalPst(0.722, 110)).toBeCloseTo(1.13, 2);
    expect(analyticalPst(0.407, 1620)).toBeCloseTo(1.48, 2);
  });

  // Against Table 5 itself the method reads 0.980, 0.982, 0.961 and 1.014 at 1, 2, 7 and 39/min
  // (above). At 7/min that leaves 0.1 % of the 4 % for the flickermeter's own error, so there the
  // bound is widened by the 0.5 % this meter may read above Table 5 (it reads +0.35 % on that row).
  it.each([
    { changesPerMinute: 1, cyclesPerRepeat: 6000, tolerance: 0.04 },
    { changesPerMinute: 2, cyclesPerRepeat: 3000, tolerance: 0.04 },
    { changesPerMinute: 7, cyclesPerRepeat: 6000, tolerance: 0.045 },
    { changesPerMinute: 39, cyclesPerRepeat: 2000, tolerance: 0.04 },
  ])(
    "is valid for rectangular switching at $changesPerMinute/min and agrees with the flickermeter within $tolerance",
    ({ changesPerMinute, cyclesPerRepeat, tolerance }) => {
      const current = heater({
        watts: 1000,
        nominalVoltage: 230,
        supplyHz: 50,
        intervalCycles: burstPattern(changesPerMinute, 50, cyclesPerRepeat),
        cycles: cyclesPerRepeat,
      });
      const result = estimate(current);
      expect(result.analytical?.valid).toBe(true);
      expect(Math.abs(result.analytical!.pst / result.pst - 1)).toBeLessThan(tolerance);
    },
  );

  it("is returned but marked invalid above 40 changes/min", () => {
    const current = heater({ watts: 1000, nominalVoltage: 230, supplyHz: 50, intervalCycles: burstPattern(110, 50, 600), cycles: 1200 });
    const analytical = estimate(current).analytical;
    expect(analytical?.valid).toBe(false);
    expect(analytical?.note).toMatch(/above the 40\/min/);
  });

  it("is marked invalid when the voltage does not switch between two levels", () => {
    const a = heater({ watts: 1000, nominalVoltage: 230, supplyHz: 50, intervalCycles: [200, 200], cycles: 2000 });
    const b = heater({ watts: 500, nominalVoltage: 230, supplyHz: 50, intervalCycles: [130, 130], cycles: 2000 });
    const analytical = estimate(a.map((x, n) => x + b[n]!)).analytical;
    expect(analytical?.valid).toBe(false);
    expect(analytical?.note).toMatch(/not rectangular/);
  });
});

describe("flicker unavailable", () => {
  const current = heater({ watts: 1000, nominalVoltage: 120, supplyHz: 60, intervalCycles: [60, 60], cycles: 600 });

  it("on 120 V / 60 Hz without a user impedance: the standard defines none", () => {
    const result = estimateFlicker({
      current,
      sampleRateHz: 10_000,
      frequencyHz: 60,
      nominalVoltage: 120,
      lamp: 120,
      impedance: null,
      dmaxLimitPercent: 4,
    }) as FlickerUnavailable;
    expect(result.pst).toBeNull();
    expect(result.reason).toMatch(/no reference impedance/);
  });

  it("for a capture shorter than a second", () => {
    const result = estimateFlicker({
      current: current.subarray(0, 5000),
      sampleRateHz: 10_000,
      frequencyHz: 60,
      nominalVoltage: 120,
      lamp: 120,
      impedance: { resistanceOhm: 0.4, reactanceOhm: 0.25 },
      dmaxLimitPercent: 4,
    });
    expect(result.pst).toBeNull();
  });
});

describe("a long record", () => {
  // Speed is measured by npm run bench:analyze, not here; this checks that 200 s of samples keep d exact.
  it("keeps d ≈ 0.756 % (REFERENCES.md §2, derived) over a 10 M-sample, 50 kS/s current, within 1 %", () => {
    const current = burstFiredHeaterCurrent({
      watts: 1000,
      nominalVoltage: 230,
      supplyHz: 50,
      sampleRateHz: 50_000,
      intervalCycles: burstPattern(39, 50, 2000),
      cycles: 10_000,
      noiseAmps: 0.01,
    });
    expect(current.length).toBe(10_000_000);
    const result = estimate(current, { sampleRateHz: 50_000 });
    expect(Math.abs(result.dmaxPercent / 0.756 - 1)).toBeLessThan(0.01);
  }, 30_000);
});

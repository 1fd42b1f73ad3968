import { describe, expect, it } from "vitest";
import {
  TYPE_K_MAX_C,
  TYPE_K_MIN_C,
  typeKEmfMv,
  typeKTemperatureC,
  typeKTemperatureWithColdJunction,
} from "@/lib/bench/thermocouple";

// NIST ITS-90 type K table, reference junction 0 °C (NIST Monograph 175), as quoted in REFERENCES.md §5 (seen).
const NIST_TABLE: Array<[number, number]> = [
  [0, 0.0],
  [100, 4.096],
  [200, 8.138],
  [300, 12.209],
  [400, 16.397],
  [500, 20.644],
];

// Further NIST ITS-90 type K table values (NIST Monograph 175), from memory.
const NIST_TABLE_FROM_MEMORY: Array<[number, number]> = [
  [-270, -6.458],
  [-200, -5.891],
  [-100, -3.554],
  [25, 1.0],
  [1000, 41.276],
  [1372, 54.886],
];

describe("type K EMF from temperature (NIST ITS-90 reference function)", () => {
  it.each(NIST_TABLE)("%d °C → %d mV within ±1 µV (REFERENCES.md §5)", (temperature, millivolts) => {
    expect(Math.abs(typeKEmfMv(temperature) - millivolts)).toBeLessThanOrEqual(0.001);
  });

  it.each(NIST_TABLE_FROM_MEMORY)("%d °C → %d mV within ±1 µV (NIST table, from memory)", (temperature, millivolts) => {
    expect(Math.abs(typeKEmfMv(temperature) - millivolts)).toBeLessThanOrEqual(0.001);
  });
});

describe("type K temperature from EMF", () => {
  it.each([...NIST_TABLE, ...NIST_TABLE_FROM_MEMORY.filter(([t]) => t > -200)])(
    "%d mV table value reads back as %d °C within the table's rounding",
    (temperature, millivolts) => {
      // A table value is rounded to 1 µV; at 0–1372 °C the Seebeck coefficient is over 25 µV/°C, so ±0.5 µV ≤ ±0.02 °C.
      expect(Math.abs(typeKTemperatureC(millivolts) - temperature)).toBeLessThan(0.05);
    },
  );

  it("round-trips within ±0.05 °C across all ranges, −270 to 1372 °C (REFERENCES.md §5, derived)", () => {
    let worst = 0;
    for (let temperature = TYPE_K_MIN_C; temperature <= TYPE_K_MAX_C; temperature += 0.25) {
      worst = Math.max(worst, Math.abs(typeKTemperatureC(typeKEmfMv(temperature)) - temperature));
    }
    expect(worst).toBeLessThan(0.05);
  });

  it("round-trips at the range joins", () => {
    for (const temperature of [-200, -0.001, 0, 0.001, 499.999, 500, 500.001, TYPE_K_MIN_C, TYPE_K_MAX_C]) {
      expect(typeKTemperatureC(typeKEmfMv(temperature))).toBeCloseTo(temperature, 6);
    }
  });

  it("rejects readings outside the ITS-90 range, naming them", () => {
    expect(() => typeKEmfMv(1400)).toThrow("temperatureC 1400 °C is outside type K's ITS-90 range of -270 to 1372 °C");
    expect(() => typeKEmfMv(-273)).toThrow("temperatureC -273 °C");
    expect(() => typeKTemperatureC(60)).toThrow("emfMv 60 mV is outside type K's ITS-90 range of -6.458 to 54.886 mV");
    expect(() => typeKTemperatureC(Number.NaN)).toThrow("emfMv must be a finite number, got NaN");
  });
});

describe("cold-junction compensation", () => {
  it("adds E(T_cj) to the measured EMF before inverting: 11.209 mV with the cold junction at 25 °C reads 300 °C", () => {
    // NIST table: E(300 °C) = 12.209 mV (REFERENCES.md §5), E(25 °C) = 1.000 mV (from memory).
    const result = typeKTemperatureWithColdJunction({ measuredEmfMv: 11.209, coldJunctionC: 25 });
    expect(result.coldJunctionEmfMv).toBeCloseTo(1.0, 3);
    expect(result.totalEmfMv).toBeCloseTo(12.209, 3);
    expect(result.temperatureC).toBeCloseTo(300, 1);
  });

  it("round-trips a hot junction at 350 °C with the cold junction at 31.5 °C", () => {
    const measuredEmfMv = typeKEmfMv(350) - typeKEmfMv(31.5);
    expect(typeKTemperatureWithColdJunction({ measuredEmfMv, coldJunctionC: 31.5 }).temperatureC).toBeCloseTo(350, 9);
  });

  it("rejects a non-finite cold-junction temperature", () => {
    expect(() => typeKTemperatureWithColdJunction({ measuredEmfMv: 1, coldJunctionC: Number.NaN })).toThrow(
      "coldJunctionC must be a finite number, got NaN",
    );
  });
});

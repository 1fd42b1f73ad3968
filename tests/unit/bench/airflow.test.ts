import { describe, expect, it } from "vitest";
import { PROFILE_FACTORS, airflowFromVelocity } from "@/lib/bench/airflow";

describe("airflow from air velocity over a nozzle bore", () => {
  it("gives 11.781 L/min for 10 m/s through a 5 mm bore (REFERENCES.md §8, derived)", () => {
    const airflow = airflowFromVelocity({ airVelocityMps: 10, boreMm: 5, condition: { heater: "off" } });
    expect(airflow.litresPerMinute).toBeCloseTo(11.781, 3);
    expect(airflow.boreAreaM2).toBeCloseTo(1.9635e-5, 9);
    expect(airflow.profileFactor).toBe(1);
    expect(airflow.profileNote).toContain("upper bound");
    expect(airflow.temperatureNote).toContain("heater off");
  });

  it.each([
    // Mean ÷ centre-line velocity, REFERENCES.md §8 (seen, lecture notes).
    [PROFILE_FACTORS.turbulent, 11.781 * 0.82, "turbulent"],
    [PROFILE_FACTORS.laminar, 11.781 * 0.5, "laminar"],
    [0.9, 11.781 * 0.9, "chosen by the reviewer"],
  ])("scales by a profile factor of %d", (profileFactor, litresPerMinute, note) => {
    const airflow = airflowFromVelocity({ airVelocityMps: 10, boreMm: 5, profileFactor, condition: { heater: "off" } });
    expect(airflow.litresPerMinute).toBeCloseTo(litresPerMinute, 3);
    expect(airflow.profileNote).toContain(note);
  });

  it("refers a hot reading to 20 °C as an ideal gas (volumetric flow ∝ absolute temperature)", () => {
    const airflow = airflowFromVelocity({ airVelocityMps: 10, boreMm: 5, condition: { heater: "on", airTemperatureC: 200 } });
    expect(airflow.measuredLitresPerMinute).toBeCloseTo(11.781, 3);
    expect(airflow.litresPerMinute).toBeCloseTo((11.781 * 293.15) / 473.15, 3);
    expect(airflow.airTemperatureC).toBe(200);
    expect(airflow.temperatureNote).toContain("referred to 20 °C");
  });

  it("leaves a reading at 20 °C unchanged", () => {
    const airflow = airflowFromVelocity({ airVelocityMps: 10, boreMm: 5, condition: { heater: "on", airTemperatureC: 20 } });
    expect(airflow.litresPerMinute).toBeCloseTo(airflow.measuredLitresPerMinute, 12);
  });

  it("rejects bad inputs, naming them", () => {
    const off = { heater: "off" } as const;
    expect(() => airflowFromVelocity({ airVelocityMps: 10, boreMm: -5, condition: off })).toThrow("boreMm must be greater than 0, got -5");
    expect(() => airflowFromVelocity({ airVelocityMps: Number.NaN, boreMm: 5, condition: off })).toThrow("airVelocityMps must be a finite number, got NaN");
    expect(() => airflowFromVelocity({ airVelocityMps: -1, boreMm: 5, condition: off })).toThrow("airVelocityMps must not be negative, got -1");
    expect(() => airflowFromVelocity({ airVelocityMps: 10, boreMm: 5, profileFactor: 1.2, condition: off })).toThrow("profileFactor must not exceed 1");
    expect(() => airflowFromVelocity({ airVelocityMps: 10, boreMm: 5, profileFactor: 0, condition: off })).toThrow("profileFactor must be greater than 0, got 0");
    expect(() => airflowFromVelocity({ airVelocityMps: 10, boreMm: 5, condition: { heater: "on", airTemperatureC: -300 } })).toThrow(
      "airTemperatureC must be above −273.15 °C, got -300",
    );
    expect(() => airflowFromVelocity({ airVelocityMps: 10, boreMm: 5, condition: {} as never })).toThrow('condition must be { heater: "off" }');
  });
});

import { describe, expect, it } from "vitest";
import { analyzeSamples } from "@/lib/bench/analysis";
import { accuracyForReading, describeReadings, manualReadingFigures, measurementsFromWaveform } from "@/lib/run-measurements";
import { parseReadingValues, withCheckedList } from "@/lib/validations/runs";
import { burstFire, mainsVoltage, switchedResistor } from "../bench/waveforms";

const ratings = {
  ratedPowerW: 700,
  applianceType: "heating" as const,
  motorShareAboveHalf: null,
  ratedAirflowLpm: 120,
  claimedHeatUpSeconds: 25,
  temperatureSetpointC: 350,
  tolerances: { airflow: { kind: "percent" as const, plus: 10, minus: 10, source: "test protocol" } },
};

describe("manual readings", () => {
  it("combines the repeats' Type A term with the instrument's Type B", () => {
    const described = describeReadings({ values: [10, 12, 14], accuracy: { percentOfReading: 1, offset: 0.1 } });
    expect(described.spread).toMatchObject({ mean: 12, standardDeviation: 2, min: 10, max: 14 });
    expect(described.typeA).toBeCloseTo(2 / Math.sqrt(3), 12);
    expect(described.uncertainty.typeB).toBeCloseTo((0.12 + 0.1) / Math.sqrt(3), 12);
    expect(described.uncertainty.expanded).toBeCloseTo(2 * Math.hypot(2 / Math.sqrt(3), 0.22 / Math.sqrt(3)), 12);
    expect(describeReadings({ values: [5], accuracy: null }).typeA).toBeNull();
  });

  it("judges airflow by the protocol's tolerance and power input by IEC 60335-1", () => {
    const airflow = manualReadingFigures({ kind: "airflow", values: [100, 101, 99], accuracy: null, rule: "simple", ratings });
    expect(airflow.verdict).toMatchObject({ rated: 120, lower: 108, result: "below rating", tolerance: { source: "test protocol" } });
    const power = manualReadingFigures({ kind: "power_input_full_demand", values: [684, 688, 686], accuracy: { percentOfReading: 0.5, offset: 0.5 }, rule: "guarded", ratings });
    expect(power.verdict).toMatchObject({ rated: 700, lower: 630, upper: 735, rule: "guarded", result: "meets rating" });
    expect(power.verdict?.tolerance.source).toMatch(/IEC 60335-1/);
    expect(manualReadingFigures({ kind: "tip_to_ground_resistance", values: [0.8], accuracy: null, rule: "simple", ratings }).verdict).toBeNull();
  });

  it("uses the smallest accuracy line in the reading's unit that holds it", () => {
    const lines = [
      { quantity: "power" as const, unit: "W", rangeMax: 1800, percentOfReading: 0.5, offset: 0.5 },
      { quantity: "power" as const, unit: "W", rangeMax: 200, percentOfReading: 0.3, offset: 0.1 },
      { quantity: "air_velocity" as const, unit: "m/s", rangeMax: 30, percentOfReading: 3, offset: 0.1 },
    ];
    expect(accuracyForReading(lines, "W", 150)).toEqual({ percentOfReading: 0.3, offset: 0.1 });
    expect(accuracyForReading(lines, "W", 686)).toEqual({ percentOfReading: 0.5, offset: 0.5 });
    expect(accuracyForReading(lines, "L/min", 120)).toBeNull();
  });

  it("reads repeats typed by hand, and a checkbox list", () => {
    expect(parseReadingValues("118.2, 121.5;119.8\n120")).toEqual([118.2, 121.5, 119.8, 120]);
    expect(parseReadingValues("12, twelve")).toBeNull();
    expect(withCheckedList({ "instrumentIds.a": "a", "instrumentIds.b": "b", notes: "x" }, "instrumentIds")).toEqual({ notes: "x", instrumentIds: ["a", "b"] });
  });
});

describe("measurementsFromWaveform", () => {
  it("gives power at full demand with the verdict, mean power and current, each with U", () => {
    const mains = { frequencyHz: 50, sampleRateHz: 10_000, seconds: 1 };
    const voltage = mainsVoltage(mains, 230);
    const current = switchedResistor(mains, voltage, 75.5, burstFire(3, 2));
    const options = {
      nominalVoltage: 230,
      rating: { ratedPowerW: 720, ratedVoltage: 230, currentAccuracy: { percentOfReading: 2, offset: 0.01 }, voltageAccuracy: { percentOfReading: 1.5, offset: 0.5 } },
    };
    const result = analyzeSamples({ current, voltage, sampleRateHz: mains.sampleRateHz }, options);
    const drafts = measurementsFromWaveform(result, options);
    expect(drafts.map((draft) => draft.kind)).toEqual(["power_input_full_demand", "power_input_at_setpoint", "current"]);
    expect(drafts[0]).toMatchObject({ value: result.verdict!.normalized, expandedUncertainty: result.verdict!.expandedUncertainty, unit: "W", verdict: result.verdict });
    expect(drafts[1]!.value).toBe(result.power!.real);
    expect(drafts[1]!.expandedUncertainty! / drafts[1]!.value).toBeCloseTo(drafts[0]!.expandedUncertainty! / drafts[0]!.value, 1);
    expect(drafts[2]).toMatchObject({ value: result.current.rms, unit: "A" });
  });
});

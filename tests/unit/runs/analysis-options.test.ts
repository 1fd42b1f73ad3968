import { describe, expect, it } from "vitest";
import {
  accuracyChoices,
  buildHeatUpOptions,
  buildWaveformOptions,
  defaultAccuracyChoice,
  defaultHeatUpBandC,
  sampleIntervalFromHeader,
  waveformMappingDefaults,
  type RunInstrument,
} from "@/lib/analysis-options";
import { analysisOptionsSchema } from "@/lib/bench/analysis";

const snapshot = (kind: string, accuracy: RunInstrument["snapshot"]["accuracy"]) => ({
  kind,
  maker: "Testbench",
  model: kind,
  serialNumber: `${kind}-1`,
  accuracy,
  calibratedOn: "2025-01-01",
  calibrationDueOn: "2026-01-01",
});

const instruments: RunInstrument[] = [
  {
    instrumentId: "11111111-1111-4111-8111-111111111111",
    snapshot: snapshot("current_clamp", [
      { quantity: "current", unit: "A", rangeMax: 40, percentOfReading: 1.5, offset: 0.05 },
      { quantity: "current", unit: "A", rangeMax: 4, percentOfReading: 2, offset: 0.01 },
    ]),
  },
  { instrumentId: "22222222-2222-4222-8222-222222222222", snapshot: snapshot("oscilloscope", [{ quantity: "voltage", unit: "V", rangeMax: 400, percentOfReading: 1.5, offset: 0.5 }]) },
];
const tool = { ratedPowerW: 720, ratedVoltageMin: 220, ratedVoltageMax: 240, applianceType: "heating" as const, claimedHeatUpSeconds: 25 };
const conditions = { supplyVoltage: 230, supplyFrequencyHz: 50, ambientC: 23, nozzle: null, airflowSetpoint: null, temperatureSetpointC: 350, measuringDistanceMm: null, warmUpMinutes: 5 };
const mapping = {
  captureId: "33333333-3333-4333-8333-333333333333",
  currentColumn: "CH1",
  currentScale: 10,
  voltageColumn: "CH2",
  voltageScale: 1,
  timeColumn: "TIME",
  harmonicClass: "A" as const,
  dmaxLimitPercent: 4 as const,
  currentAccuracy: "11111111-1111-4111-8111-111111111111:1",
  voltageAccuracy: "22222222-2222-4222-8222-222222222222:0",
  rule: "guarded" as const,
};

describe("accuracy choices", () => {
  it("offers each line of the run's instruments for a quantity and picks the smallest range that holds the reading", () => {
    const choices = accuracyChoices(instruments, "current");
    expect(choices.map((choice) => choice.value)).toEqual(["11111111-1111-4111-8111-111111111111:0", "11111111-1111-4111-8111-111111111111:1"]);
    expect(defaultAccuracyChoice(choices, 3.1)).toBe("11111111-1111-4111-8111-111111111111:1");
    expect(defaultAccuracyChoice(choices, 12)).toBe("11111111-1111-4111-8111-111111111111:0");
    expect(defaultAccuracyChoice(choices, 400)).toBe("11111111-1111-4111-8111-111111111111:0");
    expect(defaultAccuracyChoice([], 1)).toBeUndefined();
  });
});

describe("buildWaveformOptions", () => {
  it("copies the supply, the rating and the chosen accuracy lines into options the analysis accepts", () => {
    const built = buildWaveformOptions({ mapping, conditions, tool, instruments });
    if (!built.ok) throw new Error("expected options");
    expect(built.options.kind).toBe("waveform");
    const parsed = analysisOptionsSchema.parse(built.options.kind === "waveform" ? built.options.analysis : null);
    expect(parsed).toMatchObject({
      current: { column: "CH1", scale: 10 },
      voltage: { column: "CH2", scale: 1 },
      time: "TIME",
      nominalVoltage: 230,
      nominalFrequencyHz: 50,
      impedance: null,
      rating: { ratedPowerW: 720, ratedVoltage: { min: 220, max: 240 }, currentAccuracy: { percentOfReading: 2, offset: 0.01 }, rule: "guarded" },
    });
    expect(built.instrumentSnapshots.map((entry) => entry.kind)).toEqual(["current_clamp", "oscilloscope"]);
  });

  it("refuses an accuracy line that is not on the run", () => {
    const built = buildWaveformOptions({ mapping: { ...mapping, voltageAccuracy: "44444444-4444-4444-8444-444444444444:0" }, conditions, tool, instruments });
    expect(built).toEqual({ ok: false, fieldErrors: { voltageAccuracy: ["That accuracy line is not one of this run's instruments."] } });
  });
});

describe("heat-up options and defaults", () => {
  it("takes the band from an absolute setpoint tolerance, else ±10 °C", () => {
    expect(defaultHeatUpBandC({ temperature_vs_setpoint: { kind: "absolute", plus: 15, minus: 15, source: "p" } })).toBe(15);
    expect(defaultHeatUpBandC({ temperature_vs_setpoint: { kind: "percent", plus: 5, minus: 5, source: "p" } })).toBe(10);
    expect(defaultHeatUpBandC({})).toBe(10);
  });

  it("copies the claim and the protocol's tolerances", () => {
    const built = buildHeatUpOptions({
      mapping: { captureId: mapping.captureId, temperatureColumn: "TC1", temperatureScale: 1, setpointC: 350, bandC: 15, rule: "simple" },
      tool,
      tolerances: { heat_up_time: { kind: "percent", plus: 20, minus: 100, source: "p" } },
      instruments,
    });
    expect(built.ok && built.options.kind === "heat_up_log" && built.options.heatUp).toMatchObject({
      temperature: { column: "TC1", scale: 1 },
      time: null,
      band: { kind: "absolute", plusMinusC: 15 },
      claimedHeatUpSeconds: 25,
      heatUpTolerance: { plus: 20 },
      temperatureTolerance: null,
      temperatureAccuracy: null,
    });
  });
});

describe("the mapping form's starting values", () => {
  it("reads the sample interval a scope writes in its header", () => {
    expect(sampleIntervalFromHeader([{ key: "Sample Interval", value: "2.0000E-04" }])).toBe(0.0002);
    expect(sampleIntervalFromHeader([{ key: "Interval", value: "0,2 ms" }])).toBeCloseTo(0.0002, 12);
    expect(sampleIntervalFromHeader([{ key: "Interval", value: "200 us" }])).toBeCloseTo(0.0002, 12);
    expect(sampleIntervalFromHeader([{ key: "Model", value: "ORM-42" }])).toBeUndefined();
  });

  it("starts from the header when the capture has no earlier mapping", () => {
    const defaults = waveformMappingDefaults({
      heading: { columns: ["current", "voltage"], header: [{ key: "Interval", value: "0,2 ms" }], detected: { time: null, current: "current", voltage: "voltage", temperature: null } },
      previous: null,
      expectedCurrentA: 3.1,
      nominalVoltage: 230,
      instruments,
    });
    expect(defaults).toMatchObject({ currentColumn: "current", voltageColumn: "voltage", timeColumn: "", sampleIntervalSeconds: "0.0002", currentAccuracy: "11111111-1111-4111-8111-111111111111:1" });
  });
});

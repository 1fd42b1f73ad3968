import { describe, expect, it } from "vitest";
import { ambientThresholdC, compareRunConditions, type ComparedRun } from "@/lib/comparability";

const base: ComparedRun = {
  protocol: { name: "Hot-air station bench protocol", version: 2 },
  conditions: {
    supplyVoltage: 230,
    supplyFrequencyHz: 50,
    nozzle: "6 mm round nozzle",
    airflowSetpoint: "Maximum",
    temperatureSetpointC: 350,
    ambientC: 23,
  },
};

function run(change: { protocol?: Partial<ComparedRun["protocol"]>; conditions?: Partial<ComparedRun["conditions"]> } = {}): ComparedRun {
  return { protocol: { ...base.protocol, ...change.protocol }, conditions: { ...base.conditions, ...change.conditions } };
}

const conditionsOf = (a: ComparedRun[], b: ComparedRun[]) => compareRunConditions(a, b).map((warning) => warning.condition);

describe("compareRunConditions", () => {
  it("gives no warning when every condition matches", () => {
    expect(compareRunConditions([run()], [run()])).toEqual([]);
  });

  it("gives no warning when a side has no runs to compare", () => {
    expect(compareRunConditions([run()], [])).toEqual([]);
  });

  it("names a different protocol version with what each side had", () => {
    expect(compareRunConditions([run()], [run({ protocol: { version: 1 } })])).toEqual([
      {
        condition: "protocol",
        title: "Different protocol versions",
        a: ["Hot-air station bench protocol, version 2"],
        b: ["Hot-air station bench protocol, version 1"],
      },
    ]);
  });

  it("names different protocols apart from versions of one protocol", () => {
    const [warning] = compareRunConditions([run()], [run({ protocol: { name: "Soldering station bench protocol", version: 2 } })]);
    expect(warning).toMatchObject({ condition: "protocol", title: "Different protocols" });
  });

  it("names a different supply voltage", () => {
    expect(compareRunConditions([run()], [run({ conditions: { supplyVoltage: 120 } })])).toEqual([
      { condition: "supply-voltage", title: "Different supply voltage", a: ["230 V"], b: ["120 V"] },
    ]);
  });

  it("names a different supply frequency", () => {
    expect(compareRunConditions([run()], [run({ conditions: { supplyFrequencyHz: 60 } })])).toEqual([
      { condition: "supply-frequency", title: "Different supply frequency", a: ["50 Hz"], b: ["60 Hz"] },
    ]);
  });

  it("names a different nozzle, a missing one included, but not a difference of case or spacing", () => {
    expect(conditionsOf([run()], [run({ conditions: { nozzle: "10 mm round nozzle" } })])).toEqual(["nozzle"]);
    expect(compareRunConditions([run()], [run({ conditions: { nozzle: null } })])[0]).toMatchObject({ a: ["6 mm round nozzle"], b: ["not stated"] });
    expect(conditionsOf([run()], [run({ conditions: { nozzle: " 6 mm  Round nozzle" } })])).toEqual([]);
  });

  it("names a different temperature setpoint", () => {
    expect(compareRunConditions([run()], [run({ conditions: { temperatureSetpointC: 400 } })])).toEqual([
      { condition: "temperature-setpoint", title: "Different temperature setpoint", a: ["350 °C"], b: ["400 °C"] },
    ]);
  });

  it("names a different airflow setpoint", () => {
    expect(conditionsOf([run()], [run({ conditions: { airflowSetpoint: "Level 5 of 8" } })])).toEqual(["airflow-setpoint"]);
  });

  it("flags ambient temperatures only beyond the threshold", () => {
    expect(conditionsOf([run()], [run({ conditions: { ambientC: 23 + ambientThresholdC } })])).toEqual([]);
    expect(compareRunConditions([run()], [run({ conditions: { ambientC: 23 + ambientThresholdC + 0.5 } })])).toEqual([
      { condition: "ambient", title: `Ambient temperatures more than ${ambientThresholdC} °C apart`, a: ["23 °C"], b: ["25.5 °C"] },
    ]);
  });

  it("names every differing condition at once, in a fixed order", () => {
    const other = run({
      protocol: { name: "Soldering station bench protocol", version: 1 },
      conditions: { supplyVoltage: 120, supplyFrequencyHz: 60, nozzle: "Supplied conical tip", airflowSetpoint: null, ambientC: 19 },
    });
    expect(conditionsOf([run()], [other])).toEqual(["protocol", "supply-voltage", "supply-frequency", "nozzle", "airflow-setpoint", "ambient"]);
  });

  it("compares every run of one side with every run of the other and lists each value once", () => {
    const a = [run(), run({ conditions: { supplyVoltage: 120 } }), run()];
    const warnings = compareRunConditions(a, [run()]);
    expect(warnings).toEqual([{ condition: "supply-voltage", title: "Different supply voltage", a: ["230 V", "120 V"], b: ["230 V"] }]);
  });
});

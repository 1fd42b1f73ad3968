import type { AccuracyRange, InstrumentKind, MeasurementKind, ProtocolConditions, ProtocolVersion } from "@/db/schema";
import { defaultSafetyCautions } from "@/lib/validations/protocol";

// Invented instruments and protocols for the demo labs: every maker and model below is made up.

/** Calibration dates are set relative to the day of seeding, so the overdue example stays overdue. */
type CalibrationAge = { calibratedDaysAgo: number; intervalDays: number };

export type DemoInstrument = {
  /** Fixed, so tests and other seeders can link to an entry without looking it up. */
  id: string;
  labSlug: "wrenford-bench" | "cedar-hollow-shop";
  kind: InstrumentKind;
  maker: string;
  model: string;
  serialNumber: string;
  accuracy: AccuracyRange[];
  calibration: CalibrationAge;
};

const yearly = (calibratedDaysAgo: number): CalibrationAge => ({ calibratedDaysAgo, intervalDays: 365 });

export const demoInstruments: DemoInstrument[] = [
  {
    id: "0b5e4c1a-3d0f-4a52-9a51-1c0d6e2f7a01",
    labSlug: "wrenford-bench",
    kind: "current_clamp",
    maker: "Halvard Instruments",
    model: "HC-40 AC/DC clamp",
    serialNumber: "HC40-218770",
    accuracy: [
      { quantity: "current", unit: "A", rangeMax: 4, percentOfReading: 2, offset: 0.01 },
      { quantity: "current", unit: "A", rangeMax: 40, percentOfReading: 1.5, offset: 0.05 },
    ],
    calibration: yearly(90),
  },
  {
    id: "0b5e4c1a-3d0f-4a52-9a51-1c0d6e2f7a02",
    labSlug: "wrenford-bench",
    kind: "oscilloscope",
    maker: "Veymouth Test",
    model: "VT-2204 isolated-channel scope",
    serialNumber: "VT22-04157",
    accuracy: [{ quantity: "voltage", unit: "V", rangeMax: 400, percentOfReading: 1.5, offset: 0.5 }],
    calibration: yearly(140),
  },
  {
    id: "0b5e4c1a-3d0f-4a52-9a51-1c0d6e2f7a03",
    labSlug: "wrenford-bench",
    kind: "thermocouple_meter",
    maker: "Tarrow Meters",
    model: "TK-52 dual type K",
    serialNumber: "TK52-30981",
    accuracy: [{ quantity: "temperature", unit: "°C", rangeMax: 1000, percentOfReading: 0.5, offset: 1 }],
    calibration: yearly(60),
  },
  {
    id: "0b5e4c1a-3d0f-4a52-9a51-1c0d6e2f7a04",
    labSlug: "wrenford-bench",
    kind: "anemometer",
    maker: "Aldmoor",
    model: "VA-8 vane anemometer",
    serialNumber: "VA8-11206",
    accuracy: [{ quantity: "air_velocity", unit: "m/s", rangeMax: 30, percentOfReading: 3, offset: 0.1 }],
    // Past its due date: the register flags it, and a run that uses it warns.
    calibration: yearly(400),
  },
  {
    id: "0b5e4c1a-3d0f-4a52-9a51-1c0d6e2f7a05",
    labSlug: "cedar-hollow-shop",
    kind: "power_meter",
    maker: "Pellam Electric",
    model: "PM-300 plug-in power analyser",
    serialNumber: "PM300-77415",
    accuracy: [
      { quantity: "power", unit: "W", rangeMax: 1800, percentOfReading: 0.5, offset: 0.5 },
      { quantity: "voltage", unit: "V", rangeMax: 300, percentOfReading: 0.3, offset: 0.2 },
      { quantity: "current", unit: "A", rangeMax: 15, percentOfReading: 0.5, offset: 0.01 },
    ],
    calibration: yearly(30),
  },
  {
    id: "0b5e4c1a-3d0f-4a52-9a51-1c0d6e2f7a06",
    labSlug: "cedar-hollow-shop",
    kind: "current_clamp",
    maker: "Halvard Instruments",
    model: "HC-20 mini clamp",
    serialNumber: "HC20-50442",
    accuracy: [{ quantity: "current", unit: "A", rangeMax: 20, percentOfReading: 2, offset: 0.03 }],
    calibration: yearly(200),
  },
  {
    id: "0b5e4c1a-3d0f-4a52-9a51-1c0d6e2f7a07",
    labSlug: "cedar-hollow-shop",
    kind: "oscilloscope",
    maker: "Veymouth Test",
    model: "VT-1104 isolated-channel scope",
    serialNumber: "VT11-02290",
    accuracy: [{ quantity: "voltage", unit: "V", rangeMax: 300, percentOfReading: 1.5, offset: 0.4 }],
    calibration: yearly(120),
  },
  {
    id: "0b5e4c1a-3d0f-4a52-9a51-1c0d6e2f7a08",
    labSlug: "cedar-hollow-shop",
    kind: "thermocouple_meter",
    maker: "Tarrow Meters",
    model: "TK-31 tip thermometer",
    serialNumber: "TK31-66120",
    accuracy: [{ quantity: "temperature", unit: "°C", rangeMax: 700, percentOfReading: 0.5, offset: 1 }],
    calibration: yearly(45),
  },
  {
    id: "0b5e4c1a-3d0f-4a52-9a51-1c0d6e2f7a09",
    labSlug: "cedar-hollow-shop",
    kind: "resistance_meter",
    maker: "Corrow",
    model: "RM-10 low-ohm meter",
    serialNumber: "RM10-09813",
    accuracy: [{ quantity: "resistance", unit: "Ω", rangeMax: 20, percentOfReading: 0.2, offset: 0.01 }],
    calibration: yearly(75),
  },
  {
    id: "0b5e4c1a-3d0f-4a52-9a51-1c0d6e2f7a10",
    labSlug: "cedar-hollow-shop",
    kind: "multimeter",
    maker: "Tamsin Devices",
    model: "TD-87 true-RMS multimeter",
    serialNumber: "TD87-40317",
    accuracy: [
      { quantity: "voltage", unit: "V", rangeMax: 6, percentOfReading: 1, offset: 0.003 },
      { quantity: "resistance", unit: "Ω", rangeMax: 600, percentOfReading: 0.9, offset: 0.2 },
    ],
    calibration: yearly(160),
  },
];

type DemoProtocolVersion = {
  /** Days before seeding that the version was written, so the history reads in order. */
  writtenDaysAgo: number;
  summary: string;
  conditions: ProtocolConditions;
  requiredMeasurements: MeasurementKind[];
  repeats: number;
  tolerances: ProtocolVersion["tolerances"];
  stepsMdx: string;
  safetyCautions: string;
};

export type DemoProtocol = { slug: string; name: string; authorEmail: string; versions: DemoProtocolVersion[] };

const hotAirConditions: ProtocolConditions = {
  supplyVoltage: 230,
  supplyFrequencyHz: 50,
  ambientC: 23,
  nozzle: "6 mm round nozzle",
  airflowSetpoint: "Maximum",
  temperatureSetpointC: 350,
  measuringDistanceMm: 10,
  warmUpMinutes: 5,
};

const hotAirSteps = (extra: string) => `## Set-up

1. Let the station stand unpowered in the lab until it reads the ambient temperature stated above.
2. Feed the station through the isolation transformer and the measuring adapter; check the supply at the socket with the scope's isolated channel.
3. Fit the stated nozzle, set the airflow and the temperature setpoint, and put the handle in its cradle.

## Power input

1. Start the scope and the clamp capture, then lift the handle out of the cradle: record at least 10 s at full demand.
2. Keep recording until the outlet temperature has settled in its band, and 30 s beyond.

## Air and temperature

1. Hold the vane anemometer and the thermocouple at the stated distance from the outlet, on the nozzle's axis.
2. Read the air velocity and the outlet temperature; repeat the stated number of times, re-seating the handle between readings.
${extra}`;

export const demoProtocols: DemoProtocol[] = [
  {
    slug: "hot-air-station-bench-protocol",
    name: "Hot-air station bench protocol",
    authorEmail: "nadia.orlen@benchplate.test",
    versions: [
      {
        writtenDaysAgo: 120,
        summary: "Power input, airflow, heat-up and outlet temperature of a hot-air rework station on a 230 V 50 Hz bench supply.",
        conditions: hotAirConditions,
        requiredMeasurements: ["power_input_full_demand", "power_input_at_setpoint", "standby_power", "airflow", "heat_up_time", "temperature_vs_setpoint"],
        repeats: 3,
        tolerances: {
          airflow: { kind: "percent", plus: 10, minus: 10, source: "Benchplate's own choice for rated airflow" },
          heat_up_time: { kind: "percent", plus: 20, minus: 100, source: "Benchplate's own choice: any faster heat-up than claimed meets the rating" },
        },
        stepsMdx: hotAirSteps(""),
        safetyCautions: defaultSafetyCautions,
      },
      {
        writtenDaysAgo: 20,
        summary:
          "Power input, inrush, airflow, heat-up, outlet temperature and its stability for a hot-air rework station on a 230 V 50 Hz bench supply.",
        conditions: { ...hotAirConditions, measuringDistanceMm: 5 },
        requiredMeasurements: [
          "power_input_full_demand",
          "power_input_at_setpoint",
          "standby_power",
          "inrush_peak_current",
          "airflow",
          "heat_up_time",
          "temperature_vs_setpoint",
          "temperature_stability",
        ],
        repeats: 5,
        tolerances: {
          airflow: { kind: "percent", plus: 10, minus: 10, source: "Benchplate's own choice for rated airflow" },
          heat_up_time: { kind: "percent", plus: 20, minus: 100, source: "Benchplate's own choice: any faster heat-up than claimed meets the rating" },
          temperature_vs_setpoint: { kind: "absolute", plus: 15, minus: 15, source: "Benchplate's own choice for outlet temperature at 5 mm" },
        },
        stepsMdx: hotAirSteps(`
## Inrush and stability

1. Switch the station on from cold with the capture running, to catch the inrush peak.
2. With the handle held still at the setpoint, log the outlet temperature for 5 minutes; report the spread.`),
        safetyCautions: defaultSafetyCautions,
      },
    ],
  },
  {
    slug: "soldering-station-bench-protocol",
    name: "Soldering station bench protocol",
    authorEmail: "teodor.wylde@benchplate.test",
    versions: [
      {
        writtenDaysAgo: 45,
        summary: "Tip temperature, heat-up, recovery, tip-to-ground resistance and leakage of a soldering station on a 120 V 60 Hz bench supply.",
        conditions: {
          supplyVoltage: 120,
          supplyFrequencyHz: 60,
          ambientC: 22,
          nozzle: "Supplied conical tip",
          airflowSetpoint: null,
          temperatureSetpointC: 350,
          measuringDistanceMm: null,
          warmUpMinutes: 3,
        },
        requiredMeasurements: [
          "power_input_full_demand",
          "power_input_at_setpoint",
          "standby_power",
          "heat_up_time",
          "temperature_vs_setpoint",
          "temperature_vs_display",
          "recovery_under_load",
          "tip_to_ground_resistance",
          "leakage_voltage",
        ],
        repeats: 3,
        tolerances: {
          heat_up_time: { kind: "percent", plus: 20, minus: 100, source: "Benchplate's own choice: any faster heat-up than claimed meets the rating" },
          temperature_vs_setpoint: { kind: "absolute", plus: 10, minus: 10, source: "Benchplate's own choice for tip temperature with a tip thermometer" },
        },
        stepsMdx: `## Set-up

1. Clean and tin the tip; let the station reach the ambient temperature stated above.
2. Feed the station through the power meter; check the supply voltage.

## Temperature

1. Set 350 °C and wait for the display to settle, then read the tip thermometer three times, re-tinning between readings.
2. Note the station's own display beside each reading.

## Safety readings

1. With the station at temperature, measure tip-to-ground resistance to the earth pin.
2. Measure the AC voltage between the tip and earth with the multimeter.`,
        safetyCautions: defaultSafetyCautions,
      },
    ],
  },
];

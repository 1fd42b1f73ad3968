import type { MeasurementKind, TestedUnit } from "@/db/schema";
import type { HeatUpMapping, WaveformMapping } from "@/lib/validations/runs";
import type { BurstFiredHeater, CaptureLayout, HeatUpRun } from "@/lib/synthetic-captures";

// One run per demo lab, each with a generated waveform capture and a heat-up log. Every instrument name in a
// capture header is invented. Ids are fixed so seeding again updates these rows instead of adding more.

type DemoCapture = { id: string; analysisId: string; fileName: string; layout: CaptureLayout } & (
  | { kind: "waveform"; heater: BurstFiredHeater; mapping: Omit<WaveformMapping, "captureId" | "currentAccuracy" | "voltageAccuracy"> }
  | { kind: "heat_up_log"; heatUp: HeatUpRun; mapping: Omit<HeatUpMapping, "captureId" | "temperatureAccuracy"> }
);

export type DemoRun = {
  id: string;
  labSlug: "wrenford-bench" | "cedar-hollow-shop";
  reviewerEmail: string;
  toolSlug: string;
  protocolSlug: string;
  testedDaysAgo: number;
  unit: TestedUnit;
  conditionOverrides: { measuredSupplyVoltage: number; ambientC: number };
  notes: string;
  /** Serial numbers of the lab's instruments in the register. */
  instrumentSerials: string[];
  readings: { id: string; kind: MeasurementKind; values: number[]; instrumentSerial: string | null; note: string }[];
  captures: DemoCapture[];
};

export const demoRuns: DemoRun[] = [
  {
    id: "5eed0002-7e57-4b00-8000-000000000001",
    labSlug: "wrenford-bench",
    reviewerEmail: "nadia.orlen@benchplate.test",
    toolSlug: "quillfern-aeris-720",
    protocolSlug: "hot-air-station-bench-protocol",
    testedDaysAgo: 10,
    unit: { serialNumber: "AE720-2291-0457", firmware: "1.08", voltageVariant: "230 V, EU plug", source: "bought", sourceNote: null },
    conditionOverrides: { measuredSupplyVoltage: 229.2, ambientC: 22.5 },
    notes: "Station fed through the isolation transformer; the scope's ground stayed on its own isolated channel.",
    instrumentSerials: ["HC40-218770", "VT22-04157", "TK52-30981", "VA8-11206"],
    readings: [
      { id: "5eed0002-7e57-4b00-8100-000000000001", kind: "airflow", values: [118.2, 121.5, 119.8, 120.9, 117.6], instrumentSerial: "VA8-11206", note: "From the vane reading and the 6 mm bore, at maximum airflow." },
      { id: "5eed0002-7e57-4b00-8100-000000000002", kind: "standby_power", values: [2.1, 2.0, 2.2], instrumentSerial: null, note: "Handle in its cradle, display on." },
      { id: "5eed0002-7e57-4b00-8100-000000000003", kind: "temperature_vs_setpoint", values: [343, 347, 345, 341, 346], instrumentSerial: "TK52-30981", note: "Outlet at 5 mm, setpoint 350 °C." },
    ],
    captures: [
      {
        id: "5eed0002-7e57-4b00-8200-000000000001",
        analysisId: "5eed0002-7e57-4b00-8300-000000000001",
        kind: "waveform",
        fileName: "aeris-720-full-power.csv",
        layout: {
          header: ["# Veymouth Test VT-2204 isolated-channel scope, CSV export", "Record Length,40000", "Sample Interval,1.0000E-04", "CH1 Probe,clamp 100 mV/A", "CH2 Probe,100:1 (scaled in scope)"],
          columns: ["Time (s)", "CH1 (V)", "CH2 (V)"],
          delimiter: ",",
        },
        heater: {
          supplyVoltage: 230,
          frequencyHz: 50,
          heaterOhms: 75.5,
          sourceOhms: 0.4,
          sampleRateHz: 10_000,
          seconds: 4,
          burst: { onCycles: 3, offCycles: 2 },
          fullDemandSeconds: 1,
          currentColumnScale: 10,
          noise: { amps: 0.01, volts: 0.3 },
          seed: 720,
        },
        mapping: {
          currentColumn: "CH1 (V)",
          currentScale: 10,
          voltageColumn: "CH2 (V)",
          voltageScale: 1,
          timeColumn: "Time (s)",
          harmonicClass: "A",
          dmaxLimitPercent: 4,
          rule: "simple",
        },
      },
      {
        id: "5eed0002-7e57-4b00-8200-000000000002",
        analysisId: "5eed0002-7e57-4b00-8300-000000000002",
        kind: "heat_up_log",
        fileName: "aeris-720-heat-up.csv",
        layout: { header: ["Tarrow Meters TK-52 logger export", "Channel,TC1 type K at 5 mm", "Interval,0.5 s"], columns: ["Elapsed (s)", "TC1 (°C)"], delimiter: "," },
        heatUp: { ambientC: 22.5, setpointC: 350, deadTimeS: 1.5, timeConstantS: 5.5, overshootC: 7, rippleC: 1.2, intervalS: 0.5, seconds: 90, noiseC: 0.3, seed: 350 },
        mapping: { temperatureColumn: "TC1 (°C)", temperatureScale: 1, timeColumn: "Elapsed (s)", setpointC: 350, bandC: 15, rule: "simple" },
      },
    ],
  },
  {
    id: "5eed0002-7e57-4b00-8000-000000000002",
    labSlug: "cedar-hollow-shop",
    reviewerEmail: "teodor.wylde@benchplate.test",
    toolSlug: "tessaly-rw-6-duet",
    protocolSlug: "soldering-station-bench-protocol",
    testedDaysAgo: 6,
    unit: { serialNumber: "RW6D-118-30462", firmware: null, voltageVariant: "120 V, NEMA 5-15 plug", source: "loaned", sourceNote: "Loaned by a reader for two weeks; no tie to the maker." },
    conditionOverrides: { measuredSupplyVoltage: 119.4, ambientC: 21.5 },
    notes: "Hot-air handle at maximum airflow for the waveform; the iron idle in its stand.",
    instrumentSerials: ["PM300-77415", "HC20-50442", "VT11-02290", "TK31-66120", "RM10-09813"],
    readings: [
      { id: "5eed0002-7e57-4b00-8100-000000000011", kind: "power_input_full_demand", values: [684, 688, 686], instrumentSerial: "PM300-77415", note: "Hot-air handle lifted, full demand." },
      { id: "5eed0002-7e57-4b00-8100-000000000012", kind: "tip_to_ground_resistance", values: [0.82, 0.88, 0.85], instrumentSerial: "RM10-09813", note: "Tip to the earth pin, iron at 350 °C." },
      { id: "5eed0002-7e57-4b00-8100-000000000013", kind: "heat_up_time", values: [27.5, 28.9, 26.8], instrumentSerial: null, note: "Stopwatch from switch-on to the display's ready mark." },
    ],
    captures: [
      {
        id: "5eed0002-7e57-4b00-8200-000000000011",
        analysisId: "5eed0002-7e57-4b00-8300-000000000011",
        kind: "waveform",
        fileName: "rw-6-duet-hot-air.tsv",
        layout: { header: ["Veymouth Test VT-1104 waveform export", "Timebase\t0.1 ms/pt"], columns: ["Time", "Current (A)", "Voltage (V)"], delimiter: "\t" },
        heater: {
          supplyVoltage: 120,
          frequencyHz: 60,
          heaterOhms: 19.6,
          sourceOhms: 0.25,
          sampleRateHz: 10_000,
          seconds: 4,
          burst: { onCycles: 4, offCycles: 2 },
          fullDemandSeconds: 1.5,
          currentColumnScale: 1,
          noise: { amps: 0.02, volts: 0.2 },
          seed: 120,
        },
        mapping: {
          currentColumn: "Current (A)",
          currentScale: 1,
          voltageColumn: "Voltage (V)",
          voltageScale: 1,
          timeColumn: "Time",
          harmonicClass: "A",
          dmaxLimitPercent: 4,
          // IEC 61000-3-3 has no reference impedance for 120 V: this is the loop impedance measured at the bench socket.
          impedanceResistanceOhm: 0.25,
          impedanceReactanceOhm: 0.15,
          rule: "simple",
        },
      },
      {
        id: "5eed0002-7e57-4b00-8200-000000000012",
        analysisId: "5eed0002-7e57-4b00-8300-000000000012",
        kind: "heat_up_log",
        fileName: "rw-6-duet-iron-heat-up.csv",
        layout: { header: ["Tarrow Meters TK-31 tip thermometer log"], columns: ["t (s)", "Tip (°C)"], delimiter: "," },
        heatUp: { ambientC: 21.5, setpointC: 350, deadTimeS: 1, timeConstantS: 7, overshootC: 4, rippleC: 0.8, intervalS: 0.5, seconds: 100, noiseC: 0.4, seed: 31 },
        mapping: { temperatureColumn: "Tip (°C)", temperatureScale: 1, timeColumn: "t (s)", setpointC: 350, bandC: 10, rule: "simple" },
      },
    ],
  },
];

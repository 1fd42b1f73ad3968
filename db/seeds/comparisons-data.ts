import { demoRuns, type DemoRun } from "./bench-runs-data";

// A second tool measured at the Wrenford bench under the same protocol version and conditions as the Aeris 720, and
// published, so the demo has a pair of tools compared on equal terms beside the pair from different labs and supplies.
// Tested before the Aeris 720, so the Wrenford draft (made from the lab's latest run) stays on that tool.

type DemoCapture = DemoRun["captures"][number];

// The Aeris 720's run: the same scope, logger, probes, column mapping and instruments serve this one.
const aerisRun = demoRuns.find((run) => run.toolSlug === "quillfern-aeris-720")!;
const aerisWaveform = aerisRun.captures.find((capture): capture is Extract<DemoCapture, { kind: "waveform" }> => capture.kind === "waveform")!;
const aerisHeatUp = aerisRun.captures.find((capture): capture is Extract<DemoCapture, { kind: "heat_up_log" }> => capture.kind === "heat_up_log")!;

export const comparisonRun: DemoRun = {
  id: "5eed0006-7e57-4b00-8000-000000000001",
  labSlug: "wrenford-bench",
  reviewerEmail: "nadia.orlen@benchplate.test",
  toolSlug: "tessaly-spot-300",
  protocolSlug: "hot-air-station-bench-protocol",
  testedDaysAgo: 14,
  unit: { serialNumber: "SP300-0871-2214", firmware: "2.3", voltageVariant: "230 V, EU plug", source: "bought", sourceNote: null },
  conditionOverrides: { measuredSupplyVoltage: 229.6, ambientC: 23.4 },
  notes: "Same bench, supply and protocol version as the Aeris 720; the station's own micro nozzle stayed in the box.",
  instrumentSerials: aerisRun.instrumentSerials,
  readings: [
    { id: "5eed0006-7e57-4b00-8100-000000000001", kind: "airflow", values: [38.9, 40.6, 39.4, 41.1, 39.8], instrumentSerial: "VA8-11206", note: "From the vane reading and the 6 mm bore, at maximum airflow." },
    { id: "5eed0006-7e57-4b00-8100-000000000002", kind: "temperature_vs_setpoint", values: [352, 356, 349, 354, 353], instrumentSerial: "TK52-30981", note: "Outlet at 5 mm, setpoint 350 °C." },
  ],
  captures: [
    {
      id: "5eed0006-7e57-4b00-8200-000000000001",
      analysisId: "5eed0006-7e57-4b00-8300-000000000001",
      kind: "waveform",
      fileName: "spot-300-full-power.csv",
      layout: aerisWaveform.layout,
      heater: {
        supplyVoltage: 230,
        frequencyHz: 50,
        heaterOhms: 181,
        sourceOhms: 0.4,
        sampleRateHz: 10_000,
        seconds: 4,
        burst: { onCycles: 2, offCycles: 3 },
        fullDemandSeconds: 1,
        currentColumnScale: 10,
        noise: { amps: 0.01, volts: 0.3 },
        seed: 300,
      },
      mapping: aerisWaveform.mapping,
    },
    {
      id: "5eed0006-7e57-4b00-8200-000000000002",
      analysisId: "5eed0006-7e57-4b00-8300-000000000002",
      kind: "heat_up_log",
      fileName: "spot-300-heat-up.csv",
      layout: aerisHeatUp.layout,
      heatUp: { ambientC: 23.4, setpointC: 350, deadTimeS: 1, timeConstantS: 4, overshootC: 11, rippleC: 1.8, intervalS: 0.5, seconds: 90, noiseC: 0.3, seed: 301 },
      mapping: aerisHeatUp.mapping,
    },
  ],
};

export const comparisonPublication = {
  id: "5eed0006-7e57-4b00-8400-000000000001",
  slug: "tessaly-spot-300-on-the-wrenford-bench",
  title: "Tessaly Spot 300: a small station on the same bench as the Aeris 720",
  labels: { waveform: "full-power", heatUp: "heat-up" },
  body: ({ waveform, heatUp }: { waveform: string; heatUp: string }) =>
    [
      "## In short\n\nThe Spot 300 went through the same protocol version, on the same 230 V supply and with the same nozzle and setpoints as the Aeris 720, a few days before it, so the two can be compared figure for figure.",
      "<SafetyNotice />",
      `## Power input against the rating\n\n<VerdictTable analysis="${waveform}" />`,
      `## How the controller switches\n\n<ConductionMap analysis="${waveform}" />\n\n<HarmonicChart analysis="${waveform}" />`,
      `## Heat-up\n\n<HeatUpCurve analysis="${heatUp}" />\n\n<VerdictTable analysis="${heatUp}" />`,
      "## Rated against measured\n\n<SpecTable />",
    ].join("\n\n"),
};

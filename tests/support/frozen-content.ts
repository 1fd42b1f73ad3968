import type { FrozenReportContent, FrozenRun } from "@/db/schema";
import type { PublishedRevisionSource } from "@/lib/published-results";

// Frozen report content built in memory, shaped as freezeReport stores it, for pure tests of what readers see.

type FrozenAnalysis = FrozenReportContent["analyses"][number];
type FrozenMeasurement = FrozenReportContent["measurements"][number];
type FrozenTool = FrozenReportContent["tools"][number];

export function frozenTool(overrides: Partial<FrozenTool> = {}): FrozenTool {
  return {
    id: "tool-aeris",
    slug: "quillfern-aeris-720",
    name: "Quillfern Thermal Aeris 720",
    ratedPowerW: 720,
    ratedVoltageMin: 230,
    ratedVoltageMax: 230,
    ratedFrequenciesHz: [50],
    ratedAirflowLpm: 120,
    temperatureMinC: 100,
    temperatureMaxC: 480,
    claimedHeatUpSeconds: 25,
    ...overrides,
  };
}

export function frozenRun(overrides: Partial<FrozenRun> = {}): FrozenRun {
  return {
    id: "run-1",
    testedOn: "2026-11-21",
    labName: "Wrenford Bench",
    toolName: "Quillfern Thermal Aeris 720",
    protocol: { name: "Hot-air station bench protocol", version: 2, summary: "Power, airflow and heat-up.", safetyCautions: "Isolate the supply." },
    conditions: {
      supplyVoltage: 230,
      supplyFrequencyHz: 50,
      measuredSupplyVoltage: 229.2,
      ambientC: 22.5,
      nozzle: "6 mm round nozzle",
      airflowSetpoint: "Maximum",
      temperatureSetpointC: 350,
      measuringDistanceMm: 5,
      warmUpMinutes: 5,
    },
    unit: { serialNumber: "AE720-0001", firmware: null, voltageVariant: "230 V", source: "bought", sourceNote: null },
    instruments: [],
    ...overrides,
  };
}

/** A stored waveform result with the fields the figures read, flicker included. */
export function waveformResult(overrides: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    frequencyHz: 50,
    capture: { durationSeconds: 4, samples: 200_000 },
    current: { rms: 2.54, peak: 4.4, crestFactor: 1.73 },
    voltage: { rms: 229.1, peak: 324 },
    power: { real: 486, apparent: 582, factor: 0.83, whileConducting: 693.3 },
    halfCycles: { count: 400, conducting: 280, duty: 0.7, switchesPerMinute: 906.8, longestOffSeconds: 0.04, firing: "burst-fire", asymmetric: false },
    harmonics: {
      class: "A",
      applicable: true,
      notApplicableReason: null,
      status: "within limits",
      thdPercent: 12.5,
      fundamentalAmps: 2.4,
      orders: [{ order: 3, amps: 0.2, limitAmps: 2.3, withinLimit: true }],
    },
    verdict: null,
    flicker: {
      pst: 1.72,
      pstLimit: 1,
      dcPercent: 0,
      dcLimitPercent: 3.3,
      dmaxPercent: 0.54,
      dmaxLimitPercent: 4,
      tmaxSeconds: 0,
      tmaxLimitSeconds: 0.5,
      changesPerMinute: 906.8,
      impedance: { resistanceOhm: 0.4, reactanceOhm: 0.25, source: "IEC 61000-3-3 reference" },
      analytical: { pst: 1.6, valid: false, note: "above 40 changes/min" },
      assumptions: ["The capture is repeated to fill 10 minutes."],
    },
    flickerUnavailableReason: null,
    ...overrides,
  };
}

export function heatUpResult(): Record<string, unknown> {
  return {
    heatUp: {
      setpointC: 350,
      band: { lowerC: 345, upperC: 355, description: "±5 °C" },
      startTemperatureC: 23,
      bandEntryS: 17.9,
      finalTemperatureC: 350.1,
      t63S: 9.1,
      t90S: 14.2,
      overshootC: 2.3,
      steadyState: { standardDeviation: 0.93 },
    },
  };
}

export function frozenAnalysis(overrides: Partial<FrozenAnalysis> = {}): FrozenAnalysis {
  return {
    label: "full-power",
    analysisId: "analysis-waveform",
    status: "done",
    analysisVersion: "1.0.0",
    result: waveformResult(),
    displaySeries: { halfCycles: { halfCycleSeconds: 0.01, rmsCurrent: [3, 0, 3], conducting: [true, false, true] } },
    captureKind: "waveform",
    captureFileName: "aeris-full-power.csv",
    runId: "run-1",
    testedOn: "2026-11-21",
    labName: "Wrenford Bench",
    toolId: "tool-aeris",
    toolSlug: "quillfern-aeris-720",
    toolName: "Quillfern Thermal Aeris 720",
    ...overrides,
  };
}

/** A power-input verdict with every number lib/bench/verdict stores, normalised to the rated voltage. */
export function powerVerdict(overrides: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    rated: 720,
    measured: 693.3,
    normalized: 700.65,
    normalizedTo: 230,
    lower: 648,
    upper: 756,
    acceptanceLower: 648,
    acceptanceUpper: 756,
    expandedUncertainty: 23.42,
    rule: "simple",
    result: "meets rating",
    tolerance: { source: "IEC 60335-1 clause 10.1, Table 1", row: "heating appliances > 200 W" },
    coverageFactor: 2,
    ...overrides,
  };
}

export function frozenMeasurement(overrides: Partial<FrozenMeasurement> = {}): FrozenMeasurement {
  return {
    runId: "run-1",
    analysisId: "analysis-waveform",
    kind: "power_input_full_demand",
    source: "analysis",
    value: 700.65,
    unit: "W",
    expandedUncertainty: 23.42,
    verdict: powerVerdict(),
    ...overrides,
  };
}

export function frozenContent(overrides: Partial<FrozenReportContent> = {}): FrozenReportContent {
  return {
    title: "Aeris 720 on the desk",
    disclosure: "Bought at retail by the reviewer.",
    author: { id: "author-1", name: "Nadia Orlen" },
    runs: [frozenRun()],
    tools: [frozenTool()],
    analyses: [
      frozenAnalysis(),
      frozenAnalysis({ label: "heat-up", analysisId: "analysis-heat-up", captureKind: "heat_up_log", captureFileName: "aeris-heat-up.csv", result: heatUpResult(), displaySeries: null }),
    ],
    measurements: [
      frozenMeasurement(),
      frozenMeasurement({ kind: "airflow", source: "manual", analysisId: null, value: 119.6, unit: "L/min", expandedUncertainty: 1.5, verdict: null }),
      frozenMeasurement({ kind: "heat_up_time", analysisId: "analysis-heat-up", value: 17.92, unit: "s", expandedUncertainty: 0.58, verdict: null }),
    ],
    images: [],
    ...overrides,
  };
}

export function publishedSource(
  content: FrozenReportContent = frozenContent(),
  overrides: { status?: "published" | "retracted"; retractionReason?: string | null; slug?: string; revisionNumber?: number } = {},
): PublishedRevisionSource {
  return {
    report: { slug: overrides.slug ?? "aeris-720-on-the-desk", status: overrides.status ?? "published", retractionReason: overrides.retractionReason ?? null },
    revision: { id: `revision-${overrides.revisionNumber ?? 1}`, number: overrides.revisionNumber ?? 1, kind: "original", publishedAt: "2026-12-01T09:00:00.000Z" },
    content,
  };
}

/** The default content with a real tool in place of the made-up one, so queries and pages find it by the tool's slug. */
export function frozenContentForTool(tool: { id: string; slug: string; name: string }, overrides: Partial<FrozenReportContent> = {}): FrozenReportContent {
  const base = frozenContent();
  return frozenContent({
    tools: [frozenTool({ id: tool.id, slug: tool.slug, name: tool.name })],
    runs: base.runs.map((run) => ({ ...run, toolName: tool.name })),
    analyses: base.analyses.map((analysis) => ({ ...analysis, toolId: tool.id, toolSlug: tool.slug, toolName: tool.name })),
    ...overrides,
  });
}

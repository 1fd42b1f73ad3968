import { describe, expect, it } from "vitest";
import { flattenPublishedResults, groupResultsByQuantity, listPublishedAnalyses, readFlickerFigures } from "@/lib/published-results";
import {
  frozenAnalysis,
  frozenContent,
  frozenMeasurement,
  frozenRun,
  frozenTool,
  powerVerdict,
  publishedSource,
  waveformResult,
} from "../support/frozen-content";

describe("flattenPublishedResults", () => {
  it("gives one row per frozen measurement with its tool, run, verdict numbers and report", () => {
    const rows = flattenPublishedResults(publishedSource());
    expect(rows.map((row) => row.kind)).toEqual(["power_input_full_demand", "airflow", "heat_up_time"]);
    const power = rows[0]!;
    expect(power).toMatchObject({
      tool: { id: "tool-aeris", slug: "quillfern-aeris-720", name: "Quillfern Thermal Aeris 720" },
      quantity: "Power input at full demand",
      value: 700.65,
      unit: "W",
      expandedUncertainty: 23.42,
      source: "analysis",
      analysis: { id: "analysis-waveform", label: "full-power" },
      report: { slug: "aeris-720-on-the-desk", title: "Aeris 720 on the desk", revisionNumber: 1, retracted: false, publishedAt: "2026-12-01T09:00:00.000Z" },
      run: {
        id: "run-1",
        testedOn: "2026-11-21",
        labName: "Wrenford Bench",
        protocol: { name: "Hot-air station bench protocol", version: 2 },
        conditions: { supplyVoltage: 230, supplyFrequencyHz: 50, measuredSupplyVoltage: 229.2, nozzle: "6 mm round nozzle", temperatureSetpointC: 350 },
      },
    });
    expect(power.verdict).toMatchObject({
      rated: 720,
      normalized: 700.65,
      normalizedTo: 230,
      lower: 648,
      upper: 756,
      acceptanceLower: 648,
      acceptanceUpper: 756,
      rule: "simple",
      result: "meets rating",
    });
    expect(rows[1]).toMatchObject({ source: "manual", analysis: null, verdict: null });
  });

  it("leaves normalisation null when the verdict has none, and drops a verdict that does not parse", () => {
    const content = frozenContent({
      measurements: [
        frozenMeasurement({ kind: "airflow", verdict: powerVerdict({ normalized: undefined, normalizedTo: undefined, rated: 120 }) }),
        frozenMeasurement({ kind: "current", verdict: { result: "fine" } }),
      ],
    });
    const rows = flattenPublishedResults(publishedSource(content));
    const airflow = rows.find((row) => row.kind === "airflow");
    const current = rows.find((row) => row.kind === "current");
    expect(airflow?.verdict).toMatchObject({ rated: 120, normalized: null, normalizedTo: null });
    expect(current?.verdict).toBeNull();
  });

  it("keeps only the asked tool's rows in a head-to-head", () => {
    const rival = frozenTool({ id: "tool-brisa", slug: "brisa-850", name: "Brisa 850" });
    const content = frozenContent({
      tools: [frozenTool(), rival],
      runs: [frozenRun(), frozenRun({ id: "run-2", testedOn: "2026-11-22", toolName: "Brisa 850" })],
      analyses: [frozenAnalysis(), frozenAnalysis({ analysisId: "analysis-brisa", label: "brisa-power", runId: "run-2", toolId: rival.id, toolSlug: rival.slug, toolName: rival.name })],
      measurements: [frozenMeasurement(), frozenMeasurement({ runId: "run-2", analysisId: "analysis-brisa", value: 812 })],
    });
    expect(flattenPublishedResults(publishedSource(content), { toolSlug: "brisa-850" }).map((row) => [row.tool.slug, row.value, row.run.id])).toEqual([
      ["brisa-850", 812, "run-2"],
    ]);
    expect(flattenPublishedResults(publishedSource(content))).toHaveLength(2);
  });

  it("marks every row of a retracted report", () => {
    const rows = flattenPublishedResults(publishedSource(frozenContent(), { status: "retracted", retractionReason: "Wrong clamp scale." }));
    expect(rows.every((row) => row.report.retracted && row.report.retractionReason === "Wrong clamp scale.")).toBe(true);
  });
});

describe("groupResultsByQuantity", () => {
  it("groups rows of several reports by quantity in the catalogue's order, oldest test first", () => {
    const later = frozenContent({ runs: [frozenRun({ testedOn: "2027-01-10" })], measurements: [frozenMeasurement({ value: 705 })] });
    const rows = [...flattenPublishedResults(publishedSource(later, { slug: "second-look", revisionNumber: 2 })), ...flattenPublishedResults(publishedSource())];
    const groups = groupResultsByQuantity(rows);
    expect(groups.map((group) => group.kind)).toEqual(["power_input_full_demand", "airflow", "heat_up_time"]);
    expect(groups[0]?.results.map((row) => [row.report.slug, row.value])).toEqual([
      ["aeris-720-on-the-desk", 700.65],
      ["second-look", 705],
    ]);
  });

  it("puts a retracted report's results after the standing ones of the same quantity", () => {
    const earlier = frozenContent({ runs: [frozenRun({ testedOn: "2026-01-05" })], measurements: [frozenMeasurement({ value: 640 })] });
    const rows = [...flattenPublishedResults(publishedSource(earlier, { slug: "withdrawn", status: "retracted" })), ...flattenPublishedResults(publishedSource())];
    expect(groupResultsByQuantity(rows)[0]?.results.map((row) => row.report.slug)).toEqual(["aeris-720-on-the-desk", "withdrawn"]);
  });
});

describe("listPublishedAnalyses", () => {
  it("parses waveform, flicker and heat-up figures of the cited analyses", () => {
    const [waveform, heatUp] = listPublishedAnalyses(publishedSource());
    expect(waveform).toMatchObject({ label: "full-power", captureKind: "waveform", run: { id: "run-1", protocol: { version: 2 } } });
    expect(waveform?.waveform?.halfCycles.firing).toBe("burst-fire");
    expect(waveform?.flicker).toMatchObject({ pst: 1.72, dmaxPercent: 0.54, impedance: { source: "IEC 61000-3-3 reference" } });
    expect(waveform?.displaySeries?.halfCycles?.conducting).toEqual([true, false, true]);
    expect(heatUp).toMatchObject({ label: "heat-up", waveform: null, flicker: null, flickerUnavailableReason: null, heatUp: { t90S: 14.2 } });
  });

  it("skips analyses of other tools and unfinished ones", () => {
    const content = frozenContent({ analyses: [frozenAnalysis({ status: "failed" }), frozenAnalysis({ label: "other", toolSlug: "brisa-850" })] });
    expect(listPublishedAnalyses(publishedSource(content), { toolSlug: "quillfern-aeris-720" })).toEqual([]);
  });
});

describe("readFlickerFigures", () => {
  it("gives the bench code's reason when no estimate was possible", () => {
    const reason = "IEC 61000-3-3 defines no reference impedance for a 120 V / 60 Hz supply";
    expect(readFlickerFigures(waveformResult({ flicker: null, flickerUnavailableReason: reason }))).toEqual({ figures: null, unavailableReason: reason });
  });

  it("says so when an older result stored no flicker at all", () => {
    expect(readFlickerFigures({ frequencyHz: 50 }).unavailableReason).toMatch(/no flicker estimate/i);
  });
});

import { describe, expect, it } from "vitest";
import { chooseComparisonSide, pairQuantities } from "@/lib/comparison";
import { flattenPublishedResults, listPublishedAnalyses, type PublishedRevisionSource } from "@/lib/published-results";
import { frozenAnalysis, frozenContent, frozenMeasurement, frozenRun, heatUpResult, powerVerdict, publishedSource } from "../support/frozen-content";

const heatUpSeries = { heatUp: { timeS: [0, 1], temperatureC: [23, 40], setpointC: 350 } };

/** One published report on the default tool whose run was tested on the given day, with a power result of the given value. */
function reportTestedOn(testedOn: string, { slug, power, status }: { slug: string; power: number; status?: "published" | "retracted" }) {
  const runId = `run-${testedOn}`;
  const content = frozenContent({
    runs: [frozenRun({ id: runId, testedOn })],
    analyses: [
      frozenAnalysis({ runId, testedOn, analysisId: `waveform-${slug}` }),
      frozenAnalysis({ runId, testedOn, label: "heat-up", analysisId: `heat-up-${slug}`, captureKind: "heat_up_log", result: heatUpResult(), displaySeries: heatUpSeries }),
    ],
    measurements: [
      frozenMeasurement({ runId, analysisId: `waveform-${slug}`, value: power, verdict: powerVerdict({ normalized: power }) }),
      frozenMeasurement({ runId, kind: "airflow", source: "manual", analysisId: null, value: 119.6, unit: "L/min", expandedUncertainty: 1.5, verdict: null }),
    ],
  });
  return publishedSource(content, { slug, status, retractionReason: status === "retracted" ? "The clamp was out of calibration." : null });
}

function side(...sources: PublishedRevisionSource[]) {
  return chooseComparisonSide({
    results: sources.flatMap((source) => flattenPublishedResults(source)),
    analyses: sources.flatMap((source) => listPublishedAnalyses(source)),
  });
}

describe("chooseComparisonSide", () => {
  it("shows one result per quantity, the most recently tested, with the run and analyses behind it", () => {
    const chosen = side(reportTestedOn("2026-10-02", { slug: "older", power: 690 }), reportTestedOn("2026-11-21", { slug: "newer", power: 705 }));
    expect(chosen.results.map((result) => [result.kind, result.report.slug])).toEqual([
      ["power_input_full_demand", "newer"],
      ["airflow", "newer"],
    ]);
    expect(chosen.results[0]!.value).toBe(705);
    expect(chosen.waveform?.report.slug).toBe("newer");
    expect(chosen.heatUp?.report.slug).toBe("newer");
    expect(chosen.runs.map((run) => run.testedOn)).toEqual(["2026-11-21"]);
    expect(chosen.retracted).toEqual([]);
  });

  it("leaves a retracted report's results out and names the report with how many it held", () => {
    const chosen = side(reportTestedOn("2026-10-02", { slug: "standing", power: 690 }), reportTestedOn("2026-11-21", { slug: "withdrawn", power: 705, status: "retracted" }));
    expect(chosen.results.every((result) => result.report.slug === "standing")).toBe(true);
    expect(chosen.waveform?.report.slug).toBe("standing");
    expect(chosen.retracted).toHaveLength(1);
    expect(chosen.retracted[0]).toMatchObject({ report: { slug: "withdrawn", retractionReason: "The clamp was out of calibration." }, results: 2 });
    expect(chosen.runs.map((run) => run.testedOn)).toEqual(["2026-10-02"]);
  });

  it("takes a judged capture's result over a hand reading of the same run", () => {
    const content = frozenContent({
      measurements: [
        frozenMeasurement({ source: "manual", analysisId: null, value: 688, verdict: powerVerdict({ normalized: null, normalizedTo: null, measured: 688 }) }),
        frozenMeasurement({ value: 700.65 }),
        frozenMeasurement({ source: "manual", analysisId: null, value: 701, verdict: null }),
      ],
    });
    const [power] = side(publishedSource(content)).results;
    expect(power).toMatchObject({ source: "analysis", value: 700.65 });
  });

  it("shows nothing, and no run, for a tool without published results", () => {
    expect(side()).toEqual({ results: [], waveform: null, heatUp: null, retracted: [], runs: [] });
  });
});

describe("pairQuantities", () => {
  it("lines up every quantity either tool has, in the catalogue's order, with null where one has none", () => {
    const a = side(reportTestedOn("2026-11-21", { slug: "a", power: 700 })).results;
    const b = side(publishedSource(frozenContent({ measurements: [frozenMeasurement({ kind: "heat_up_time", analysisId: null, value: 17.9, unit: "s", verdict: null })] }))).results;
    expect(pairQuantities(a, b).map((pair) => [pair.kind, pair.a?.value ?? null, pair.b?.value ?? null])).toEqual([
      ["power_input_full_demand", 700, null],
      ["airflow", 119.6, null],
      ["heat_up_time", null, 17.9],
    ]);
  });
});

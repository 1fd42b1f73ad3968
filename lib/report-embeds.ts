// The data behind a report's embedded figures, as the server hands it to the page or the live preview. Stored
// analysis results are JSON written by the bench code; they are read here through schemas of only the fields the
// figures show, so an older result without some field shows "not available" instead of breaking the page.
// Free of server imports: the preview renders in the browser.

import { z } from "zod";
import type { DisplaySeries, MeasurementKind } from "@/db/schema";
import { measurementKindInfo } from "@/lib/measurement-kinds";

const nullableNumber = z.number().nullable();

/** A verdict as lib/bench/verdict stores it (power input or a protocol rating): every number that produced it. */
export const storedVerdictSchema = z.object({
  rated: z.number(),
  measured: z.number(),
  normalized: nullableNumber.optional(),
  normalizedTo: nullableNumber.optional(),
  lower: nullableNumber,
  upper: nullableNumber,
  acceptanceLower: nullableNumber,
  acceptanceUpper: nullableNumber,
  expandedUncertainty: z.number(),
  rule: z.enum(["simple", "guarded"]),
  result: z.enum(["meets rating", "above rating", "below rating", "inconclusive"]),
  tolerance: z.object({ source: z.string(), description: z.string().optional(), row: z.string().optional() }),
});

export type StoredVerdict = z.infer<typeof storedVerdictSchema>;
export type VerdictResult = StoredVerdict["result"];

export type VerdictRow = { quantity: string; unit: string; verdict: StoredVerdict };

const waveformFiguresSchema = z.object({
  frequencyHz: z.number(),
  capture: z.object({ durationSeconds: z.number(), samples: z.number() }),
  current: z.object({ rms: z.number(), peak: z.number(), crestFactor: nullableNumber }),
  voltage: z.object({ rms: z.number(), peak: z.number() }).nullable(),
  power: z.object({ real: z.number(), apparent: z.number(), factor: nullableNumber, whileConducting: nullableNumber }).nullable(),
  halfCycles: z.object({
    count: z.number(),
    conducting: z.number(),
    duty: z.number(),
    switchesPerMinute: z.number(),
    longestOffSeconds: z.number(),
    firing: z.string(),
    asymmetric: z.boolean(),
  }),
  harmonics: z.object({
    class: z.enum(["A", "B"]),
    applicable: z.boolean(),
    notApplicableReason: z.string().nullable(),
    status: z.string(),
    thdPercent: nullableNumber,
    fundamentalAmps: z.number(),
    orders: z.array(z.object({ order: z.number(), amps: z.number(), limitAmps: nullableNumber, withinLimit: z.boolean().nullable() })),
  }),
  verdict: storedVerdictSchema.nullable(),
});

export type WaveformFigures = z.infer<typeof waveformFiguresSchema>;

const heatUpFiguresSchema = z.object({
  setpointC: z.number(),
  band: z.object({ lowerC: z.number(), upperC: z.number(), description: z.string() }),
  startTemperatureC: z.number(),
  bandEntryS: nullableNumber,
  finalTemperatureC: z.number(),
  t63S: nullableNumber,
  t90S: nullableNumber,
  overshootC: z.number(),
  steadyState: z.object({ standardDeviation: z.number() }),
});

export type HeatUpFigures = z.infer<typeof heatUpFiguresSchema>;

export function readWaveformFigures(result: unknown): WaveformFigures | null {
  const parsed = waveformFiguresSchema.safeParse(result);
  return parsed.success ? parsed.data : null;
}

/** A heat-up result is the bench code's HeatUp object, at the top or under `heatUp` beside the verdicts. */
export function readHeatUpFigures(result: unknown): HeatUpFigures | null {
  const direct = heatUpFiguresSchema.safeParse(result);
  if (direct.success) return direct.data;
  const nested = heatUpFiguresSchema.safeParse((result as { heatUp?: unknown } | null)?.heatUp);
  return nested.success ? nested.data : null;
}

export type EmbedAnalysis = {
  label: string;
  analysisId: string;
  captureKind: "waveform" | "heat_up_log";
  captureFileName: string;
  status: "queued" | "running" | "done" | "failed";
  analysisVersion: string | null;
  run: { id: string; testedOn: string; labName: string };
  tool: { slug: string; name: string };
  waveform: WaveformFigures | null;
  heatUp: HeatUpFigures | null;
  displaySeries: DisplaySeries | null;
  verdicts: VerdictRow[];
};

export type EmbedMeasurement = {
  kind: MeasurementKind;
  quantity: string;
  unit: string;
  value: number;
  expandedUncertainty: number | null;
  source: "analysis" | "manual";
  verdict: StoredVerdict | null;
};

export type EmbedTool = {
  slug: string;
  name: string;
  ratings: {
    ratedPowerW: number;
    ratedVoltageMin: number;
    ratedVoltageMax: number;
    ratedFrequenciesHz: number[];
    ratedAirflowLpm: number | null;
    temperatureMinC: number | null;
    temperatureMaxC: number | null;
    claimedHeatUpSeconds: number | null;
  };
  measurements: EmbedMeasurement[];
};

export type EmbedImage = { name: string; src: string; altText: string; width: number; height: number };

export type ReportEmbeds = {
  analyses: Record<string, EmbedAnalysis>;
  images: Record<string, EmbedImage>;
  tools: EmbedTool[];
};

/**
 * What a report's figures are made from, as the database holds it: the cited analyses (their stored results and
 * display series), the measurements of their runs, the tools' ratings and the images. Plain JSON, so a published
 * revision can keep it frozen and feed the same assembly as a draft does.
 */
export type ReportEmbedSources = {
  analyses: {
    label: string;
    analysisId: string;
    status: EmbedAnalysis["status"];
    analysisVersion: string | null;
    result: Record<string, unknown> | null;
    displaySeries: DisplaySeries | null;
    captureKind: EmbedAnalysis["captureKind"];
    captureFileName: string;
    runId: string;
    testedOn: string;
    labName: string;
    toolId: string;
    toolSlug: string;
    toolName: string;
  }[];
  tools: ({ id: string; slug: string; name: string } & EmbedTool["ratings"])[];
  measurements: {
    runId: string;
    analysisId: string | null;
    kind: MeasurementKind;
    source: EmbedMeasurement["source"];
    value: number;
    unit: string;
    expandedUncertainty: number | null;
    verdict: unknown;
  }[];
  images: { id: string; name: string; altText: string; width: number; height: number }[];
};

function readVerdict(value: unknown): StoredVerdict | null {
  const parsed = storedVerdictSchema.safeParse(value);
  return parsed.success ? parsed.data : null;
}

/** The figures' data from their sources: each cited analysis by label with its verdicts, each tool with its measurements. */
export function assembleReportEmbeds({ analyses: cited, tools: toolRows, measurements: measurementRows, images: imageRows }: ReportEmbedSources): ReportEmbeds {
  const embedMeasurement = (row: ReportEmbedSources["measurements"][number]): EmbedMeasurement => ({
    kind: row.kind,
    quantity: measurementKindInfo[row.kind].label,
    unit: row.unit,
    value: row.value,
    expandedUncertainty: row.expandedUncertainty,
    source: row.source,
    verdict: readVerdict(row.verdict),
  });

  const analysesByLabel: Record<string, EmbedAnalysis> = {};
  for (const row of cited) {
    const waveform = row.captureKind === "waveform" ? readWaveformFigures(row.result) : null;
    const verdicts: VerdictRow[] = measurementRows
      .filter((measurement) => measurement.analysisId === row.analysisId)
      .map(embedMeasurement)
      .flatMap((measurement) => (measurement.verdict ? [{ quantity: measurement.quantity, unit: measurement.unit, verdict: measurement.verdict }] : []));
    // An analysis stored before its verdicts became measurement rows still carries the power-input verdict itself.
    if (verdicts.length === 0 && waveform?.verdict) {
      verdicts.push({ quantity: measurementKindInfo.power_input_full_demand.label, unit: "W", verdict: waveform.verdict });
    }
    analysesByLabel[row.label] = {
      label: row.label,
      analysisId: row.analysisId,
      captureKind: row.captureKind,
      captureFileName: row.captureFileName,
      status: row.status,
      analysisVersion: row.analysisVersion,
      run: { id: row.runId, testedOn: row.testedOn, labName: row.labName },
      tool: { slug: row.toolSlug, name: row.toolName },
      waveform,
      heatUp: row.captureKind === "heat_up_log" ? readHeatUpFigures(row.result) : null,
      displaySeries: row.displaySeries,
      verdicts,
    };
  }

  const runToolById = new Map(cited.map((row) => [row.runId, row.toolId]));
  return {
    analyses: analysesByLabel,
    images: Object.fromEntries(
      imageRows.map((image) => [image.name, { name: image.name, src: `/api/report-images/${image.id}`, altText: image.altText, width: image.width, height: image.height }]),
    ),
    tools: toolRows.map(({ id, slug, name, ...ratings }) => ({
      slug,
      name,
      ratings,
      measurements: measurementRows.filter((measurement) => runToolById.get(measurement.runId) === id).map(embedMeasurement),
    })),
  };
}

// Published results as rows: one per measurement a published revision froze, with the tool, the verdict's numbers and
// the run's conditions beside it, so tool pages, comparisons and downloads read the same figures the report shows.
// Pure: it reads only the frozen content, never live runs, so a number cannot change after approval.

import { z } from "zod";
import type { DisplaySeries, FrozenReportContent, FrozenRun, MeasurementKind, ReportStatus, RevisionKind, RunConditions } from "@/db/schema";
import { measurementKindInfo, measurementKinds } from "@/lib/measurement-kinds";
import {
  readHeatUpFigures,
  readWaveformFigures,
  storedVerdictSchema,
  type EmbedAnalysis,
  type HeatUpFigures,
  type StoredVerdict,
  type WaveformFigures,
} from "@/lib/report-embeds";

/** The report a result belongs to, as readers see it now: its current published revision and whether it was retracted. */
export type PublishedReportRef = {
  slug: string;
  title: string;
  status: Extract<ReportStatus, "published" | "retracted">;
  retracted: boolean;
  retractionReason: string | null;
  revisionId: string;
  revisionNumber: number;
  revisionKind: RevisionKind;
  /** ISO 8601, so rows survive a cache that hands back JSON. */
  publishedAt: string;
};

/** One published revision with what its readers see of the report around it. */
export type PublishedRevisionSource<Content = FrozenReportContent> = {
  report: { slug: string; status: PublishedReportRef["status"]; retractionReason: string | null };
  revision: { id: string; number: number; kind: RevisionKind; publishedAt: string };
  content: Content;
};

/**
 * What the result rows need of the frozen content: no analysis results, display series or instrument snapshots, which
 * are nearly all of its bytes.
 */
export type FrozenResultContent = Pick<FrozenReportContent, "title" | "tools" | "measurements"> & {
  runs: Omit<FrozenRun, "instruments" | "unit">[];
  analyses: Omit<FrozenReportContent["analyses"][number], "result" | "displaySeries">[];
};

export type PublishedTool = { id: string; slug: string; name: string };

/** The run a result came from: where, when, under which protocol version and conditions. */
export type PublishedRunContext = {
  id: string;
  testedOn: string;
  labName: string;
  protocol: { name: string; version: number };
  conditions: RunConditions;
};

/** A verdict with every number that produced it; normalisation is null where the quantity is not normalised. */
export type PublishedVerdict = Omit<StoredVerdict, "normalized" | "normalizedTo"> & { normalized: number | null; normalizedTo: number | null };

export type PublishedResult = {
  report: PublishedReportRef;
  tool: PublishedTool;
  kind: MeasurementKind;
  quantity: string;
  value: number;
  unit: string;
  /** k = 2; null where the run gave none (a single manual reading without an instrument spec). */
  expandedUncertainty: number | null;
  source: "analysis" | "manual";
  verdict: PublishedVerdict | null;
  run: PublishedRunContext;
  analysis: { id: string; label: string } | null;
};

function reportRef({ report, revision, content }: PublishedRevisionSource<{ title: string }>): PublishedReportRef {
  return {
    slug: report.slug,
    title: content.title,
    status: report.status,
    retracted: report.status === "retracted",
    retractionReason: report.retractionReason,
    revisionId: revision.id,
    revisionNumber: revision.number,
    revisionKind: revision.kind,
    publishedAt: revision.publishedAt,
  };
}

function runContext(run: FrozenResultContent["runs"][number]): PublishedRunContext {
  return { id: run.id, testedOn: run.testedOn, labName: run.labName, protocol: { name: run.protocol.name, version: run.protocol.version }, conditions: run.conditions };
}

function publishedVerdict(value: unknown): PublishedVerdict | null {
  const parsed = storedVerdictSchema.safeParse(value);
  if (!parsed.success) return null;
  return { ...parsed.data, normalized: parsed.data.normalized ?? null, normalizedTo: parsed.data.normalizedTo ?? null };
}

const kindOrder = new Map<MeasurementKind, number>(measurementKinds.map((kind, index) => [kind, index]));

/** Two quantities in the catalogue's order. */
export function compareKinds(a: MeasurementKind, b: MeasurementKind): number {
  return (kindOrder.get(a) ?? 0) - (kindOrder.get(b) ?? 0);
}

/** Quantity in the catalogue's order, retracted results after the standing ones, then the oldest test and revision first. */
export function compareResults(a: PublishedResult, b: PublishedResult): number {
  return (
    compareKinds(a.kind, b.kind) ||
    Number(a.report.retracted) - Number(b.report.retracted) ||
    a.run.testedOn.localeCompare(b.run.testedOn) ||
    a.report.publishedAt.localeCompare(b.report.publishedAt) ||
    a.report.slug.localeCompare(b.report.slug)
  );
}

/**
 * Every measurement of one published revision as a result row, optionally only those of one tool. A measurement's
 * tool is its run's tool, known from the cited analyses of that run (a report freezes only runs it cites).
 */
export function flattenPublishedResults(source: PublishedRevisionSource<FrozenResultContent>, { toolSlug }: { toolSlug?: string } = {}): PublishedResult[] {
  const { content } = source;
  const report = reportRef(source);
  const toolsById = new Map(content.tools.map((tool) => [tool.id, { id: tool.id, slug: tool.slug, name: tool.name }]));
  const toolByRun = new Map<string, PublishedTool>();
  for (const analysis of content.analyses) {
    toolByRun.set(analysis.runId, toolsById.get(analysis.toolId) ?? { id: analysis.toolId, slug: analysis.toolSlug, name: analysis.toolName });
  }
  const runsById = new Map(content.runs.map((run) => [run.id, runContext(run)]));
  const labelByAnalysis = new Map(content.analyses.map((analysis) => [analysis.analysisId, analysis.label]));

  return content.measurements
    .flatMap((measurement): PublishedResult[] => {
      const tool = toolByRun.get(measurement.runId);
      const run = runsById.get(measurement.runId);
      if (!tool || !run || (toolSlug !== undefined && tool.slug !== toolSlug)) return [];
      const label = measurement.analysisId ? labelByAnalysis.get(measurement.analysisId) : undefined;
      return [
        {
          report,
          tool,
          kind: measurement.kind,
          quantity: measurementKindInfo[measurement.kind].label,
          value: measurement.value,
          unit: measurement.unit,
          expandedUncertainty: measurement.expandedUncertainty,
          source: measurement.source,
          verdict: publishedVerdict(measurement.verdict),
          run,
          analysis: measurement.analysisId && label !== undefined ? { id: measurement.analysisId, label } : null,
        },
      ];
    })
    .sort(compareResults);
}

export type ResultGroup = { kind: MeasurementKind; quantity: string; results: PublishedResult[] };

/** Results by quantity, quantities in the catalogue's order; the rows keep their order within a group. */
export function groupResultsByQuantity(results: readonly PublishedResult[]): ResultGroup[] {
  const groups = new Map<MeasurementKind, ResultGroup>();
  for (const result of [...results].sort(compareResults)) {
    const group = groups.get(result.kind) ?? { kind: result.kind, quantity: result.quantity, results: [] };
    group.results.push(result);
    groups.set(result.kind, group);
  }
  return [...groups.values()];
}

// The flicker estimate as lib/bench/analysis stores it on a waveform result (IEC 61000-3-3 figures on a simulated
// supply impedance), read through a schema of the fields pages show, as lib/report-embeds reads the other figures.
const flickerFiguresSchema = z.object({
  pst: z.number(),
  pstLimit: z.number(),
  dcPercent: z.number(),
  dcLimitPercent: z.number(),
  dmaxPercent: z.number(),
  dmaxLimitPercent: z.number(),
  tmaxSeconds: z.number(),
  tmaxLimitSeconds: z.number(),
  changesPerMinute: z.number(),
  impedance: z.object({ resistanceOhm: z.number(), reactanceOhm: z.number(), source: z.string() }),
  analytical: z.object({ pst: z.number(), valid: z.boolean(), note: z.string() }).nullable(),
  assumptions: z.array(z.string()),
});

export type FlickerFigures = z.infer<typeof flickerFiguresSchema>;

/** The flicker estimate of a waveform result, or why there is none (the bench code's reason, or "not stored"). */
export function readFlickerFigures(result: unknown): { figures: FlickerFigures; unavailableReason: null } | { figures: null; unavailableReason: string } {
  const stored = result as { flicker?: unknown; flickerUnavailableReason?: unknown } | null;
  const parsed = flickerFiguresSchema.safeParse(stored?.flicker);
  if (parsed.success) return { figures: parsed.data, unavailableReason: null };
  const reason = stored?.flickerUnavailableReason;
  return { figures: null, unavailableReason: typeof reason === "string" && reason ? reason : "No flicker estimate was stored with this analysis." };
}

/** A cited analysis of a published revision with its figures parsed and its display series for charts. */
export type PublishedAnalysis = {
  report: PublishedReportRef;
  tool: PublishedTool;
  analysisId: string;
  label: string;
  captureKind: EmbedAnalysis["captureKind"];
  captureFileName: string;
  analysisVersion: string | null;
  run: PublishedRunContext | null;
  waveform: WaveformFigures | null;
  heatUp: HeatUpFigures | null;
  flicker: FlickerFigures | null;
  flickerUnavailableReason: string | null;
  displaySeries: DisplaySeries | null;
};

/** Every finished analysis a published revision cites, optionally only those of one tool, oldest test first. */
export function listPublishedAnalyses(source: PublishedRevisionSource, { toolSlug }: { toolSlug?: string } = {}): PublishedAnalysis[] {
  const { content } = source;
  const report = reportRef(source);
  const runsById = new Map(content.runs.map((run) => [run.id, runContext(run)]));
  return content.analyses
    .filter((analysis) => analysis.status === "done" && (toolSlug === undefined || analysis.toolSlug === toolSlug))
    .map((analysis): PublishedAnalysis => {
      const waveform = analysis.captureKind === "waveform" ? readWaveformFigures(analysis.result) : null;
      const flicker = analysis.captureKind === "waveform" ? readFlickerFigures(analysis.result) : { figures: null, unavailableReason: null };
      return {
        report,
        tool: { id: analysis.toolId, slug: analysis.toolSlug, name: analysis.toolName },
        analysisId: analysis.analysisId,
        label: analysis.label,
        captureKind: analysis.captureKind,
        captureFileName: analysis.captureFileName,
        analysisVersion: analysis.analysisVersion,
        run: runsById.get(analysis.runId) ?? null,
        waveform,
        heatUp: analysis.captureKind === "heat_up_log" ? readHeatUpFigures(analysis.result) : null,
        flicker: flicker.figures,
        flickerUnavailableReason: flicker.unavailableReason,
        displaySeries: analysis.displaySeries,
      };
    })
    .sort((a, b) => (a.run?.testedOn ?? "").localeCompare(b.run?.testedOn ?? "") || a.label.localeCompare(b.label));
}

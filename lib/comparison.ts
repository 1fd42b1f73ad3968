// Which of a tool's published results the compare page shows, and how the two tools' rows line up. Pure: it works on
// the rows lib/published-results makes from frozen revisions, so a comparison never reads a live run or draft.

import type { MeasurementKind } from "@/db/schema";
import type { ComparedRun } from "@/lib/comparability";
import { compareKinds, type PublishedAnalysis, type PublishedReportRef, type PublishedResult, type PublishedRunContext } from "@/lib/published-results";

export type RetractedSource = { report: PublishedReportRef; results: number };

export type ComparisonSide = {
  /** One result per quantity: the newest test's, from reports that stand. */
  results: PublishedResult[];
  /** The newest waveform and heat-up analyses among the reports that stand. */
  waveform: PublishedAnalysis | null;
  heatUp: PublishedAnalysis | null;
  /** Retracted reports whose results were left out, with how many. */
  retracted: RetractedSource[];
  /** The runs behind everything shown, each once, for the comparability check. */
  runs: PublishedRunContext[];
};

type Dated = { run: PublishedRunContext | null; report: PublishedReportRef };

/** Newer first: the later test, then the later publication; a result with a verdict, then one from a capture, wins a tie. */
function newerFirst(a: Dated, b: Dated): number {
  return (b.run?.testedOn ?? "").localeCompare(a.run?.testedOn ?? "") || b.report.publishedAt.localeCompare(a.report.publishedAt);
}

function resultPreference(a: PublishedResult, b: PublishedResult): number {
  return newerFirst(a, b) || Number(b.verdict !== null) - Number(a.verdict !== null) || Number(b.source === "analysis") - Number(a.source === "analysis");
}

function newestAnalysis(analyses: readonly PublishedAnalysis[], usable: (analysis: PublishedAnalysis) => boolean): PublishedAnalysis | null {
  return [...analyses].filter(usable).sort(newerFirst)[0] ?? null;
}

/** What the compare page shows of one tool, chosen from every published result and cited analysis of it. */
export function chooseComparisonSide({ results, analyses }: { results: readonly PublishedResult[]; analyses: readonly PublishedAnalysis[] }): ComparisonSide {
  const standing = results.filter((result) => !result.report.retracted);
  const newest = new Map<MeasurementKind, PublishedResult>();
  for (const result of [...standing].sort(resultPreference)) if (!newest.has(result.kind)) newest.set(result.kind, result);
  const shown = [...newest.values()].sort((a, b) => compareKinds(a.kind, b.kind));

  const standingAnalyses = analyses.filter((analysis) => !analysis.report.retracted);
  const waveform = newestAnalysis(standingAnalyses, (analysis) => analysis.waveform !== null);
  const heatUp = newestAnalysis(standingAnalyses, (analysis) => analysis.heatUp !== null && analysis.displaySeries?.heatUp !== undefined);

  const retracted = new Map<string, RetractedSource>();
  for (const result of results) {
    if (!result.report.retracted) continue;
    const entry = retracted.get(result.report.slug) ?? { report: result.report, results: 0 };
    entry.results += 1;
    retracted.set(result.report.slug, entry);
  }

  const runs = new Map<string, PublishedRunContext>();
  for (const source of [...shown, waveform, heatUp]) if (source?.run) runs.set(source.run.id, source.run);
  return { results: shown, waveform, heatUp, retracted: [...retracted.values()], runs: [...runs.values()] };
}

export type QuantityPair = { kind: MeasurementKind; quantity: string; unit: string; a: PublishedResult | null; b: PublishedResult | null };

/** Every quantity either tool has a result for, in the catalogue's order, with each tool's result or null. */
export function pairQuantities(a: readonly PublishedResult[], b: readonly PublishedResult[]): QuantityPair[] {
  const kinds = [...new Set([...a, ...b].map((result) => result.kind))].sort(compareKinds);
  return kinds.map((kind) => {
    const left = a.find((result) => result.kind === kind) ?? null;
    const right = b.find((result) => result.kind === kind) ?? null;
    const either = (left ?? right)!;
    return { kind, quantity: either.quantity, unit: either.unit, a: left, b: right };
  });
}

/** The comparability check's view of a run. */
export function comparedRun(run: PublishedRunContext): ComparedRun {
  return { protocol: run.protocol, conditions: run.conditions };
}

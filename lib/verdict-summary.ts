import { storedVerdictSchema, type VerdictResult } from "@/lib/report-embeds";

export type VerdictCount = { result: VerdictResult; count: number };

const verdictResults = storedVerdictSchema.shape.result.options;

/**
 * How a report's verdicts came out, one count per result in a fixed order (results that did not occur left out).
 * Takes plain strings because they come out of stored JSON; anything that is not a verdict result is ignored.
 */
export function countVerdicts(results: readonly unknown[]): VerdictCount[] {
  return verdictResults
    .map((result) => ({ result, count: results.filter((candidate) => candidate === result).length }))
    .filter(({ count }) => count > 0);
}

/** "meets rating 2, above rating 1": the counts as one line, for a feed summary or beside badges. */
export function describeVerdicts(counts: readonly VerdictCount[]): string {
  if (counts.length === 0) return "no rating judged";
  return counts.map(({ result, count }) => `${result} ${count}`).join(", ");
}

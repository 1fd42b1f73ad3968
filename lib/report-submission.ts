import { checkEmbedReferences, compileSafeMdx } from "@/lib/mdx/compile";
import type { TestedUnit } from "@/db/schema";

// What stops a report going to the desk, in the words the reviewer sees beside the Submit button.

export type ReportReferenceNames = { analysisLabels: string[]; imageNames: string[]; toolSlugs: string[] };

export function submissionProblems({
  bodyMdx,
  known,
  imagesWithoutAltText,
}: {
  bodyMdx: string;
  known: ReportReferenceNames;
  imagesWithoutAltText: readonly string[];
}): string[] {
  const problems: string[] = [];
  if (known.analysisLabels.length === 0) problems.push("Cite at least one finished analysis: a report stands on measured data.");
  if (bodyMdx.trim() === "") problems.push("Write the body of the report.");
  else {
    const compiled = compileSafeMdx(bodyMdx);
    const all = [...compiled.problems, ...checkEmbedReferences(compiled.references, known)];
    for (const problem of all.slice(0, 10)) {
      problems.push(`${problem.line === null ? "Body" : `Body, line ${problem.line}, column ${problem.column}`}: ${problem.message}`);
    }
    if (all.length > 10) problems.push(`…and ${all.length - 10} more problems in the body; the preview lists them all.`);
  }
  for (const name of imagesWithoutAltText) problems.push(`Image “${name}” has no alt text: describe it for readers who cannot see it.`);
  return problems;
}

const sourceWords: Record<TestedUnit["source"], string> = {
  bought: "bought at retail by the reviewer",
  loaned: "on loan",
  given: "given to the reviewer",
};

/** A first draft of the disclosure from how each cited unit was obtained; the reviewer adds any tie to the maker. */
export function suggestDisclosure(units: readonly { toolName: string; unit: TestedUnit }[]): string {
  const seen = new Set<string>();
  const lines: string[] = [];
  for (const { toolName, unit } of units) {
    const key = `${toolName}|${unit.serialNumber}`;
    if (seen.has(key)) continue;
    seen.add(key);
    lines.push(`${toolName}, serial ${unit.serialNumber}: ${sourceWords[unit.source]}${unit.sourceNote ? ` (${unit.sourceNote})` : ""}.`);
  }
  return lines.join("\n");
}

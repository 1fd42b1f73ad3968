import type { ReactNode } from "react";
import { MdxProblemNote } from "@/components/mdx/mdx-problem-note";
import { compileSafeMdx, type MdxProblem } from "./compile";
import { embedComponentSpecs, type EmbedName } from "./policy";
import { renderSafeTree, type EmbedComponents } from "./render-tree";

// Outside a report (protocol steps, help pages) there is no cited analysis to draw from.
const embedsOutsideReports = Object.fromEntries(
  Object.keys(embedComponentSpecs).map((name) => [
    name,
    function EmbedOutsideReport() {
      return <MdxProblemNote message={`<${name}> shows a report's cited data, so it works only inside a report.`} />;
    },
  ]),
) as Record<EmbedName, () => ReactNode>;

/**
 * Reviewer MDX for a server component: compiled by the sanitising pipeline and rendered with our components bound to
 * `embeds` (see components/report-embeds). A source that does not parse renders as its error, with line and column.
 */
export function renderSafeMdx(source: string, options: { embeds?: EmbedComponents } = {}): { content: ReactNode; problems: MdxProblem[] } {
  const { tree, problems } = compileSafeMdx(source);
  if (!tree) {
    return {
      content: problems.map((problem, index) => (
        <MdxProblemNote key={index} message={`This text could not be read${problem.line === null ? "" : ` at line ${problem.line}, column ${problem.column}`}: ${problem.message}`} />
      )),
      problems,
    };
  }
  return { content: renderSafeTree(tree, options.embeds ?? embedsOutsideReports), problems };
}

import { readFile } from "node:fs/promises";
import { createRequire } from "node:module";
import type { Page } from "playwright-core";
import type { AxeResults, ImpactValue, RunOptions } from "axe-core";

// The standards reader pages are held to: WCAG 2.0 and 2.1, levels A and AA.
export const wcagTags = ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"];

const blockingImpacts: ImpactValue[] = ["serious", "critical"];

export type AxeViolation = { id: string; impact: ImpactValue | null | undefined; help: string; targets: string[] };

let axeSource: Promise<string> | undefined;

// Read from the package rather than imported: axe-core's entry expects a window when it is evaluated in Node.
function loadAxeSource(): Promise<string> {
  axeSource ??= readFile(createRequire(import.meta.url).resolve("axe-core/axe.min.js"), "utf8");
  return axeSource;
}

/** Runs axe-core inside the page as it stands (after any client rendering) and returns every violation found. */
export async function findAxeViolations(page: Page): Promise<AxeViolation[]> {
  const alreadyLoaded = await page.evaluate(() => "axe" in window);
  if (!alreadyLoaded) await page.addScriptTag({ content: await loadAxeSource() });
  const options: RunOptions = { runOnly: { type: "tag", values: wcagTags }, resultTypes: ["violations"] };
  const results = await page.evaluate(
    (runOptions) => (window as unknown as { axe: { run: (context: Document, options: RunOptions) => Promise<AxeResults> } }).axe.run(document, runOptions),
    options,
  );
  return results.violations.map((violation) => ({
    id: violation.id,
    impact: violation.impact,
    help: violation.help,
    targets: violation.nodes.map((node) => node.target.join(" ")),
  }));
}

export function describeViolations(violations: AxeViolation[]): string {
  return violations.map((violation) => `${violation.impact} ${violation.id}: ${violation.help}\n    ${violation.targets.join("\n    ")}`).join("\n");
}

/** Fails with each serious or critical violation and the elements it was found on; minor and moderate ones pass. */
export async function expectNoSeriousAxeViolations(page: Page, where: string): Promise<void> {
  const blocking = (await findAxeViolations(page)).filter((violation) => violation.impact && blockingImpacts.includes(violation.impact));
  if (blocking.length > 0) throw new Error(`axe-core found ${blocking.length} serious or critical violation(s) on ${where}:\n${describeViolations(blocking)}`);
}
